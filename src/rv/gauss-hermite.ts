// Gauss–Hermite quadrature for averages over a normal distribution.

/**
 * 20-point Gauss–Hermite nodes (positive half) and weights (Abramowitz & Stegun 1964, Table 25.10):
 * ∫ e^(−x²) f(x) dx ≈ Σ w_k [f(x_k) + f(−x_k)].
 */
export const GH_X = [
  0.2453407083009, 0.7374737285454, 1.2340762153953, 1.7385377121166, 2.2549740020893, 2.7888060584281, 3.347854567384, 3.9447640401156, 4.6036824495507,
  5.3874808900112,
];
export const GH_W = [
  4.622436696006e-1, 2.866755053628e-1, 1.0901720602e-1, 2.481052088746e-2, 3.243773342238e-3, 2.283386360164e-4, 7.802556478532e-6, 1.086069370769e-7,
  4.399340992273e-10, 2.229393645534e-13,
];

/** E[f(Z)] for Z ~ N(0, 1): with z = √2 x, E[f] = Σ w_k [f(√2 x_k) + f(−√2 x_k)] / √π. */
export function standardNormalMean(f: (z: number) => number): number {
  let sum = 0;
  for (let k = 0; k < GH_X.length; k++) sum += GH_W[k]! * (f(Math.SQRT2 * GH_X[k]!) + f(-Math.SQRT2 * GH_X[k]!));
  return sum / Math.sqrt(Math.PI);
}
