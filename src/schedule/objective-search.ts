// A blind search's score: the expected detection completeness of a planet of the search mass,
// period log-uniform over [Pmin, Pmax], circular orbit, phase uniform, by a periodogram at a
// false-alarm probability over the band (default 0.01, as the injection maps, src/rv/injection.ts).
//
// Information: for trial frequency f_k the signal is v = gamma + a sin(w_k t) + b cos(w_k t); with
// weights w_i = 1/sigma_i^2 the information of (gamma, a, b) is M_k = sum w_i x_i x_i^T,
// x_i = (1, sin w_k t_i, cos w_k t_i) (weighted least squares, common practice), plus a ridge of
// eps on the diagonal (one thousandth of the star's median visit weight) so it is never singular.
// The sine/cosine information after the offset is fitted is the 2x2 Schur complement S_k of M_k
// (Horn & Johnson, Matrix Analysis, 0.8.5).
//
// Detection at one frequency: for a planet of semi-amplitude K at phase phi, (a, b) = K (cos phi,
// sin phi) = K u, and the drop in chi^2 when the sinusoid is fitted is a noncentral chi-square with
// 2 degrees of freedom and noncentrality lambda(phi) = K^2 u^T S_k u [Cumming2004]. Writing
// S_k's mean eigenvalue m and half-spread r, lambda = K^2 (m + r cos theta) with theta = 2 phi - psi
// uniform. The GLS power of src/rv/periodogram.ts is p = dchi2 / chi2_0 with chi2_0 = dchi2 + R and
// R ~ chi^2_(N-3) the residual, so the power threshold p* (src/rv/fap.ts powerAtFap, Baluev's FAP
// [Baluev2008] over the band 1/Pmax..1/Pmin with N and T_eff of the visits) is, at R's mean,
//   dchi2 > z* = (N - 3) p* / (1 - p*).
// The detection probability is p_k = mean over theta of Q1(K sqrt(m + r cos theta), sqrt(z*))
// (Marcum's Q, src/rv/marcum-q.ts [Marcum1960]), by the midpoint rule on PHASE_NODES = 2 nodes of
// [0, pi] (measured within 5e-4 of 64 nodes; the look-up table's error is 3e-4). The completeness is the mean over the grid weighted uniform in log P (weight
// proportional to 1/f, as d log P = -d f / f) [Cumming2008]:
//   C = sum_k c_k p_k,  c_k = (1/f_k) / sum (1/f).
// With fewer than MIN_SEARCH_VISITS visits C = 0 (Baluev's FAP needs N >= 4, and below 5 the
// threshold is above any reachable dchi2).
//
// Grid: uniform in frequency from 1/Pmax to 1/Pmin, step 1/(SEARCH_OVERSAMPLE x T), T the span the
// visits can cover (the star's candidate slots and prior visits): a periodogram peak is 1/T wide,
// so the detection probability varies on that scale. Oversampling 5: measured on visit sets of
// 14 to 26 visits over 90 days, C at 5 lies within 0.005 of C at 20 (0.008 at 3, 0.01 at 2). The proxy ignores aliases (the highest peak
// elsewhere), which the injection test loses: see test/schedule/search-completeness.test.ts.
// K(f) = K(P_min) (P/P_min)^(-1/3) for a fixed planet mass, circular, m_p << M_star [K-formula].
import { baluevPowerAtFap } from '../rv/fap.js';
import { marcumQ1InRow, marcumQ1Lookup, marcumQ1Table, marcumRow } from '../rv/marcum-q.js';

/** Grid points per resolution element 1/T of the search grid. */
export const SEARCH_OVERSAMPLE = 5;
/** Midpoint nodes of the phase average. */
export const PHASE_NODES = 2;
/** Fewest visits with a non-zero completeness. */
export const MIN_SEARCH_VISITS = 5;
/** Default band FAP of a detection (src/rv/injection.ts DEFAULT_FAP_THRESHOLD). */
export const SEARCH_FAP = 0.01;

const NODE_COS = Float64Array.from({ length: PHASE_NODES }, (_, i) => Math.cos((Math.PI * (i + 0.5)) / PHASE_NODES));

export interface SearchGrid {
  /** 2 pi f_k, rad/day. */
  angularFreq: Float64Array;
  /** K(f_k)^2, (m/s)^2. */
  kSq: Float64Array;
  /** c_k: log-P weights summing to 1. */
  logPWeight: Float64Array;
  /** Band width, cycles/day. */
  bandPerDay: number;
  /** Band FAP of a detection. */
  fap: number;
  /** Ridge added to the diagonal of M. */
  eps: number;
  /** Time origin of the moments and phases (days): the first time the star's visits can have. */
  epochDays: number;
  /** Campaign span the visits can cover, days. */
  spanDays: number;
  /** Per visit count N (below POWER_GUESSES): the last p* found, the next search's start (searchThreshold); 0 for none. */
  powerGuess: Float64Array;
}

/** Head of a star's running sums: W, sum w tau, sum w tau^2 (tau = t - epoch), visit count; then 5 per frequency. */
const HEAD = 4;
/** Visit counts whose last threshold power is kept as the next one's starting guess. */
const POWER_GUESSES = 512;
/**
 * The phases w_k tau of one visit come from the rotation by (w_1 - w_0) tau, one step per
 * frequency (the grid is uniform in frequency; angle addition, common practice), and afresh from
 * sin and cos every TRIG_RESTART frequencies, so rounding cannot build up past about 1e-14.
 */
const TRIG_RESTART = 32;

export function searchStatsLength(grid: SearchGrid): number {
  return HEAD + 5 * grid.angularFreq.length;
}

export interface SearchGridInput {
  periodMinDays: number;
  periodMaxDays: number;
  /** K at periodMinDays. */
  kMpsAtMin: number;
  /** Ridge of M's diagonal. */
  eps: number;
  /** First and last time the star's visits can have (days). */
  fromDays: number;
  toDays: number;
  fap?: number;
  oversample?: number;
}

/** The fine grid (file comment); one frequency when Pmin = Pmax or the span is nil. */
export function searchGrid(input: SearchGridInput): SearchGrid {
  const { periodMinDays, periodMaxDays, kMpsAtMin } = input;
  const spanDays = Math.max(0, input.toDays - input.fromDays);
  const fLo = 1 / periodMaxDays;
  const fHi = 1 / periodMinDays;
  const step = 1 / ((input.oversample ?? SEARCH_OVERSAMPLE) * spanDays);
  const n = fHi > fLo && spanDays > 0 ? Math.max(2, Math.ceil((fHi - fLo) / step) + 1) : 1;
  const angularFreq = new Float64Array(n);
  const kSq = new Float64Array(n);
  const logPWeight = new Float64Array(n);
  let total = 0;
  for (let k = 0; k < n; k++) {
    const f = n === 1 ? fHi : fLo + ((fHi - fLo) * k) / (n - 1);
    angularFreq[k] = 2 * Math.PI * f;
    kSq[k] = (kMpsAtMin * (periodMinDays * f) ** (1 / 3)) ** 2;
    logPWeight[k] = 1 / f;
    total += 1 / f;
  }
  for (let k = 0; k < n; k++) logPWeight[k]! /= total;
  return {
    angularFreq,
    kSq,
    logPWeight,
    bandPerDay: fHi - fLo,
    fap: input.fap ?? SEARCH_FAP,
    eps: input.eps,
    epochDays: input.fromDays,
    spanDays,
    powerGuess: new Float64Array(POWER_GUESSES),
  };
}

/** Adds (sign 1) or removes (sign -1) a visit of weight w at time tDays. */
export function updateSearchStats(stats: Float64Array, offset: number, grid: SearchGrid, w: number, tDays: number, sign: number): void {
  const sw = sign * w;
  const tau = tDays - grid.epochDays;
  stats[offset] += sw;
  stats[offset + 1] += sw * tau;
  stats[offset + 2] += sw * tau * tau;
  stats[offset + 3] += sign;
  const freq = grid.angularFreq;
  const stepAngle = freq.length > 1 ? (freq[1]! - freq[0]!) * tau : 0;
  const stepSin = Math.sin(stepAngle);
  const stepCos = Math.cos(stepAngle);
  let sn = 0;
  let cs = 1;
  for (let k = 0, o = offset + HEAD; k < freq.length; k++, o += 5) {
    if (k % TRIG_RESTART === 0) {
      sn = Math.sin(freq[k]! * tau);
      cs = Math.cos(freq[k]! * tau);
    }
    stats[o] += sw * sn;
    stats[o + 1] += sw * cs;
    stats[o + 2] += sw * sn * sn;
    stats[o + 3] += sw * sn * cs;
    stats[o + 4] += sw * cs * cs;
    const next = sn * stepCos + cs * stepSin;
    cs = cs * stepCos - sn * stepSin;
    sn = next;
  }
}

/**
 * z* for N visits of total weight W and time moments (file comment); Infinity below MIN_SEARCH_VISITS.
 * p* starts from the grid's last one for N (powerGuess), so it depends on the calls before only
 * below Newton's stopping step (1e-14); a run stays deterministic.
 */
export function searchThreshold(grid: SearchGrid, n: number, w: number, swt: number, swt2: number): number {
  if (n < MIN_SEARCH_VISITS - 0.5) return Infinity;
  const mean = swt / w;
  const varDays2 = Math.max(0, swt2 / w - mean * mean);
  // Baluev's T_eff = sqrt(4 pi D_t), D_t the weighted variance of the times (src/rv/fap.ts).
  const count = Math.round(n);
  const guess = count < POWER_GUESSES ? grid.powerGuess[count]! : 0;
  const p = baluevPowerAtFap(grid.fap, count, grid.bandPerDay, Math.sqrt(4 * Math.PI * varDays2), guess);
  if (count < POWER_GUESSES) grid.powerGuess[count] = p;
  return ((count - 3) * p) / (1 - p);
}

/** Completeness (file comment), optionally with one visit of weight w at tDays added (sign 1) or removed (-1). */
export function searchCompleteness(stats: Float64Array, offset: number, grid: SearchGrid, sign = 0, w = 0, tDays = 0): number {
  const sw = sign * w;
  const tau = tDays - grid.epochDays;
  const weight = stats[offset]! + sw;
  const n = stats[offset + 3]! + sign;
  const zStar = searchThreshold(grid, n, weight, stats[offset + 1]! + sw * tau, stats[offset + 2]! + sw * tau * tau);
  if (zStar === Infinity) return 0;
  const b = Math.sqrt(zStar);
  const q = marcumQ1Table();
  const { row, fraction } = marcumRow(b);
  // Q1 is 1 (to 1e-14) from a = b + 9 and below 1e-14 up to a = b - 9 for b > 9 (marcum-q.ts): whole frequencies skip the nodes there.
  const sureSq = (b + 9) ** 2;
  const noneSq = b > 9 ? (b - 9) ** 2 : -1;
  const eps = grid.eps;
  const a = weight + eps;
  const freq = grid.angularFreq;
  // The trial visit's phases as in updateSearchStats (sw = 0 leaves the sums as they are).
  const stepAngle = freq.length > 1 ? (freq[1]! - freq[0]!) * tau : 0;
  const stepSin = Math.sin(stepAngle);
  const stepCos = Math.cos(stepAngle);
  let sn = 0;
  let cs = 1;
  let completeness = 0;
  for (let k = 0, o = offset + HEAD; k < freq.length; k++, o += 5) {
    if (k % TRIG_RESTART === 0) {
      sn = Math.sin(freq[k]! * tau);
      cs = Math.cos(freq[k]! * tau);
    }
    const s = stats[o]! + sw * sn;
    const c = stats[o + 1]! + sw * cs;
    const ss = stats[o + 2]! + eps + sw * sn * sn;
    const sc = stats[o + 3]! + sw * sn * cs;
    const cc = stats[o + 4]! + eps + sw * cs * cs;
    const next = sn * stepCos + cs * stepSin;
    cs = cs * stepCos - sn * stepSin;
    sn = next;
    // Schur complement S = [[ss - s^2/a, sc - s c/a], [sc - s c/a, cc - c^2/a]].
    const s11 = ss - (s * s) / a;
    const s12 = sc - (s * c) / a;
    const s22 = cc - (c * c) / a;
    const m = 0.5 * (s11 + s22);
    const half = 0.5 * (s11 - s22);
    const r = Math.sqrt(half * half + s12 * s12);
    const kSq = grid.kSq[k]!;
    if (kSq * (m - r) >= sureSq) {
      completeness += grid.logPWeight[k]! * PHASE_NODES;
      continue;
    }
    if (kSq * (m + r) <= noneSq) continue;
    let p = 0;
    for (let i = 0; i < PHASE_NODES; i++) p += marcumQ1InRow(q, Math.sqrt(Math.max(0, kSq * (m + r * NODE_COS[i]!))), row, fraction);
    completeness += grid.logPWeight[k]! * p;
  }
  return completeness / PHASE_NODES;
}

/**
 * Completeness of n visits of weight w each with S = (n w / 2) I at every frequency (phases spread
 * evenly: the best n visits can do), T_eff of visits spread evenly over the span
 * (D_t = T^2 / 12): the ideal the greedy's first-visit credit uses (state.ts rankingGain).
 */
export function idealCompleteness(grid: SearchGrid, n: number, w: number): number {
  const span = grid.spanDays;
  const zStar = searchThreshold(grid, n, n * w, (n * w * span) / 2, n * w * ((span * span) / 3));
  if (zStar === Infinity) return 0;
  const b = Math.sqrt(zStar);
  const q = marcumQ1Table();
  let completeness = 0;
  for (let k = 0; k < grid.angularFreq.length; k++) completeness += grid.logPWeight[k]! * marcumQ1Lookup(q, Math.sqrt((grid.kSq[k]! * n * w) / 2), b);
  return completeness;
}
