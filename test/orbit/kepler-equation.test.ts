import { describe, expect, it } from 'vitest';
import { eccentricAnomalyRad, meanAnomalyRad } from '../../src/orbit/kepler-equation.js';

describe("Kepler's equation E − e sin E = M", () => {
  it('converges for a grid of e in [0, 0.99] and M in [0, 2π] with residual < 1e-12', () => {
    // Property: the solution satisfies the equation it solves (Meeus ch. 30).
    let worst = 0;
    for (let i = 0; i <= 99; i++) {
      const ecc = i / 100;
      for (let j = 0; j <= 720; j++) {
        const m = (2 * Math.PI * j) / 720;
        const e = eccentricAnomalyRad(m, ecc);
        worst = Math.max(worst, Math.abs(meanAnomalyRad(e, ecc) - m));
      }
    }
    expect(worst).toBeLessThan(1e-12);
  });

  it('handles the hard corner: e = 0.99 and tiny or near-π mean anomalies', () => {
    // Property: residual < 1e-12 where Newton's method is known to struggle (common practice).
    for (const m of [1e-12, 1e-8, 1e-4, 0.01, Math.PI - 1e-9, Math.PI, -1e-6]) {
      const e = eccentricAnomalyRad(m, 0.99);
      expect(Math.abs(meanAnomalyRad(e, 0.99) - m)).toBeLessThan(1e-12);
    }
  });

  it('works for any M: negative and many revolutions away', () => {
    // Property: E(M + 2πk) = E(M) + 2πk and the residual stays small.
    for (const m of [-50, -7.1, 13.3, 1000.25]) {
      const e = eccentricAnomalyRad(m, 0.7);
      expect(Math.abs(meanAnomalyRad(e, 0.7) - m)).toBeLessThan(1e-11);
      expect(Math.abs(e - m)).toBeLessThanOrEqual(0.7 + 1e-12); // |E − M| = e |sin E| <= e
    }
  });

  it('is increasing in M (the map M -> E is monotone)', () => {
    // Property: dE/dM = 1 / (1 − e cos E) > 0.
    let previous = -Infinity;
    for (let j = 0; j <= 2000; j++) {
      const e = eccentricAnomalyRad(-Math.PI + (4 * Math.PI * j) / 2000, 0.95);
      expect(e).toBeGreaterThan(previous);
      previous = e;
    }
  });
});
