import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/rv/random.js';
import { compileProblem } from '../../src/schedule/compile.js';
import { ephemerisInformation, signalMoments, updateEphemerisStats } from '../../src/schedule/objective-ephemeris.js';
import { searchLogScore, searchStatsLength, updateSearchStats } from '../../src/schedule/objective-search.js';
import { referenceKOverSigmaK } from '../../src/schedule/reference.js';
import { syntheticProblem } from '../../src/schedule/synthetic.js';
import { goalValue } from '../../src/schedule/utility.js';

describe('signal moments under a Gaussian phase error', () => {
  it('reduce to s = -sin(2 pi phase) and s^2 with no error', () => {
    for (const phase of [0, 0.1, 0.25, 0.6, 0.75, 0.93]) {
      const { m, q } = signalMoments(phase, 0);
      expect(m).toBeCloseTo(-Math.sin(2 * Math.PI * phase), 12);
      expect(q).toBeCloseTo(m * m, 12);
    }
  });

  it('match a seeded Monte Carlo average over the phase error', () => {
    const rng = createRng(7);
    for (const [phase, err] of [[0.2, 0.05], [0.7, 0.12], [0.45, 0.3]] as const) {
      let sum = 0;
      let sum2 = 0;
      const n = 200_000;
      for (let i = 0; i < n; i++) {
        const s = -Math.sin(2 * Math.PI * (phase + err * rng.normal()));
        sum += s;
        sum2 += s * s;
      }
      const { m, q } = signalMoments(phase, err);
      // Standard error of a mean of n values bounded by 1: below 1/sqrt(n) = 0.0022.
      expect(Math.abs(sum / n - m)).toBeLessThan(0.01);
      expect(Math.abs(sum2 / n - q)).toBeLessThan(0.01);
    }
  });
});

describe('information on K with a free offset', () => {
  const info = (visits: { w: number; phase: number; err: number }[]) => {
    const stats = new Float64Array(4);
    for (const v of visits) {
      const { m, q } = signalMoments(v.phase, v.err);
      updateEphemerisStats(stats, 0, v.w, m, q, 1);
    }
    return ephemerisInformation(stats, 0);
  };

  it('reaches sigma^2/N for balanced quadratures (docs/references.md [Visits-needed])', () => {
    const visits = Array.from({ length: 10 }, (_, i) => ({ w: 0.25, phase: i % 2 ? 0.25 : 0.75, err: 0 }));
    // sigma = 2 m/s: Var(K) = sigma^2 / N = 0.4, so I = 2.5.
    expect(info(visits)).toBeCloseTo(2.5, 12);
  });

  it('is zero for one visit and for visits at one phase (the offset absorbs them)', () => {
    expect(info([{ w: 1, phase: 0.25, err: 0 }])).toBe(0);
    expect(info([{ w: 1, phase: 0.3, err: 0 }, { w: 2, phase: 0.3, err: 0 }])).toBeCloseTo(0, 12);
  });

  it('tends to the random-phase information sum w (1 - w/W) / 2 for a hopeless ephemeris (docs/references.md [Visits-needed]: sigma_K ~ sigma sqrt(2/N))', () => {
    const visits = Array.from({ length: 8 }, (_, i) => ({ w: 1, phase: i / 8, err: 5 }));
    expect(info(visits)).toBeCloseTo((8 * (1 - 1 / 8)) / 2, 9);
  });

  it('matches the pairwise reference sum on random visits, also after removals', () => {
    const problem = syntheticProblem({ targets: 4, nights: 15, slotsPerNight: 3, searchFraction: 0.5, visibleFraction: 0.8, time: { mode: 'given-nights' }, minSpacingHours: 0, onePerNight: false, nightHours: 8, seed: 11, phaseErrors: true });
    const c = compileProblem(problem, 16);
    const rng = createRng(3);
    const chosen = problem.slots.filter(() => rng.uniform() < 0.3);
    const dropped = chosen.filter(() => rng.uniform() < 0.3);
    const stats = new Float64Array(c.statsLength);
    const slotPos = new Map(Array.from(c.slotSource, (src, j) => [problem.slots[src]!, j]));
    const apply = (slotList: typeof chosen, sign: number) => {
      for (const s of slotList) {
        const j = slotPos.get(s)!;
        const t = c.slotTarget[j]!;
        const grid = c.grids[t];
        if (grid) updateSearchStats(stats, c.statsOffset[t]!, grid, c.weight[j]!, c.valueA[j]!, sign);
        else updateEphemerisStats(stats, c.statsOffset[t]!, c.weight[j]!, c.valueA[j]!, c.valueB[j]!, sign);
      }
    };
    apply(chosen, 1);
    apply(dropped, -1);
    const kept = chosen.filter((s) => !dropped.includes(s));
    const expected = referenceKOverSigmaK(problem, kept, { searchGridSize: 16, overshootWeight: 0.1 });
    problem.targets.forEach((target, t) => {
      const grid = c.grids[t];
      const got = grid ? Math.exp(searchLogScore(stats, c.statsOffset[t]!, grid)) : target.kMps * Math.sqrt(ephemerisInformation(stats, c.statsOffset[t]!));
      expect(got).toBeCloseTo(expected[t]!, 8);
    });
  });
});

describe('search coverage', () => {
  const problem = syntheticProblem({ targets: 1, nights: 40, slotsPerNight: 2, searchFraction: 1, visibleFraction: 1, time: { mode: 'given-nights' }, minSpacingHours: 0, onePerNight: false, nightHours: 8, seed: 5, phaseErrors: false });
  const c = compileProblem(problem, 32);
  const grid = c.grids[0]!;

  it('never falls when a visit is added, and a visit removed restores the score', () => {
    const stats = new Float64Array(searchStatsLength(grid));
    let score = searchLogScore(stats, 0, grid);
    for (let j = 0; j < c.slotCount; j += 3) {
      const next = searchLogScore(stats, 0, grid, 1, c.weight[j]!, c.valueA[j]!);
      expect(next).toBeGreaterThanOrEqual(score - 1e-12);
      updateSearchStats(stats, 0, grid, c.weight[j]!, c.valueA[j]!, 1);
      expect(searchLogScore(stats, 0, grid)).toBeCloseTo(next, 10);
      expect(searchLogScore(stats, 0, grid, -1, c.weight[j]!, c.valueA[j]!)).toBeCloseTo(score, 9);
      score = next;
    }
  });

  it('prefers visits spread in phase to visits bunched at one phase', () => {
    const stats = (times: number[]) => {
      const s = new Float64Array(searchStatsLength(grid));
      for (const t of times) updateSearchStats(s, 0, grid, 1, t, 1);
      return searchLogScore(s, 0, grid);
    };
    // Six visits one minimum period apart sit at one phase of P_min; spread ones do not.
    const pMin = problem.targets[0]!.kind === 'search' ? problem.targets[0]!.periodMinDays : 1;
    const bunched = stats(Array.from({ length: 6 }, (_, i) => i * pMin));
    const spread = stats(Array.from({ length: 6 }, (_, i) => i * pMin * 1.137 + i * i * 0.61));
    expect(spread).toBeGreaterThan(bunched);
  });
});

describe('goal utility', () => {
  it('is linear to the goal, then rises to at most 1 + b, continuously, with non-increasing slope', () => {
    const b = 0.1;
    expect(goalValue(0.5, b)).toBe(0.5);
    expect(goalValue(1, b)).toBe(1);
    expect(goalValue(1 + 1e-9, b)).toBeCloseTo(1, 8);
    expect(goalValue(50, b)).toBeLessThanOrEqual(1 + b);
    let slope = Infinity;
    for (let x = 0; x < 4; x += 0.01) {
      const next = (goalValue(x + 0.01, b) - goalValue(x, b)) / 0.01;
      expect(next).toBeGreaterThanOrEqual(0);
      expect(next).toBeLessThanOrEqual(slope + 1e-9);
      slope = next;
    }
  });
});
