// Solves and inverses with the packed Cholesky factor of src/rv/packed-cholesky.ts: with A = L Lᵀ,
// A x = b is L y = b then Lᵀ x = y, and the columns of A⁻¹ solve A x = e_c ([Golub-VanLoan2013] §4.2).
import { choleskyInPlace } from './packed-cholesky.js';
import { packedIndex, packedLength } from './information-model.js';

/** x = A⁻¹ b for the packed factor l of A (p×p). */
export function solveWithFactor(l: Float64Array, p: number, b: ArrayLike<number>): Float64Array {
  const x = Float64Array.from(b);
  for (let i = 0; i < p; i++) {
    for (let k = 0; k < i; k++) x[i] -= l[packedIndex(i, k)]! * x[k]!;
    x[i] /= l[packedIndex(i, i)]!;
  }
  for (let i = p - 1; i >= 0; i--) {
    for (let k = i + 1; k < p; k++) x[i] -= l[packedIndex(k, i)]! * x[k]!;
    x[i] /= l[packedIndex(i, i)]!;
  }
  return x;
}

/** A⁻¹ as a packed lower triangle, or null when A (packed, p×p) is singular for packed-cholesky's test. */
export function inversePacked(a: Float64Array, p: number): Float64Array | null {
  const l = Float64Array.from(a);
  if (!choleskyInPlace(l, p)) return null;
  const inverse = new Float64Array(packedLength(p));
  const unit = new Float64Array(p);
  for (let c = 0; c < p; c++) {
    unit.fill(0);
    unit[c] = 1;
    const column = solveWithFactor(l, p, unit);
    for (let r = c; r < p; r++) inverse[packedIndex(r, c)] = column[r]!;
  }
  return inverse;
}
