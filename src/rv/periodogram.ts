import type { FrequencyGrid } from './frequency-grid.js';
import { validationError } from '../errors.js';

/**
 * Generalised Lomb–Scargle periodogram (Zechmeister & Kürster 2009, A&A 496, 577; "ZK09"):
 * a weighted least-squares fit of y = a cos ωt + b sin ωt + c at each frequency, weights
 * w_i = (1/σ_i²) / Σ 1/σ_j². The normalised power (ZK09 sect. 2):
 *   p(ω) = (SS·YC² + CC·YS² − 2·CS·YC·YS) / (YY·D),  D = CC·SS − CS²,
 * with the weighted sums centred on the weighted means:
 *   YY = Σw y² − Y², YC = Σw y cos − Y·C, YS = Σw y sin − Y·S,
 *   CC = Σw cos² − C², SS = Σw sin² − S², CS = Σw cos sin − C·S,  Y = Σw y, C = Σw cos, S = Σw sin.
 * p = (χ²₀ − χ²(ω)) / χ²₀ lies in [0, 1]: the fraction of the weighted scatter about the mean
 * that the sinusoid removes. With the offset fixed at zero (c = 0) the same formula holds with
 * Y = C = S = 0, which is the classical Lomb–Scargle of Lomb 1976 and Scargle 1982 (ZK09 sect. 2).
 */
export type OffsetModel = 'floating' | 'fixed-zero';

/** Periodogram power on a fixed grid for any values observed at fixed times and σ. */
export interface GlsKernel {
  readonly grid: FrequencyGrid;
  /** Number of points. */
  readonly n: number;
  /** Normalised power at every grid frequency for `valuesMps` (same order as the times). */
  power(valuesMps: ArrayLike<number>, out?: Float64Array): Float64Array;
}

function normalisedWeights(rvErrorsMps: ArrayLike<number>): Float64Array {
  const w = new Float64Array(rvErrorsMps.length);
  let sum = 0;
  for (let i = 0; i < w.length; i++) {
    const s = rvErrorsMps[i]!;
    w[i] = 1 / (s * s);
    // 1/sigma^2 overflows below about 1e-154: such weights would make every sum NaN.
    if (!(s > 0) || !Number.isFinite(w[i]!)) throw validationError(`rvErrorsMps[${i}]`, s, 'a positive, finite uncertainty of at least 1e-150');
    sum += w[i]!;
  }
  for (let i = 0; i < w.length; i++) w[i]! /= sum;
  return w;
}

/** Weighted mean of the times: the time origin (GLS does not depend on it; it keeps ωt small). */
function weightedMean(values: ArrayLike<number>, w: Float64Array): number {
  let m = 0;
  for (let i = 0; i < w.length; i++) m += w[i]! * values[i]!;
  return m;
}

/**
 * Prepares the periodogram of a set of times and σ on a grid: the sums that do not depend on the
 * values (C, S, CC, SS, CS) are computed once, so each call of `power` costs one pass of
 * N·F multiply–adds. cos and sin along the uniform grid come from the rotation recurrence
 * cos(θ + δ) = cos θ cos δ − sin θ sin δ, sin(θ + δ) = sin θ cos δ + cos θ sin δ (common practice);
 * its rounding error grows by about 1e-16 per step.
 */
export function glsKernel(timesDays: ArrayLike<number>, rvErrorsMps: ArrayLike<number>, grid: FrequencyGrid, offset: OffsetModel = 'floating'): GlsKernel {
  const n = timesDays.length;
  if (rvErrorsMps.length !== n) throw new RangeError(`times and sigma differ in length: ${n} and ${rvErrorsMps.length}`);
  const w = normalisedWeights(rvErrorsMps);
  const tRef = weightedMean(timesDays, w);
  const f = grid.count;
  const cos0 = new Float64Array(n),
    sin0 = new Float64Array(n),
    cosStep = new Float64Array(n),
    sinStep = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const dt = timesDays[i]! - tRef;
    cos0[i] = Math.cos(2 * Math.PI * grid.startPerDay * dt);
    sin0[i] = Math.sin(2 * Math.PI * grid.startPerDay * dt);
    cosStep[i] = Math.cos(2 * Math.PI * grid.stepPerDay * dt);
    sinStep[i] = Math.sin(2 * Math.PI * grid.stepPerDay * dt);
  }

  // Value-free sums per frequency.
  const C = new Float64Array(f),
    S = new Float64Array(f),
    CC = new Float64Array(f),
    SS = new Float64Array(f),
    CS = new Float64Array(f);
  for (let i = 0; i < n; i++) {
    const wi = w[i]!,
      a = cosStep[i]!,
      b = sinStep[i]!;
    let c = cos0[i]!,
      s = sin0[i]!;
    for (let k = 0; k < f; k++) {
      C[k]! += wi * c;
      S[k]! += wi * s;
      CC[k]! += wi * c * c;
      SS[k]! += wi * s * s;
      CS[k]! += wi * c * s;
      const cNext = c * a - s * b;
      s = s * a + c * b;
      c = cNext;
    }
  }
  const floating = offset === 'floating';
  const D = new Float64Array(f);
  for (let k = 0; k < f; k++) {
    if (floating) {
      CC[k]! -= C[k]! * C[k]!;
      SS[k]! -= S[k]! * S[k]!;
      CS[k]! -= C[k]! * S[k]!;
    }
    D[k] = CC[k]! * SS[k]! - CS[k]! * CS[k]!;
  }

  const wy = new Float64Array(n);
  const YC = new Float64Array(f),
    YS = new Float64Array(f);
  return {
    grid,
    n,
    power(valuesMps, out = new Float64Array(f)) {
      if (valuesMps.length !== n) throw new RangeError(`expected ${n} values, got ${valuesMps.length}`);
      const yMean = floating ? weightedMean(valuesMps, w) : 0;
      let yy = 0;
      for (let i = 0; i < n; i++) {
        const d = valuesMps[i]! - yMean;
        wy[i] = w[i]! * d;
        yy += w[i]! * d * d;
      }
      // Centring y centres YC and YS too: Σ w (y − Y) cos = Σ w y cos − Y·C.
      YC.fill(0);
      YS.fill(0);
      for (let i = 0; i < n; i++) {
        const wyi = wy[i]!,
          a = cosStep[i]!,
          b = sinStep[i]!;
        let c = cos0[i]!,
          s = sin0[i]!;
        for (let k = 0; k < f; k++) {
          YC[k]! += wyi * c;
          YS[k]! += wyi * s;
          const cNext = c * a - s * b;
          s = s * a + c * b;
          c = cNext;
        }
      }
      for (let k = 0; k < f; k++) {
        const yc = YC[k]!,
          ys = YS[k]!,
          d = D[k]!;
        const p = (SS[k]! * yc * yc + CC[k]! * ys * ys - 2 * CS[k]! * yc * ys) / (yy * d);
        // A degenerate frequency (D ≈ 0, e.g. sampling that cannot tell cos from sin) or constant data: no power.
        out[k] = Number.isFinite(p) && d > 0 ? Math.min(1, Math.max(0, p)) : 0;
      }
      return out;
    },
  };
}

/** The GLS power of one series on a grid (a kernel used once). */
export function glsPeriodogram(
  timesDays: ArrayLike<number>,
  valuesMps: ArrayLike<number>,
  rvErrorsMps: ArrayLike<number>,
  grid: FrequencyGrid,
  offset: OffsetModel = 'floating',
): Float64Array {
  return glsKernel(timesDays, rvErrorsMps, grid, offset).power(valuesMps);
}

/** The best-fitting sinusoid at one frequency and its normalised power. */
export interface SinusoidFit {
  freqPerDay: number;
  power: number;
  /** Semi-amplitude √(a² + b²) of the fitted sinusoid, m/s. */
  amplitudeMps: number;
  /** Fitted constant c, m/s. */
  offsetMps: number;
  /** A time (BJD, days) of maximum fitted velocity. */
  timeOfMaxBjdTdb: number;
}

/**
 * GLS at one frequency by direct trigonometry, with the fitted sinusoid. Amplitudes from the
 * normal equations of the same fit (ZK09 sect. 2): a = (YC·SS − YS·CS)/D, b = (YS·CC − YC·CS)/D,
 * c = Y − a·C − b·S.
 */
export function glsAt(timesDays: ArrayLike<number>, valuesMps: ArrayLike<number>, rvErrorsMps: ArrayLike<number>, freqPerDay: number): SinusoidFit {
  const n = timesDays.length;
  const w = normalisedWeights(rvErrorsMps);
  const tRef = weightedMean(timesDays, w);
  let Y = 0,
    C = 0,
    S = 0,
    YYh = 0,
    YCh = 0,
    YSh = 0,
    CCh = 0,
    SSh = 0,
    CSh = 0;
  for (let i = 0; i < n; i++) {
    const phase = 2 * Math.PI * freqPerDay * (timesDays[i]! - tRef);
    const c = Math.cos(phase),
      s = Math.sin(phase),
      y = valuesMps[i]!,
      wi = w[i]!;
    Y += wi * y;
    C += wi * c;
    S += wi * s;
    YYh += wi * y * y;
    YCh += wi * y * c;
    YSh += wi * y * s;
    CCh += wi * c * c;
    SSh += wi * s * s;
    CSh += wi * c * s;
  }
  const YY = YYh - Y * Y,
    YC = YCh - Y * C,
    YS = YSh - Y * S;
  const CC = CCh - C * C,
    SS = SSh - S * S,
    CS = CSh - C * S;
  const D = CC * SS - CS * CS;
  const a = (YC * SS - YS * CS) / D;
  const b = (YS * CC - YC * CS) / D;
  const p = (SS * YC * YC + CC * YS * YS - 2 * CS * YC * YS) / (YY * D);
  // a cos φ + b sin φ peaks at φ = atan2(b, a).
  const timeOfMax = tRef + Math.atan2(b, a) / (2 * Math.PI * freqPerDay);
  return {
    freqPerDay,
    power: Number.isFinite(p) && D > 0 ? Math.min(1, Math.max(0, p)) : 0,
    amplitudeMps: Math.hypot(a, b),
    offsetMps: Y - a * C - b * S,
    timeOfMaxBjdTdb: timeOfMax,
  };
}
