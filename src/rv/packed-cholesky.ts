// Marginal variances of the trailing parameters of a small symmetric positive-definite matrix
// held as a packed lower triangle: the K's of an information matrix F, every other parameter
// marginalised: Var(θ_k) = (F⁻¹)_kk. With F = L Lᵀ (Cholesky), the trailing block of F⁻¹ is
// (L_T L_Tᵀ)⁻¹ with L_T the trailing block of L, so (F⁻¹)_kk = Σ_r (L_T⁻¹)_rk² ([Golub-VanLoan2013]
// §4.2). A pivot at or below 1e-10 of its diagonal means the parameter is not determined: a
// nuisance parameter (γ with no visits) leaves every K undetermined (variance Infinity); a K
// (one visit, which γ absorbs) gets Infinity and is held fixed for the K's after it.
import { packedIndex } from './information-model.js';

const PIVOT_TOLERANCE = 1e-10;

/**
 * Adds weight × Var(θ_k) for the last `trailing` of the p parameters to out[0 .. trailing),
 * overwriting `a` (packed, p(p+1)/2) with its Cholesky factor.
 */
export function addTrailingVariances(a: Float64Array, p: number, trailing: number, weight: number, out: Float64Array): void {
  const first = p - trailing;
  let degenerate = 0;
  for (let i = 0; i < p; i++) {
    const rowI = (i * (i + 1)) / 2;
    for (let j = 0; j < i; j++) {
      const rowJ = (j * (j + 1)) / 2;
      let sum = a[rowI + j]!;
      for (let k = 0; k < j; k++) sum -= a[rowI + k]! * a[rowJ + k]!;
      const pivot = a[rowJ + j]!;
      a[rowI + j] = pivot === Infinity ? 0 : sum / pivot;
    }
    const diagonal = a[rowI + i]!;
    let d = diagonal;
    for (let k = 0; k < i; k++) d -= a[rowI + k]! * a[rowI + k]!;
    if (!(d > PIVOT_TOLERANCE * diagonal) || !(diagonal > 0)) {
      if (i < first) {
        for (let k = 0; k < trailing; k++) out[k] = Infinity;
        return;
      }
      degenerate |= 1 << (i - first);
      a[rowI + i] = Infinity;
      for (let k = 0; k < i; k++) a[rowI + k] = 0;
      continue;
    }
    a[rowI + i] = Math.sqrt(d);
  }
  if (trailing === 1) {
    const l = a[packedIndex(p - 1, p - 1)]!;
    out[0] += degenerate ? Infinity : weight / (l * l);
    return;
  }
  // Columns of L_T⁻¹ by forward substitution: L_T x = e_c.
  const x = new Float64Array(trailing);
  for (let c = 0; c < trailing; c++) {
    if (degenerate & (1 << c)) {
      out[c] += Infinity;
      continue;
    }
    x.fill(0);
    let norm = 0;
    for (let r = c; r < trailing; r++) {
      const row = first + r;
      let sum = r === c ? 1 : 0;
      for (let k = c; k < r; k++) sum -= a[packedIndex(row, first + k)]! * x[k]!;
      const pivot = a[packedIndex(row, row)]!;
      x[r] = pivot === Infinity ? 0 : sum / pivot;
      norm += x[r]! * x[r]!;
    }
    out[c] += weight * norm;
  }
}
