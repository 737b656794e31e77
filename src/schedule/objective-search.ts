// Phase coverage for a blind search over a period range.
//
// For a trial period P the signal is v = gamma + a sin(2 pi t/P) + b cos(2 pi t/P); with weights
// w_i = 1/sigma_i^2 the Fisher information matrix of (gamma, a, b) is
//   M = sum w_i x_i x_i^T,  x_i = (1, sin 2 pi t_i/P, cos 2 pi t_i/P)
// (weighted least squares, common practice). Its determinant is the D-optimality criterion of
// experimental design; log det M is concave in the visit weights and, as a set function with a
// ridge, monotone submodular (Krause & Guestrin 2005, "Near-optimal nonmyopic value of
// information", from memory). Visits that bunch in phase at some P leave M near singular there,
// so aliases and phase gaps cost coverage.
//
// Regularisation: M_reg = M + eps I3 with eps one thousandth of the target's median visit weight,
// so log det is finite from the first visit and negligible once three visits spread in phase.
//
// Scale: det M = M_00 det S with S the 2x2 Schur complement (the sine/cosine information after
// the offset is fitted; Horn & Johnson, Matrix Analysis, 0.8.5). sqrt(det S) is the geometric
// mean of S's eigenvalues, the amplitude information averaged over the unknown phase, so
//   K(P) / sigma_K(P) = K(P) (det S)^(1/4),
// and the score of a schedule is the geometric mean of that over a log-spaced period grid:
//   L = mean_p [ log K(P_p) + 1/4 (log det M_reg,p - log M_reg,p[0][0]) ],  K/sigma_K = exp(L).
// K(P) = K(P_min) (P/P_min)^(-1/3) for a fixed planet mass, circular orbit, m_p << M_star
// (Cumming, Marcy & Butler 1999).

export interface SearchGrid {
  /** 2 pi / P for each grid period, rad/day. */
  angularFreq: Float64Array;
  /** log K(P) for each grid period, and their mean. */
  logK: Float64Array;
  meanLogK: number;
  /** Ridge added to the diagonal of M. */
  eps: number;
  /** sin and cos of every grid frequency at each visit time seen so far (the hot loop's trig, once per slot). */
  trig: Map<number, Float64Array>;
}

/** [sin, cos] of angularFreq[p] * tDays for every grid period p. */
export function trigValues(grid: SearchGrid, tDays: number): Float64Array {
  const freq = grid.angularFreq;
  const values = new Float64Array(2 * freq.length);
  for (let p = 0; p < freq.length; p++) {
    values[2 * p] = Math.sin(freq[p]! * tDays);
    values[2 * p + 1] = Math.cos(freq[p]! * tDays);
  }
  return values;
}

/** trigValues, computed once per visit time. */
function trigAt(grid: SearchGrid, tDays: number): Float64Array {
  let values = grid.trig.get(tDays);
  if (!values) {
    values = trigValues(grid, tDays);
    grid.trig.set(tDays, values);
  }
  return values;
}

/** Running sums of one search target: W, then per period (sum w sin, w cos, w sin^2, w sin cos, w cos^2). */
export function searchStatsLength(grid: SearchGrid): number {
  return 1 + 5 * grid.angularFreq.length;
}

/** Log-spaced grid from periodMinDays to periodMaxDays (one period if they are equal). */
export function searchGrid(periodMinDays: number, periodMaxDays: number, kMpsAtMin: number, size: number, eps: number): SearchGrid {
  const n = periodMaxDays > periodMinDays ? Math.max(2, size) : 1;
  const angularFreq = new Float64Array(n);
  const logK = new Float64Array(n);
  const span = Math.log(periodMaxDays / periodMinDays);
  for (let p = 0; p < n; p++) {
    const logP = Math.log(periodMinDays) + (n === 1 ? 0 : (span * p) / (n - 1));
    angularFreq[p] = (2 * Math.PI) / Math.exp(logP);
    logK[p] = Math.log(kMpsAtMin) - (logP - Math.log(periodMinDays)) / 3;
  }
  return { angularFreq, logK, meanLogK: logK.reduce((sum, v) => sum + v, 0) / n, eps, trig: new Map() };
}

/** Adds (sign 1) or removes (sign -1) a visit of weight w at time tDays. */
export function updateSearchStats(stats: Float64Array, offset: number, grid: SearchGrid, w: number, tDays: number, sign: number): void {
  updateSearchStatsWith(stats, offset, grid, sign * w, trigAt(grid, tDays));
}

/** updateSearchStats with the signed weight sw and the visit time's trigValues given. */
export function updateSearchStatsWith(stats: Float64Array, offset: number, grid: SearchGrid, sw: number, trig: Float64Array): void {
  stats[offset] += sw;
  for (let p = 0, o = offset + 1; p < grid.angularFreq.length; p++, o += 5) {
    const sn = trig[2 * p]!;
    const cs = trig[2 * p + 1]!;
    stats[o] += sw * sn;
    stats[o + 1] += sw * cs;
    stats[o + 2] += sw * sn * sn;
    stats[o + 3] += sw * sn * cs;
    stats[o + 4] += sw * cs * cs;
  }
}

/** log(K/sigma_K), the grid's mean (see the file comment), optionally with one visit added (sign 1) or removed (-1). */
export function searchLogScore(stats: Float64Array, offset: number, grid: SearchGrid, sign = 0, w = 0, tDays = 0): number {
  const sw = sign * w;
  return searchLogScoreWith(stats, offset, grid, sw, sw !== 0 ? trigAt(grid, tDays) : undefined);
}

/** searchLogScore with the signed weight sw of the visit added or removed and its time's trigValues (undefined: as it is). */
export function searchLogScoreWith(stats: Float64Array, offset: number, grid: SearchGrid, sw: number, trig: Float64Array | undefined): number {
  const eps = grid.eps;
  const a = stats[offset]! + sw + eps;
  const logA = Math.log(a);
  const freq = grid.angularFreq;
  // Sum of log det as the log of products of four determinants: a quarter of the logarithms, and
  // four determinants (each between eps^3 and (sum w)^3) stay far inside the range of a double.
  let logDetSum = 0;
  let product = 1;
  const floor = eps * eps * eps;
  for (let p = 0, o = offset + 1; p < freq.length; p++, o += 5) {
    let b = stats[o]!,
      c = stats[o + 1]!,
      d = stats[o + 2]! + eps,
      e = stats[o + 3]!,
      f = stats[o + 4]! + eps;
    if (trig) {
      const sn = trig[2 * p]!;
      const cs = trig[2 * p + 1]!;
      b += sw * sn;
      c += sw * cs;
      d += sw * sn * sn;
      e += sw * sn * cs;
      f += sw * cs * cs;
    }
    // det of the symmetric [[a, b, c], [b, d, e], [c, e, f]] by cofactors along the first row;
    // rounding after removals can leave it a hair below the ridge's own determinant: floor it there.
    const det = a * (d * f - e * e) - b * (b * f - c * e) + c * (b * e - d * c);
    product *= Math.max(det, floor);
    if ((p & 3) === 3) {
      logDetSum += Math.log(product);
      product = 1;
    }
  }
  logDetSum += Math.log(product);
  return grid.meanLogK + 0.25 * (logDetSum / freq.length - logA);
}
