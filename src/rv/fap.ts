import type { FrequencyGrid } from './frequency-grid.js';

/**
 * False-alarm probabilities of a GLS peak of normalised power p (ZK09 normalisation, see
 * periodogram.ts) for N points with Gaussian noise, a floating offset and a sinusoid:
 * the null model has d_H = 1 free parameter, the alternative d_K = 3.
 */
export interface FapContext {
  /** Number of points N. */
  n: number;
  /** Width of the searched band f_max − f_min, cycles/day. */
  bandPerDay: number;
  /** Baseline T, days. */
  baselineDays: number;
  /** Baluev's effective time span T_eff = √(4π D_t), D_t the weighted variance of the times, days. */
  effectiveSpanDays: number;
}

/** The FAP context of a series searched on a grid (weights 1/σ² as in the periodogram). */
export function fapContext(timesDays: ArrayLike<number>, rvErrorsMps: ArrayLike<number>, grid: FrequencyGrid): FapContext {
  const n = timesDays.length;
  if (n < 4) throw new RangeError(`a false-alarm probability needs at least 4 points, got ${n}`);
  let sw = 0,
    st = 0;
  for (let i = 0; i < n; i++) {
    const w = 1 / (rvErrorsMps[i]! * rvErrorsMps[i]!);
    sw += w;
    st += w * timesDays[i]!;
  }
  const mean = st / sw;
  let dt = 0;
  for (let i = 0; i < n; i++) dt += (timesDays[i]! - mean) ** 2 / (rvErrorsMps[i]! * rvErrorsMps[i]!);
  const weightedVarDays2 = dt / sw;
  const fMax = grid.startPerDay + (grid.count - 1) * grid.stepPerDay;
  return {
    n,
    bandPerDay: fMax - grid.startPerDay,
    baselineDays: grid.baselineDays,
    effectiveSpanDays: Math.sqrt(4 * Math.PI * weightedVarDays2),
  };
}

/**
 * Probability that pure noise gives power above p at ONE chosen frequency:
 * Prob(p > p0) = (1 − p0)^((N − 3)/2) (ZK09).
 */
export function fapSingle(power: number, n: number): number {
  return (1 - clampPower(power)) ** ((n - 3) / 2);
}

/**
 * Over the band, from the number of independent frequencies M:
 * FAP = 1 − (1 − Prob(p > p0))^M, with M ≈ (f_max − f_min) · T (ZK09, after Cumming 2004,
 * MNRAS 354, 1165). A rough estimate, kept beside Baluev's for comparison.
 */
export function fapIndependent(power: number, ctx: FapContext): number {
  const m = Math.max(1, ctx.bandPerDay * ctx.baselineDays);
  const single = fapSingle(power, ctx.n);
  // 1 − (1 − x)^M written as −expm1(M · log1p(−x)) to keep small FAPs exact.
  return -Math.expm1(m * Math.log1p(-single));
}

/**
 * Over the band, Baluev 2008 (MNRAS 385, 1279), the alias-free approximation built on the Davies
 * bound, for his normalised periodogram relative to the null model (z = N_H·p/2 in our p):
 *   FAP ≈ 1 − (1 − Prob_single(p)) · exp(−τ(p)),
 *   τ(p) = γ_H · W · (1 − p)^((N_K − 1)/2) · √(N_H·p/2),
 *   γ_H = √(2/N_H) · Γ(N_H/2) / Γ((N_H − 1)/2),  W = (f_max − f_min) · T_eff,  T_eff = √(4π D_t),
 * N_H = N − 1, N_K = N − 3, D_t the variance of the times with weights 1/σ². Baluev writes W for a
 * band starting at zero frequency (W = f_max T_eff); the band width is used here because the
 * number of independent peaks grows with it (our choice; the difference is f_min·T_eff, small when
 * f_min = 1/(2T)). It is an upper bound, tight for small FAP.
 */
export function fapBaluev(power: number, ctx: FapContext): number {
  const p = clampPower(power);
  const nH = ctx.n - 1;
  const nK = ctx.n - 3;
  const gammaH = Math.sqrt(2 / nH) * Math.exp(logGamma(nH / 2) - logGamma((nH - 1) / 2));
  const w = ctx.bandPerDay * ctx.effectiveSpanDays;
  const tau = gammaH * w * (1 - p) ** ((nK - 1) / 2) * Math.sqrt((nH * p) / 2);
  const single = fapSingle(p, ctx.n);
  // 1 − (1 − s)e^(−τ) = −expm1(−τ) + s·e^(−τ), exact for small values.
  return Math.min(1, -Math.expm1(-tau) + single * Math.exp(-tau));
}

/**
 * The power p* whose Baluev FAP equals `fap` for N points, band width and T_eff, with γ_H computed
 * once: powerAtFap's Baluev case for hot loops. Newton's method on p (common practice) from
 * `guess` (a nearby solution, e.g. the last one for the same N; 0 for none), kept inside a
 * bracket that bisects whenever a step would leave it, until the step is below 1e-14.
 */
export function baluevPowerAtFap(fap: number, n: number, bandPerDay: number, effectiveSpanDays: number, guess = 0): number {
  const nH = n - 1;
  const nK = n - 3;
  const gammaH = Math.sqrt(2 / nH) * Math.exp(logGamma(nH / 2) - logGamma((nH - 1) / 2));
  const w = bandPerDay * effectiveSpanDays;
  let lo = 0;
  let hi = 1;
  let p = guess > 0 && guess < 1 ? guess : 0.5;
  for (let i = 0; i < 100; i++) {
    // fapBaluev's formula (above): FAP = 1 − e^(−τ) + s e^(−τ), s = (1 − p)^(N_K/2), and its derivative in p,
    // e^(−τ) ((1 − s) τ' + s'), τ' = τ (1/(2p) − (N_K − 1)/(2(1 − p))), s' = −N_K s / (2(1 − p)).
    const logRest = Math.log1p(-p);
    const tau = gammaH * w * Math.exp(((nK - 1) / 2) * logRest) * Math.sqrt((nH * p) / 2);
    const single = Math.exp((nK / 2) * logRest);
    const decay = Math.exp(-tau);
    const value = -Math.expm1(-tau) + single * decay;
    if (value > fap) lo = p;
    else hi = p;
    const slope = decay * ((1 - single) * tau * (0.5 / p - (nK - 1) / (2 * (1 - p))) - (nK * single) / (2 * (1 - p)));
    let next = p - (value - fap) / slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    const step = Math.abs(next - p);
    p = next;
    if (step < 1e-14) break;
  }
  return p;
}

export type FapMethod = 'baluev' | 'independent';

/** FAP of a power by the chosen method. */
export function falseAlarmProbability(power: number, ctx: FapContext, method: FapMethod = 'baluev'): number {
  return method === 'baluev' ? fapBaluev(power, ctx) : fapIndependent(power, ctx);
}

/**
 * The power whose FAP equals `fap` (e.g. the 1% level), by bisection on p in [0, 1]; the FAP falls
 * as p rises over the range where it is below 1.
 */
export function powerAtFap(fap: number, ctx: FapContext, method: FapMethod = 'baluev'): number {
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (falseAlarmProbability(mid, ctx, method) > fap) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

function clampPower(power: number): number {
  return Math.min(1, Math.max(0, power));
}

// Lanczos approximation, g = 7, nine coefficients (Lanczos 1964, SIAM J. Numer. Anal. B1, 86;
// coefficients as tabulated by P. Godfrey, common practice), relative error about 1e-15.
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905, -0.13857109526572012,
  9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** ln Γ(x) for x ≥ 0.5. */
export function logGamma(x: number): number {
  if (!(x >= 0.5)) throw new RangeError(`logGamma is implemented for x >= 0.5, got ${x}`);
  const z = x - 1;
  let a = LANCZOS[0]!;
  for (let i = 1; i < LANCZOS.length; i++) a += LANCZOS[i]! / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}
