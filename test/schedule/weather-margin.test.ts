// The margin over each goal that the weather asks for (src/schedule/utility.ts weatherMargin),
// against the exact binomial: with n nights each clear with probability f, a plan whose clear-sky
// K/sigma_K is (1 + b) times its goal keeps its goal when at least n / (1 + b)^2 nights are clear
// (information in proportion to clear nights). The normal approximation behind b must give that
// probability close to the one asked for (binomial sums written out here; common practice).
import { describe, expect, it } from 'vitest';
import { weatherMargin } from '../../src/schedule/utility.js';

function binomialAtLeast(n: number, f: number, k: number): number {
  let sum = 0;
  let term = (1 - f) ** n; // P(X = 0)
  for (let x = 0; x <= n; x++) {
    if (x >= k) sum += term;
    term *= ((n - x) / (x + 1)) * (f / (1 - f));
  }
  return sum;
}

describe('weatherMargin', () => {
  it('keeps the goal with about the probability asked for, against the exact binomial', () => {
    const worst: number[] = [];
    for (const n of [8, 14, 30, 60])
      for (const f of [0.6, 0.7, 0.8, 0.9])
        for (const p of [0.5, 0.75, 0.9]) {
          const b = weatherMargin(f, n, p);
          const keeps = binomialAtLeast(n, f, Math.ceil(n / (1 + b) ** 2 - 1e-6));
          worst.push(keeps - p);
        }
    // Discreteness moves the binomial by up to a term of its sum: at worst 0.087 short (8 nights, f 0.9, p 0.9).
    expect(Math.min(...worst)).toBeGreaterThan(-0.1);
    expect(Math.max(...worst)).toBeLessThan(0.2);
  });

  it('is nothing under a sure sky and grows as the sky, the nights or the odds worsen', () => {
    expect(weatherMargin(1, 14, 0.9)).toBe(0);
    expect(weatherMargin(0.8, 14, 0.9)).toBeGreaterThan(weatherMargin(0.9, 14, 0.9));
    expect(weatherMargin(0.8, 7, 0.9)).toBeGreaterThan(weatherMargin(0.8, 14, 0.9));
    expect(weatherMargin(0.8, 14, 0.95)).toBeGreaterThan(weatherMargin(0.8, 14, 0.9));
    // A sky this poor over so few nights asks for more than the cap allows.
    expect(weatherMargin(0.3, 3, 0.9)).toBe(1);
  });
});
