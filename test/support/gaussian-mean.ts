/**
 * E[f(x + eps)], eps ~ N(0, sigma^2), by the trapezoid rule over +-7 sigma (800 steps): a slow,
 * direct average for checking faster series and quadratures. sigma = 0 gives f(x).
 */
export function gaussianMean(f: (x: number) => number, x: number, sigma: number): number {
  if (sigma === 0) return f(x);
  const steps = 800;
  let total = 0;
  let norm = 0;
  for (let i = 0; i <= steps; i++) {
    const u = -7 + (14 * i) / steps;
    const w = Math.exp(-0.5 * u * u) * (i === 0 || i === steps ? 0.5 : 1);
    total += w * f(x + sigma * u);
    norm += w;
  }
  return total / norm;
}
