// Map helpers (log axes, detection levels) and the parallel injection–recovery: the same map for
// any thread count, equal to the one-thread core, rising with mass.
import { existsSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { injectionRecovery, type InjectionInput, type InjectionMap } from '../../src/rv/injection.js';
import { levelMass, levelRows, logSpaced } from '../../src/rv/injection-map.js';
import { normalCdf } from '../../src/rv/normal-cdf.js';
import { createRng } from '../../src/rv/random.js';

// Worker threads need the compiled worker script: the pool is imported from dist/ (`npm test`
// builds it; run `npm run build` before running this file alone).
const POOL = new URL('../../dist/rv/injection-worker-pool.js', import.meta.url);
type Pool = {
  injectionRecoveryParallel(input: InjectionInput, options: { threads: number; onProgress?: (done: number, total: number) => void }): Promise<InjectionMap>;
};

describe('log-spaced axes', () => {
  it('run from min to max with a constant ratio', () => {
    const axis = logSpaced(2, 60, 7);
    expect(axis[0]).toBe(2);
    expect(axis[6]).toBe(60);
    const ratios = axis.slice(1).map((v, i) => v / axis[i]!);
    for (const r of ratios) expect(r).toBeCloseTo(30 ** (1 / 6), 12);
    expect(logSpaced(5, 9, 1)).toEqual([5]);
    expect(() => logSpaced(0, 3, 4)).toThrow(RangeError);
  });
});

describe('detection level along a row', () => {
  // A smooth row p(m) = Φ(ln(m / 20) / 0.4): the 50% mass is 20 and the 90% mass 20 e^(0.4 · 1.2816)
  // (the normal quantile 1.2816 of 0.9, common tables). Linear interpolation in log mass on a grid
  // of ratio 1.1 is close to exact.
  const masses = logSpaced(5, 100, 33);
  const row = masses.map((m) => normalCdf(Math.log(m / 20) / 0.4));

  it('interpolates the 50% and 90% masses in log mass', () => {
    const m50 = levelMass(masses, row, 0.5);
    const m90 = levelMass(masses, row, 0.9);
    expect(m50.where).toBe('inside');
    expect(m50.where === 'inside' && m50.msiniEarth).toBeCloseTo(20, 1);
    expect(m90.where === 'inside' && m90.msiniEarth / (20 * Math.exp(0.4 * 1.2816))).toBeCloseTo(1, 2);
  });

  it('says when a level lies off the grid', () => {
    expect(levelMass(masses.slice(0, 5), row.slice(0, 5), 0.5)).toEqual({ where: 'above grid' });
    expect(levelMass(masses.slice(-5), row.slice(-5), 0.9)).toEqual({ where: 'below grid' });
    const rows = levelRows([3, 7], masses, [row, row.map(() => 0)]);
    expect(rows[1]!.levels.map((l) => l.mass.where)).toEqual(['above grid', 'above grid']);
  });
});

/** 14 visits on random nights over 60 days, σ_eff 1.5–2.5 m/s (invented). */
function visits(): Pick<InjectionInput, 'timesBjdTdb' | 'rvErrorsMps'> {
  const rng = createRng(11);
  const nights = new Set<number>();
  while (nights.size < 14) nights.add(Math.floor(60 * rng.uniform()));
  const timesBjdTdb = [...nights].sort((a, b) => a - b).map((n) => 2_461_300.6 + n + 0.2 * rng.uniform());
  return { timesBjdTdb, rvErrorsMps: timesBjdTdb.map(() => 1.5 + rng.uniform()) };
}

describe.skipIf(!existsSync(POOL))('parallel injection–recovery (worker threads)', () => {
  const input: InjectionInput = { ...visits(), periodsDays: [3.1, 8.7], msinisEarth: [2, 6, 12, 25, 50], starMassSun: 0.85, trialsPerCell: 60, seed: 21 };

  it('gives the same map with 1 and 2 threads, equal to the one-thread core', async () => {
    const pool = (await import(pathToFileURL(POOL.pathname).href)) as Pool;
    const done: number[] = [];
    const one = await pool.injectionRecoveryParallel(input, { threads: 1 });
    const two = await pool.injectionRecoveryParallel(input, { threads: 2, onProgress: (d) => done.push(d) });
    expect(two.detection).toEqual(one.detection);
    expect(one.detection).toEqual(injectionRecovery(input).detection);
    expect(done).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  });

  it('detection probability rises with mass at fixed period', async () => {
    const pool = (await import(pathToFileURL(POOL.pathname).href)) as Pool;
    const map = await pool.injectionRecoveryParallel(input, { threads: 2 });
    for (const row of map.detection) {
      // Property: a larger signal at the same period is found at least as often, up to sampling
      // error (two binomial standard errors of a difference at p = 0.5: 2 · √2 · 0.5/√60 ≈ 0.18).
      for (let j = 1; j < row.length; j++) expect(row[j]!).toBeGreaterThanOrEqual(row[j - 1]! - 0.18);
      // 2 M⊕ (K ≈ 0.9 m/s at 3 d) is rarely found with 14 visits of 2 m/s; 50 M⊕ (K > 15 m/s) always.
      expect(row[0]).toBeLessThan(0.2);
      expect(row.at(-1)).toBe(1);
    }
  });
});
