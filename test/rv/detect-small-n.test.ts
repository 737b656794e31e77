// Small-N detection at random phases with a free offset: the analytic average over the phase
// distribution against a Monte Carlo of the least-squares fit itself.
import { describe, expect, it } from 'vitest';
import { detectionProbability, minimumDetectableKMps, phaseSumMoments, sigmaKMps, visitsNeeded } from '../../src/rv/detect.js';
import { createRng } from '../../src/rv/random.js';
import { normalCdf } from '../../src/rv/normal-cdf.js';

/**
 * Simulated campaigns: N uniform random phases, v = γ + K sin 2πφ + noise σ (γ = 3.7 m/s, fitted
 * with K by least squares), plus a campaign-wide systematic on K of spread floor/n. A detection is
 * K̂ / σ_K > n with σ_K = √(σ²/S + (floor/n)²) from the campaign's own phases.
 */
function simulate(kMps: number, sigma: number, visits: number, n: number, floor: number, trials: number, seed: number) {
  const rng = createRng(seed);
  let detected = 0;
  let sumS = 0;
  let sumS2 = 0;
  for (let t = 0; t < trials; t++) {
    const s = Array.from({ length: visits }, () => Math.sin(2 * Math.PI * rng.uniform()));
    const y = s.map((x) => 3.7 + kMps * x + sigma * rng.normal());
    const sMean = s.reduce((a, b) => a + b, 0) / visits;
    const yMean = y.reduce((a, b) => a + b, 0) / visits;
    let sxx = 0;
    let sxy = 0;
    for (let i = 0; i < visits; i++) {
      sxx += (s[i]! - sMean) ** 2;
      sxy += (s[i]! - sMean) * (y[i]! - yMean);
    }
    const kHat = sxy / sxx + (floor / n) * rng.normal();
    if (kHat / Math.sqrt(sigma ** 2 / sxx + (floor / n) ** 2) > n) detected++;
    sumS += sxx;
    sumS2 += sxx * sxx;
  }
  const meanS = sumS / trials;
  return { p: detected / trials, meanS, varS: sumS2 / trials - meanS * meanS };
}

describe('detection probability at small N (free offset, random phases): analytic against Monte Carlo (20,000 campaigns)', () => {
  const cases: [number, number][] = [];
  for (const visits of [5, 10, 20, 40]) for (const ratio of [0.6, 1, 1.5]) cases.push([visits, ratio]);
  it.each(cases)('N = %i, K at %s x n sigma_K(large-N rule)', (visits, ratio) => {
    const sigma = 2;
    const n = 3;
    const k = ratio * n * sigma * Math.sqrt(2 / visits);
    const mc = simulate(k, sigma, visits, n, 0, 20_000, 100 * visits + Math.round(10 * ratio));
    expect(Math.abs(detectionProbability(k, sigma, visits, n, 'random') - mc.p)).toBeLessThanOrEqual(0.03);
  });

  it('with a floor that does not average down (2 m/s, N = 10 and 40)', () => {
    for (const visits of [10, 40]) {
      const mc = simulate(3, 2, visits, 3, 2, 20_000, 7 + visits);
      expect(Math.abs(detectionProbability(3, 2, visits, 3, 'random', 2) - mc.p)).toBeLessThanOrEqual(0.03);
    }
  });

  it('issue 11: where the old rule claimed 0.90 at N = 10 (n = 5), the simulation and the new value agree at about 0.76', () => {
    const n = 5;
    const sigma = 1;
    const visits = 10;
    const k = (n + 1.2816) * sigma * Math.sqrt(2 / visits); // Φ(K/σ_K − n) = 0.90 with σ_K = σ√(2/N)
    expect(normalCdf(k / (sigma * Math.sqrt(2 / visits)) - n)).toBeCloseTo(0.9, 3);
    const mc = simulate(k, sigma, visits, n, 0, 20_000, 11);
    expect(Math.abs(mc.p - 0.76)).toBeLessThan(0.03);
    expect(Math.abs(detectionProbability(k, sigma, visits, n, 'random') - mc.p)).toBeLessThanOrEqual(0.03);
  });

  it('E S = (N − 1)/2 and Var S = N/8 + 1/4 − 3/(8N) against the simulated phases', () => {
    for (const visits of [5, 20]) {
      const mc = simulate(1, 1, visits, 3, 0, 40_000, 3 + visits);
      const m = phaseSumMoments(visits, 'random');
      expect(mc.meanS / m.mean).toBeCloseTo(1, 1);
      expect(Math.abs(mc.varS / m.variance - 1)).toBeLessThan(0.05);
    }
  });
});

describe('visits needed and the floor', () => {
  it('random phases: N = 2 (nσ/K)² + 1, so that E[S] reaches (nσ/K)²', () => {
    const n = visitsNeeded(2, 2, 5, 'random');
    expect(n).toBe(51);
    expect(sigmaKMps(2, n, 'random')).toBeLessThanOrEqual(2 / 5 + 1e-12);
    expect(sigmaKMps(2, n - 1, 'random')).toBeGreaterThan(2 / 5);
  });

  it('no K at or below the floor is reachable, and its probability stays low however many visits (property)', () => {
    expect(visitsNeeded(0.5, 1, 3, 'random', 0.5)).toBe(Infinity);
    expect(visitsNeeded(0.5, 1, 3, 'quadrature', 0.5)).toBe(Infinity);
    expect(visitsNeeded(0.55, 1, 3, 'random', 0.5)).toBeLessThan(Infinity);
    // At most Φ(n (K/f − 1)), the limit of infinitely many visits.
    for (const visits of [10, 100, 10_000])
      expect(detectionProbability(0.4, 1, visits, 3, 'random', 0.5)).toBeLessThanOrEqual(normalCdf(3 * (0.4 / 0.5 - 1)) + 1e-9);
    for (const visits of [10, 100, 10_000]) expect(minimumDetectableKMps(1, visits, 3, 'random', 0.5)).toBeGreaterThan(0.5);
  });
});
