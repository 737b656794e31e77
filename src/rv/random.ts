/**
 * A small seeded pseudo-random generator for simulations (injection–recovery, Monte Carlo
 * false-alarm checks). The same seed gives the same sequence on every machine.
 *
 * - Generator: xoshiro128** (Blackman & Vigna 2021, "Scrambled linear pseudorandom number
 *   generators", ACM TOMS 47, 36), 128 bits of state, period 2^128 − 1, 32-bit outputs.
 * - Seeding: the 128-bit state is filled with four outputs of mulberry32 (T. Ettinger 2017,
 *   public domain; a 32-bit counter passed through a multiply–xorshift mix), so that any
 *   integer seed, 0 included, gives a non-zero state.
 * - Uniform deviates in [0, 1) carry 53 random bits (two 32-bit outputs).
 * - Normal deviates: the Box–Muller transform (Box & Muller 1958, Ann. Math. Stat. 29, 610),
 *   which yields two independent N(0, 1) deviates per pair of uniforms; the second is kept
 *   for the next call.
 */
export interface Rng {
  /** Uniform deviate in [0, 1). */
  uniform(): number;
  /** Standard normal deviate, N(0, 1). */
  normal(): number;
  /** Raw 32-bit unsigned output. */
  nextUint32(): number;
}

/** One step of mulberry32 on the state `a`; returns the new state and the 32-bit output. */
function mulberry32Step(a: number): [state: number, output: number] {
  const state = (a + 0x6d2b79f5) | 0;
  let t = Math.imul(state ^ (state >>> 15), state | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return [state, (t ^ (t >>> 14)) >>> 0];
}

/**
 * A seed for an independent sub-stream, e.g. one cell of a map: the same (seed, index) always
 * gives the same stream whatever order or thread the cells run in. Mixes index with the golden-
 * ratio increment 0x9e3779b9 (common practice) and one mulberry32 step.
 */
export function deriveSeed(seed: number, index: number): number {
  return mulberry32Step((seed ^ Math.imul(index + 1, 0x9e3779b9)) | 0)[1];
}

/** A seeded xoshiro128** generator with uniform and normal deviates (see the file comment). */
export function createRng(seed: number): Rng {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
  let m = Math.trunc(seed) | 0;
  const s = new Uint32Array(4);
  for (let i = 0; i < 4; i++) [m, s[i]] = mulberry32Step(m);
  return rngFromState(s);
}

/** The generator started from a given 128-bit state (four 32-bit words, not all zero), e.g. a published test state. */
export function rngFromState(state: ArrayLike<number>): Rng {
  const s = Uint32Array.from(state);
  if (s.length !== 4 || s.every((w) => w === 0)) throw new RangeError('the state must be four 32-bit words, not all zero');
  let spare: number | null = null;

  const nextUint32 = (): number => {
    // xoshiro128**: result = rotl(s1 · 5, 7) · 9, then the linear state update.
    const s0 = s[0]!,
      s1 = s[1]!,
      s2 = s[2]!,
      s3 = s[3]!;
    const x = Math.imul(s1, 5);
    const result = Math.imul((x << 7) | (x >>> 25), 9) >>> 0;
    const t = s1 << 9;
    const n2 = s2 ^ s0;
    const n3 = s3 ^ s1;
    s[1] = s1 ^ n2;
    s[0] = s0 ^ n3;
    s[2] = n2 ^ t;
    s[3] = (n3 << 11) | (n3 >>> 21);
    return result;
  };

  const uniform = (): number => {
    // 27 + 26 = 53 bits: the full mantissa of a double (common practice).
    const hi = nextUint32() >>> 5;
    const lo = nextUint32() >>> 6;
    return (hi * 67108864 + lo) / 9007199254740992;
  };

  const normal = (): number => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    // Box & Muller 1958: r = √(−2 ln u1), θ = 2π u2; z0 = r cos θ, z1 = r sin θ. 1 − u keeps u1 in (0, 1].
    const r = Math.sqrt(-2 * Math.log(1 - uniform()));
    const theta = 2 * Math.PI * uniform();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };

  return { uniform, normal, nextUint32 };
}
