import { describe, expect, it } from 'vitest';
import { detectionProbabilityKnownPhase, massLimitTable, MIN_VISITS, periodGridDays, sigmaKMps, visitsNeeded } from '../../src/rv/detect.js';
import { erfc, normalCdf } from '../../src/rv/normal-cdf.js';
import { createRng } from '../../src/rv/random.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { fitK } from '../rv/least-squares.js';

/** The star's RV shape at phase φ for a circular orbit: v = γ − K sin(2πφ) (docs/references.md [Kepler-RV], common practice). */
const shape = (phase: number) => -Math.sin(2 * Math.PI * phase);

describe('least-squares identities for K (docs/references.md [Visits-needed]; common practice)', () => {
  it('balanced quadratures give Var(K̂) = σ²/N exactly', () => {
    const sigma = 2.7;
    for (const n of [2, 10, 36]) {
      const phases = Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 0.25 : 0.75));
      const s = phases.map(shape);
      const { varK } = fitK(
        s,
        s.map(() => 0),
        sigma,
      );
      expect(varK).toBeCloseTo((sigma * sigma) / n, 12);
      expect(sigmaKMps(sigma, n, 'quadrature') ** 2).toBeCloseTo(varK, 12);
    }
  });

  it('no schedule beats balanced quadratures: σ²/N is a lower bound (property)', () => {
    const rng = createRng(7);
    for (let trial = 0; trial < 50; trial++) {
      const n = 3 + Math.floor(rng.uniform() * 30);
      const s = Array.from({ length: n }, () => shape(rng.uniform()));
      expect(
        fitK(
          s,
          s.map(() => 0),
          1,
        ).varK,
      ).toBeGreaterThanOrEqual(1 / n - 1e-12);
    }
  });

  it('uniform random phases tend to σ_K = σ √(2/N)', () => {
    const rng = createRng(11);
    const sigma = 1.9;
    // The spread of N·Var(K̂)/(2σ²) about 1 shrinks as 1/√N: Var(sin²) = 1/8, so its 1-σ is ≈ √(1/(2N)).
    for (const n of [400, 4000, 20000]) {
      const s = Array.from({ length: n }, () => shape(rng.uniform()));
      const ratio =
        fitK(
          s,
          s.map(() => 0),
          sigma,
        ).varK /
        sigmaKMps(sigma, n, 'random') ** 2;
      expect(Math.abs(ratio - 1)).toBeLessThan(4 * Math.sqrt(1 / (2 * n)));
    }
  });

  it('N = 2(nσ/K)² + 1 at random phases (E Σ(s − s̄)² = (N − 1)/2) and (nσ/K)² at quadratures, the fewest reaching K/σ_K = n', () => {
    for (const [k, sigma, n] of [
      [3, 2.5, 5],
      [1, 2.2, 3],
      [10, 1.5, 5],
      [0.8, 1.1, 7],
    ] as const) {
      const random = visitsNeeded(k, sigma, n, 'random');
      const quad = visitsNeeded(k, sigma, n, 'quadrature');
      expect(random).toBe(Math.max(MIN_VISITS, Math.ceil(2 * ((n * sigma) / k) ** 2 + 1)));
      expect(quad).toBe(Math.max(MIN_VISITS, Math.ceil(((n * sigma) / k) ** 2)));
      for (const [layout, visits] of [
        ['random', random],
        ['quadrature', quad],
      ] as const) {
        expect(k / sigmaKMps(sigma, visits, layout)).toBeGreaterThanOrEqual(n - 1e-9);
        if (visits > MIN_VISITS) expect(k / sigmaKMps(sigma, visits - 1, layout)).toBeLessThan(n);
      }
    }
  });
});

describe('Monte Carlo (seeded): simulated fits at the computed N', () => {
  it('reach K/σ_K = n at random phases within sampling error', () => {
    const rng = createRng(2027);
    const [k, sigma, n] = [1, 2.5, 5];
    const visits = visitsNeeded(k, sigma, n, 'random'); // 313
    const trials = 2000;
    const estimates: number[] = [];
    for (let t = 0; t < trials; t++) {
      const s = Array.from({ length: visits }, () => shape(rng.uniform()));
      const v = s.map((x) => 12 + k * x + sigma * rng.normal());
      estimates.push(fitK(s, v, sigma).k);
    }
    const mean = estimates.reduce((a, b) => a + b, 0) / trials;
    const sd = Math.sqrt(estimates.reduce((a, b) => a + (b - mean) ** 2, 0) / (trials - 1));
    expect(Math.abs(mean - k)).toBeLessThan((4 * sd) / Math.sqrt(trials)); // unbiased
    // Sampling error of K/sd is ≈ n/√(2·trials); finite N adds ≈ n/N (Jensen: E[1/Σ(s − s̄)²] > 1/E[...]).
    expect(Math.abs(k / sd - n)).toBeLessThan((3 * n) / Math.sqrt(2 * trials) + n / visits);
  });

  it('detection probability Φ(K/σ_K − n) agrees with simulation', () => {
    const rng = createRng(99);
    const visits = 20;
    const sigma = 3;
    const n = 3;
    // One fixed design; σ_K is that design's exact least-squares value.
    const s = Array.from({ length: visits }, () => shape(rng.uniform()));
    const sigmaK = Math.sqrt(
      fitK(
        s,
        s.map(() => 0),
        sigma,
      ).varK,
    );
    const trials = 4000;
    for (const offset of [-1, 0, 0.5, 1.5]) {
      const k = (n + offset) * sigmaK;
      let detected = 0;
      for (let t = 0; t < trials; t++) {
        const v = s.map((x) => k * x + sigma * rng.normal());
        if (fitK(s, v, sigma).k / sigmaK > n) detected++;
      }
      const p = detectionProbabilityKnownPhase(k, sigmaK, n);
      expect(p).toBeCloseTo(normalCdf(offset), 12);
      expect(Math.abs(detected / trials - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / trials));
    }
  });
});

describe('normal distribution function', () => {
  it.each([
    // Standard normal table values (Abramowitz & Stegun 1964, Table 26.1, from memory).
    [0, 0.5],
    [1, 0.841344746],
    [1.96, 0.975002105],
    [-3, 0.001349898],
    [2.5, 0.993790335],
  ])('Φ(%s) = %s', (x, expected) => {
    expect(normalCdf(x)).toBeCloseTo(expected, 7);
  });

  it('matches a slow reference: Simpson integration of the Gaussian density', () => {
    const density = (t: number) => Math.exp(-0.5 * t * t) / Math.sqrt(2 * Math.PI);
    const simpson = (a: number, b: number, steps: number) => {
      const h = (b - a) / steps;
      let sum = density(a) + density(b);
      for (let i = 1; i < steps; i++) sum += density(a + i * h) * (i % 2 ? 4 : 2);
      return (sum * h) / 3;
    };
    for (let x = -6; x <= 6; x += 0.37) {
      const reference = x < 0 ? simpson(-14, x, 4000) : 1 - simpson(x, 14, 4000);
      expect(Math.abs(normalCdf(x) - reference)).toBeLessThan(1.2e-7 * Math.max(reference, 1e-3));
    }
    expect(erfc(0)).toBeCloseTo(1, 7);
  });
});

describe('mass limits', () => {
  it('the smallest detectable mass gives back K = n σ_K through the forward K (round trip)', () => {
    const rows = massLimitTable({ starMassSun: 0.8, whiteSigmaMps: 2.2, visits: 40, goalSignificance: 5, periodsDays: [1, 20, 700], ecc: 0.3 });
    for (const row of rows) {
      expect(row.kMinRandomMps).toBeCloseTo(5 * 2.2 * Math.sqrt(2 / 39), 12);
      expect(row.kMinQuadratureMps).toBeCloseTo((5 * 2.2) / Math.sqrt(40), 12);
      const k = semiAmplitudeMps({ starMassSun: 0.8, planetMassEarth: row.massMinRandomEarth, periodDays: row.periodDays, ecc: 0.3 });
      expect(k).toBeCloseTo(row.kMinRandomMps, 9);
      // Quadratures need √((N − 1)/(2N)) of the K, hence (nearly) that fraction of the mass for small planets.
      expect(row.massMinQuadratureEarth / row.massMinRandomEarth).toBeCloseTo(Math.sqrt(39 / 80), 3);
      expect(row.mass50RandomEarth).toBeLessThan(row.mass90RandomEarth);
    }
    // m sin i ∝ P^(1/3) for a fixed K and m ≪ M★ (Cumming, Marcy & Butler 1999).
    expect(rows[1]!.massMinRandomEarth / rows[0]!.massMinRandomEarth).toBeCloseTo(Math.cbrt(20), 3);
  });

  it('the period grid is the 1-2-5 series', () => {
    expect(periodGridDays(1, 1000)).toEqual([1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]);
    expect(periodGridDays(0.3, 3)).toEqual([0.5, 1, 2]);
  });
});
