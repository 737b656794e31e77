import { describe, expect, it } from 'vitest';
import { createRng, deriveSeed, rngFromState } from '../../src/rv/random.js';

const draw = (seed: number, count: number, pick: 'uniform' | 'normal') => {
  const rng = createRng(seed);
  return Array.from({ length: count }, () => rng[pick]());
};

describe('seeded generator', () => {
  it("is xoshiro128**: the first ten outputs from the state {1, 2, 3, 4} of the authors' reference code", () => {
    // Output of Blackman & Vigna's reference implementation xoshiro128starstar.c (v1.1), as quoted
    // in the reference test of the rand_xoshiro crate (rust-random/rngs, xoshiro128starstar.rs).
    const rng = rngFromState([1, 2, 3, 4]);
    const expected = [11520, 0, 5927040, 70819200, 2031721883, 1637235492, 1287239034, 3734860849, 3729100597, 4258142804];
    expect(expected.map(() => rng.nextUint32())).toEqual(expected);
    expect(() => rngFromState([0, 0, 0, 0])).toThrow(RangeError);
  });

  it('repeats a sequence for one seed and changes with the seed', () => {
    expect(draw(42, 50, 'uniform')).toEqual(draw(42, 50, 'uniform'));
    expect(draw(42, 50, 'normal')).toEqual(draw(42, 50, 'normal'));
    expect(draw(42, 50, 'uniform')).not.toEqual(draw(43, 50, 'uniform'));
    expect(draw(0, 5, 'uniform').every((u) => u >= 0 && u < 1)).toBe(true);
  });

  it('derives distinct sub-stream seeds', () => {
    const seeds = new Set(Array.from({ length: 1000 }, (_, i) => deriveSeed(7, i)));
    expect(seeds.size).toBe(1000);
    expect(deriveSeed(7, 3)).toBe(deriveSeed(7, 3));
    expect(deriveSeed(7, 3)).not.toBe(deriveSeed(8, 3));
  });

  it('gives uniform deviates: mean 1/2 and a flat histogram', () => {
    const n = 100_000;
    const u = draw(1, n, 'uniform');
    const mean = u.reduce((a, b) => a + b, 0) / n;
    // Mean of U(0,1) is 1/2 with standard error √(1/12/n) (common practice); 4 standard errors.
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    const bins = new Array<number>(10).fill(0);
    for (const x of u) bins[Math.floor(x * 10)]!++;
    const chi2 = bins.reduce((s, c) => s + (c - n / 10) ** 2 / (n / 10), 0);
    // χ² with 9 degrees of freedom: 27.88 is its 0.1% upper point (standard tables, from memory).
    expect(chi2).toBeLessThan(27.88);
  });

  it('gives standard normal deviates: mean 0, variance 1, 68.27% within one sigma', () => {
    const n = 100_000;
    const z = draw(2, n, 'normal');
    const mean = z.reduce((a, b) => a + b, 0) / n;
    const variance = z.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
    const kurtosis = z.reduce((a, b) => a + (b - mean) ** 4, 0) / n / variance ** 2;
    const inside = z.filter((x) => Math.abs(x) < 1).length / n;
    // Standard errors: 1/√n for the mean, √(2/n) for the variance, √(24/n) for the kurtosis
    // (common practice); 4 standard errors each. P(|Z| < 1) = 0.682689 (common practice).
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(variance - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    expect(Math.abs(kurtosis - 3)).toBeLessThan(4 * Math.sqrt(24 / n));
    expect(Math.abs(inside - 0.682689)).toBeLessThan(4 * Math.sqrt((0.682689 * 0.317311) / n));
  });
});
