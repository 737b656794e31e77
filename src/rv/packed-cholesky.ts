// Marginal variances of the trailing parameters of a small symmetric positive-definite matrix
// held as a packed lower triangle: the K's of an information matrix F, every other parameter
// marginalised: Var(θ_k) = (F⁻¹)_kk. With F = L Lᵀ (Cholesky), the trailing block of F⁻¹ is
// (L_T L_Tᵀ)⁻¹ with L_T the trailing block of L, so (F⁻¹)_kk = Σ_r (L_T⁻¹)_rk² ([Golub-VanLoan2013]
// §4.2). A pivot at or below 1e-10 of its diagonal means the parameter is not determined, and
// every K of the star is then taken as undetermined (variance Infinity): γ with no visits, one
// visit that γ absorbs, or two visits of a two-planet star.
import { packedIndex } from './information-model.js';

const PIVOT_TOLERANCE = 1e-10;

/**
 * Adds weight × Var(θ_k) for the last `trailing` of the p parameters to out[0 .. trailing)
 * (Infinity when F is singular), overwriting `a` (packed, p(p+1)/2) with its Cholesky factor;
 * `column` is scratch of at least `trailing` entries.
 */
export function addTrailingVariances(a: Float64Array, p: number, trailing: number, weight: number, out: Float64Array, column: Float64Array): void {
  if (!choleskyInPlace(a, p)) {
    for (let k = 0; k < trailing; k++) out[k] = Infinity;
    return;
  }
  addVariancesFromFactor(a, 0, p, trailing, weight, out, column);
}

/**
 * Adds weight × Var(θ_k) of the last `trailing` parameters to out, from the Cholesky factor l (packed, at lAt);
 * `column` is scratch of at least `trailing` entries.
 */
export function addVariancesFromFactor(
  l: Float64Array,
  lAt: number,
  p: number,
  trailing: number,
  weight: number,
  out: Float64Array,
  column: Float64Array,
): void {
  const first = p - trailing;
  if (trailing === 1) {
    const d = l[lAt + packedIndex(p - 1, p - 1)]!;
    out[0] += weight / (d * d);
    return;
  }
  // Columns of L_T⁻¹ by forward substitution: L_T x = e_c.
  const x = column;
  for (let c = 0; c < trailing; c++) {
    x.fill(0, 0, trailing);
    let norm = 0;
    for (let r = c; r < trailing; r++) {
      const row = first + r;
      let sum = r === c ? 1 : 0;
      for (let k = c; k < r; k++) sum -= l[lAt + packedIndex(row, first + k)]! * x[k]!;
      x[r] = sum / l[lAt + packedIndex(row, row)]!;
      norm += x[r]! * x[r]!;
    }
    out[c] += weight * norm;
  }
}

/**
 * The Cholesky factor of packed `a` (starting at `at`), in place; false (a left partly factored) when a pivot is at
 * or below 1e-10 of its diagonal, i.e. the matrix is singular for our purposes.
 */
export function choleskyInPlace(a: Float64Array, p: number, at = 0): boolean {
  for (let i = 0; i < p; i++) {
    const rowI = at + (i * (i + 1)) / 2;
    for (let j = 0; j < i; j++) {
      const rowJ = at + (j * (j + 1)) / 2;
      let sum = a[rowI + j]!;
      for (let k = 0; k < j; k++) sum -= a[rowI + k]! * a[rowJ + k]!;
      a[rowI + j] = sum / a[rowJ + j]!;
    }
    const diagonal = a[rowI + i]!;
    let d = diagonal;
    for (let k = 0; k < i; k++) d -= a[rowI + k]! * a[rowI + k]!;
    if (!(d > PIVOT_TOLERANCE * diagonal) || !(diagonal > 0)) return false;
    a[rowI + i] = Math.sqrt(d);
  }
  return true;
}

/** L⁻¹ x into y (forward substitution with the packed factor at lAt). */
function forward(l: Float64Array, lAt: number, p: number, x: Float64Array, xAt: number, y: Float64Array): void {
  for (let i = 0; i < p; i++) {
    const row = lAt + (i * (i + 1)) / 2;
    let sum = x[xAt + i]!;
    for (let k = 0; k < i; k++) sum -= l[row + k]! * y[k]!;
    y[i] = sum / l[row + i]!;
  }
}

/** The trailing entries of L⁻ᵀ y, in place in y (back substitution from the last row up). */
function backTrailing(l: Float64Array, lAt: number, p: number, trailing: number, y: Float64Array): void {
  for (let i = p - 1; i >= p - trailing; i--) {
    let sum = y[i]!;
    for (let m = i + 1; m < p; m++) sum -= l[lAt + (m * (m + 1)) / 2 + i]! * y[m]!;
    y[i] = sum / l[lAt + (i * (i + 1)) / 2 + i]!;
  }
}

const dot = (a: Float64Array, b: Float64Array, p: number) => {
  let sum = 0;
  for (let i = 0; i < p; i++) sum += a[i]! * b[i]!;
  return sum;
};

/** Scratch vectors for addRankTwoVariances. */
export interface RankTwoScratch {
  y1: Float64Array;
  y2: Float64Array;
}

/**
 * Var(θ_k) of the trailing parameters after F → F + B M Bᵀ with B = [x1 x2] (p × 2) and M
 * symmetric 2 × 2, from the factor L of F and the current variances: by the Woodbury identity
 * (F + B M Bᵀ)⁻¹ = F⁻¹ − F⁻¹B (I + M G)⁻¹ M BᵀF⁻¹ with G = BᵀF⁻¹B ([Golub-VanLoan2013] §2.1.4),
 * where G comes from y = L⁻¹x and the trailing rows of F⁻¹B = L⁻ᵀ y from the last rows of the
 * back substitution. x2 = 0 (m12 = m22 = 0) is the rank-one case. Adds weight × each variance to
 * out; returns false, adding nothing, when I + M G is too near singular to trust.
 */
export function addRankTwoVariances(
  l: Float64Array,
  lAt: number,
  p: number,
  trailing: number,
  current: Float64Array,
  currentAt: number,
  x1: Float64Array,
  x1At: number,
  x2: Float64Array,
  x2At: number,
  m11: number,
  m12: number,
  m22: number,
  scratch: RankTwoScratch,
  weight: number,
  out: Float64Array,
): boolean {
  if (m12 === 0 && m22 === 0) return addRankOneVariances(l, lAt, p, trailing, current, currentAt, x1, x1At, m11, scratch.y1, weight, out);
  const { y1, y2 } = scratch;
  forward(l, lAt, p, x1, x1At, y1);
  forward(l, lAt, p, x2, x2At, y2);
  const g11 = dot(y1, y1, p);
  const g12 = dot(y1, y2, p);
  const g22 = dot(y2, y2, p);
  // A = I + M G, N = A⁻¹ M.
  const a11 = 1 + m11 * g11 + m12 * g12;
  const a12 = m11 * g12 + m12 * g22;
  const a21 = m12 * g11 + m22 * g12;
  const a22 = 1 + m12 * g12 + m22 * g22;
  const det = a11 * a22 - a12 * a21;
  if (!(Math.abs(det) > 1e-9 * Math.max(1, Math.abs(a11 * a22), Math.abs(a12 * a21)))) return false;
  const n11 = (a22 * m11 - a12 * m12) / det;
  const n12 = (a22 * m12 - a12 * m22) / det;
  const n21 = (-a21 * m11 + a11 * m12) / det;
  const n22 = (-a21 * m12 + a11 * m22) / det;
  backTrailing(l, lAt, p, trailing, y1);
  backTrailing(l, lAt, p, trailing, y2);
  for (let k = 0; k < trailing; k++) {
    const z1 = y1[p - trailing + k]!;
    const z2 = y2[p - trailing + k]!;
    out[k] += weight * (current[currentAt + k]! - (z1 * (n11 * z1 + n12 * z2) + z2 * (n21 * z1 + n22 * z2)));
  }
  return true;
}

/**
 * addRankTwoVariances with x2 = 0 (m12 = m22 = 0): the Sherman–Morrison case ([Golub-VanLoan2013] §2.1.4),
 * F⁻¹ − m11 F⁻¹x1 x1ᵀF⁻¹ / (1 + m11 g11). The same numbers as the rank-two formulas bit for bit: what they add
 * for x2 = 0 is only exact identities (x + 0, x × 1, x − 0 with the zero terms of G, A and N), dropped here.
 */
function addRankOneVariances(
  l: Float64Array,
  lAt: number,
  p: number,
  trailing: number,
  current: Float64Array,
  currentAt: number,
  x1: Float64Array,
  x1At: number,
  m11: number,
  y1: Float64Array,
  weight: number,
  out: Float64Array,
): boolean {
  forward(l, lAt, p, x1, x1At, y1);
  const a11 = 1 + m11 * dot(y1, y1, p);
  if (!(Math.abs(a11) > 1e-9 * Math.max(1, Math.abs(a11)))) return false;
  const n11 = m11 / a11;
  backTrailing(l, lAt, p, trailing, y1);
  for (let k = 0; k < trailing; k++) {
    const z1 = y1[p - trailing + k]!;
    out[k] += weight * (current[currentAt + k]! - z1 * (n11 * z1));
  }
  return true;
}
