// A direct least-squares routine for the tests: normal equations solved by Gauss–Jordan
// elimination with partial pivoting (common practice), independent of the code under test.

/** Solves min ‖X b − y‖² for b; returns b and the covariance σ² (XᵀX)⁻¹ for noise σ. */
export function leastSquares(design: number[][], y: number[], sigma: number): { coef: number[]; cov: number[][] } {
  const p = design[0]!.length;
  // Augmented matrix [XᵀX | Xᵀy | I].
  const a = Array.from({ length: p }, (_, i) => [
    ...Array.from({ length: p }, (_, j) => design.reduce((s, row) => s + row[i]! * row[j]!, 0)),
    design.reduce((s, row, k) => s + row[i]! * y[k]!, 0),
    ...Array.from({ length: p }, (_, j) => (i === j ? 1 : 0)),
  ]);
  for (let col = 0; col < p; col++) {
    let pivot = col;
    for (let r = col + 1; r < p; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    const lead = a[col]![col]!;
    a[col] = a[col]!.map((v) => v / lead);
    for (let r = 0; r < p; r++) {
      if (r === col) continue;
      const f = a[r]![col]!;
      a[r] = a[r]!.map((v, j) => v - f * a[col]![j]!);
    }
  }
  return {
    coef: a.map((row) => row[p]!),
    cov: a.map((row) => row.slice(p + 1).map((v) => v * sigma * sigma)),
  };
}

/** Fits v = γ + K s with known s (offset free): returns K̂ and Var(K̂). */
export function fitK(s: number[], v: number[], sigma: number): { k: number; varK: number } {
  const { coef, cov } = leastSquares(
    s.map((x) => [1, x]),
    v,
    sigma,
  );
  return { k: coef[1]!, varK: cov[1]![1]! };
}
