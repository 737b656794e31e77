import { ValidationError } from '../../src/errors.js';
import { describe, expect, it } from 'vitest';
import { frequencyGrid, gridFrequency } from '../../src/rv/frequency-grid.js';
import { argMax, findPeaks } from '../../src/rv/periodogram-peaks.js';
import { glsAt, glsKernel, glsPeriodogram } from '../../src/rv/periodogram.js';
import { createRng } from '../../src/rv/random.js';

/** Irregular nightly-like times over ~80 days, noise σ between 1 and 3 m/s, values with a signal. */
function series(seed: number, n = 28) {
  const rng = createRng(seed);
  const t = Array.from({ length: n }, (_, i) => 2_461_000.3 + i * 2.9 + 0.8 * rng.uniform());
  const sigma = t.map(() => 1 + 2 * rng.uniform());
  const y = t.map((ti, i) => 3 * Math.sin((2 * Math.PI * ti) / 7.7) + 5 + sigma[i]! * rng.normal());
  return { t, y, sigma };
}

/** Slow reference: weighted least squares of y = a cos + b sin + c by Gaussian elimination; returns χ². */
function chi2OfFit(t: number[], y: number[], sigma: number[], basis: ((ti: number) => number)[]): number {
  const m = basis.length;
  const A = Array.from({ length: m }, () => new Array<number>(m + 1).fill(0));
  t.forEach((ti, i) => {
    const w = 1 / sigma[i]! ** 2;
    const row = basis.map((f) => f(ti));
    for (let r = 0; r < m; r++) {
      for (let c = 0; c < m; c++) A[r]![c]! += w * row[r]! * row[c]!;
      A[r]![m]! += w * row[r]! * y[i]!;
    }
  });
  for (let col = 0; col < m; col++) {
    for (let r = col + 1; r < m; r++) {
      const f = A[r]![col]! / A[col]![col]!;
      for (let c = col; c <= m; c++) A[r]![c]! -= f * A[col]![c]!;
    }
  }
  const x = new Array<number>(m).fill(0);
  for (let r = m - 1; r >= 0; r--) {
    let s = A[r]![m]!;
    for (let c = r + 1; c < m; c++) s -= A[r]![c]! * x[c]!;
    x[r] = s / A[r]![r]!;
  }
  return t.reduce((sum, ti, i) => sum + ((y[i]! - basis.reduce((v, f, j) => v + x[j]! * f(ti), 0)) / sigma[i]!) ** 2, 0);
}

describe('frequency grid', () => {
  it('spans 1/Pmax to 1/Pmin in steps of 1/(T·oversample), with documented defaults', () => {
    const t = [0, 10, 25, 60];
    const grid = frequencyGrid(t, { oversample: 5 });
    expect(grid.baselineDays).toBe(60);
    expect(grid.stepPerDay).toBeCloseTo(1 / 300, 15);
    expect(grid.startPerDay).toBeCloseTo(1 / 120, 15); // default Pmax = 2 × baseline
    const last = gridFrequency(grid, grid.count - 1);
    expect(last).toBeLessThanOrEqual(1 / 1.5); // default Pmin = 1.5 d
    expect(last + grid.stepPerDay).toBeGreaterThan(1 / 1.5);
    expect(() => frequencyGrid(t, { minPeriodDays: 10, maxPeriodDays: 5 })).toThrow(ValidationError);
    expect(() => frequencyGrid([3, 3])).toThrow(ValidationError);
  });
});

describe('generalised Lomb–Scargle', () => {
  it('gives power 1 at the frequency of a noise-free sinusoid with an offset', () => {
    const { t, sigma } = series(1);
    const grid = frequencyGrid(t);
    const k = 300;
    const f = gridFrequency(grid, k);
    const y = t.map((ti) => 12.5 + 4 * Math.cos(2 * Math.PI * f * ti + 0.7));
    // A noise-free sinusoid is fitted exactly: χ² = 0, so p = 1 (ZK09 normalisation, property).
    const power = glsPeriodogram(t, y, sigma, grid);
    expect(power[k]).toBeCloseTo(1, 9);
    expect(argMax(power)).toBe(k);
    const fit = glsAt(t, y, sigma, f);
    expect(fit.amplitudeMps).toBeCloseTo(4, 9);
    expect(fit.offsetMps).toBeCloseTo(12.5, 9);
    // The fitted maximum is a crest of the input curve (property).
    expect(Math.cos(2 * Math.PI * f * fit.timeOfMaxBjdTdb + 0.7)).toBeCloseTo(1, 9);
  });

  it('with equal weights and the offset fixed at zero equals the classical Lomb–Scargle', () => {
    const { t, y: raw } = series(2);
    const mean = raw.reduce((a, b) => a + b, 0) / raw.length;
    const y = raw.map((v) => v - mean);
    const grid = frequencyGrid(t, { oversample: 4 });
    const power = glsKernel(
      t,
      t.map(() => 1),
      grid,
      'fixed-zero',
    ).power(y);
    const yy = y.reduce((s, v) => s + v * v, 0);
    for (let k = 0; k < grid.count; k += 7) {
      const w = 2 * Math.PI * gridFrequency(grid, k);
      // Classical periodogram with the time offset τ (Lomb 1976, Ap&SS 39, 447; Scargle 1982, ApJ 263, 835):
      // tan 2ωτ = Σ sin 2ωt / Σ cos 2ωt; P = [ (Σ y cos ω(t−τ))² / Σ cos² + (Σ y sin ω(t−τ))² / Σ sin² ] / Σ y².
      const tau =
        Math.atan2(
          t.reduce((s, ti) => s + Math.sin(2 * w * ti), 0),
          t.reduce((s, ti) => s + Math.cos(2 * w * ti), 0),
        ) /
        (2 * w);
      let yc = 0,
        ys = 0,
        cc = 0,
        ss = 0;
      t.forEach((ti, i) => {
        const c = Math.cos(w * (ti - tau)),
          s = Math.sin(w * (ti - tau));
        yc += y[i]! * c;
        ys += y[i]! * s;
        cc += c * c;
        ss += s * s;
      });
      expect(power[k]).toBeCloseTo(((yc * yc) / cc + (ys * ys) / ss) / yy, 9);
    }
  });

  it('equals the χ² reduction of a direct weighted least-squares fit', () => {
    const { t, y, sigma } = series(3);
    const grid = frequencyGrid(t, { oversample: 3 });
    const power = glsPeriodogram(t, y, sigma, grid);
    const chi2Mean = chi2OfFit(t, y, sigma, [() => 1]);
    for (let k = 5; k < grid.count; k += 41) {
      const w = 2 * Math.PI * gridFrequency(grid, k);
      // Slow reference: p = (χ²₀ − χ²(ω)) / χ²₀ (ZK09 definition of the normalised power).
      const chi2 = chi2OfFit(t, y, sigma, [() => 1, (ti) => Math.cos(w * (ti - 2_461_000)), (ti) => Math.sin(w * (ti - 2_461_000))]);
      expect(power[k]).toBeCloseTo((chi2Mean - chi2) / chi2Mean, 7);
    }
  });

  it('the recurrence kernel matches direct trigonometry at every frequency', () => {
    const { t, y, sigma } = series(4, 40);
    const grid = frequencyGrid(t, { minPeriodDays: 0.5, oversample: 10 });
    const power = glsPeriodogram(t, y, sigma, grid);
    let worst = 0;
    for (let k = 0; k < grid.count; k++) worst = Math.max(worst, Math.abs(power[k]! - glsAt(t, y, sigma, gridFrequency(grid, k)).power));
    expect(grid.count).toBeGreaterThan(1000);
    expect(worst).toBeLessThan(1e-9);
  });

  it('does not depend on the time origin, a constant added to the values, or their scale', () => {
    const { t, y, sigma } = series(5);
    const grid = frequencyGrid(t);
    const base = glsPeriodogram(t, y, sigma, grid);
    const shifted = glsPeriodogram(
      t.map((ti) => ti - 2_461_000),
      y.map((v) => 3 * v - 40),
      sigma,
      grid,
    );
    base.forEach((p, k) => {
      expect(shifted[k]).toBeCloseTo(p, 9);
    });
  });

  it('finds the injected period as the highest of distinct peaks', () => {
    const { t, y, sigma } = series(6);
    const grid = frequencyGrid(t);
    const power = glsPeriodogram(t, y, sigma, grid);
    const peaks = findPeaks(power, grid, 5);
    expect(peaks).toHaveLength(5);
    // A peak is about 1/T wide (common practice): the best one lies within half of that of the signal.
    expect(Math.abs(peaks[0]!.freqPerDay - 1 / 7.7)).toBeLessThan(0.5 / grid.baselineDays);
    for (let i = 0; i < peaks.length; i++) {
      expect(power[peaks[i]!.index]).toBe(peaks[i]!.power);
      if (i > 0) expect(peaks[i]!.power).toBeLessThanOrEqual(peaks[i - 1]!.power);
      for (let j = 0; j < i; j++) expect(Math.abs(peaks[i]!.index - peaks[j]!.index)).toBeGreaterThan(1);
    }
  });
});
