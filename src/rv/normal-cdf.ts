// The standard normal distribution function, for detection probabilities.

/**
 * Complementary error function erfc(x), fractional error below 1.2e-7 everywhere: the Chebyshev
 * fit `erfcc` of Press, Teukolsky, Vetterling & Flannery, Numerical Recipes in C, 2nd ed. (1992),
 * section 6.2, with t = 1 / (1 + |x|/2) and erfc(−x) = 2 − erfc(x).
 */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const poly =
    -1.26551223 +
    t *
      (1.00002368 +
        t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  const value = t * Math.exp(-z * z + poly);
  return x >= 0 ? value : 2 - value;
}

/** Standard normal distribution function Φ(x) = erfc(−x / √2) / 2 (the definitions of Φ and erfc; common practice). */
export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / Math.SQRT2);
}

/** The x with Φ(x) = p, 0 < p < 1, by bisection on normalCdf (to its accuracy; common practice). */
export function normalQuantile(p: number): number {
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = (lo + hi) / 2;
    if (normalCdf(mid) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
