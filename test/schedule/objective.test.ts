import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/rv/random.js';
import { compileProblem } from '../../src/schedule/compile.js';
import { searchLogScore, searchStatsLength, updateSearchStats } from '../../src/schedule/objective-search.js';
import { referenceKOverSigmaK } from '../../reference/schedule.js';
import { PlanState } from '../../src/schedule/state.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import { goalValue } from '../../src/schedule/utility.js';

describe('the plan state against a recomputation from scratch', () => {
  it("keeps every planet's K/sigma_K and every search score equal to fresh accumulators, also after removals", () => {
    const problem = syntheticProblem({
      targets: 5,
      nights: 15,
      slotsPerNight: 3,
      searchFraction: 0.4,
      visibleFraction: 0.8,
      time: { mode: 'given-nights' },
      minSpacingHours: 0,
      onePerNight: false,
      nightHours: 8,
      seed: 11,
      phaseErrors: true,
    });
    const c = compileProblem(problem, 16);
    const state = new PlanState(c, Infinity, 0.1);
    for (let n = 0; n < c.nightCount; n++) state.openNight(n);
    const rng = createRng(3);
    const chosen: number[] = [];
    for (let j = 0; j < c.slotCount; j++) if (rng.uniform() < 0.3) chosen.push(j);
    const dropped = chosen.filter(() => rng.uniform() < 0.3);
    for (const j of chosen) state.add(j);
    for (const j of dropped) state.remove(j);
    const kept = chosen.filter((j) => !dropped.includes(j)).map((j) => problem.slots[c.slotSource[j]!]!);
    const expected = referenceKOverSigmaK(problem, kept, { searchGridSize: 16, overshootWeight: 0.1 });
    let k = 0;
    problem.targets.forEach((target, t) => {
      target.planets.forEach((planet, i) => {
        expect(state.planetFractionOfGoal(c.planetFrom[t]! + i) * planet.goalSignificance).toBeCloseTo(expected[k++]!, 8);
      });
      if (target.search) expect(state.searchFractionOfGoal(t, 0, 0) * target.search.goalSignificance).toBeCloseTo(expected[k++]!, 8);
    });
    expect(k).toBe(expected.length);
  });
});

describe('search coverage', () => {
  const problem = syntheticProblem({
    targets: 1,
    nights: 40,
    slotsPerNight: 2,
    searchFraction: 1,
    visibleFraction: 1,
    time: { mode: 'given-nights' },
    minSpacingHours: 0,
    onePerNight: false,
    nightHours: 8,
    seed: 5,
    phaseErrors: false,
  });
  const c = compileProblem(problem, 32);
  const grid = c.grids[0]!;

  it('never falls when a visit is added, and a visit removed restores the score', () => {
    const stats = new Float64Array(searchStatsLength(grid));
    let score = searchLogScore(stats, 0, grid);
    for (let j = 0; j < c.slotCount; j += 3) {
      const next = searchLogScore(stats, 0, grid, 1, c.weight[j]!, c.midBjdTdb[j]!);
      expect(next).toBeGreaterThanOrEqual(score - 1e-12);
      updateSearchStats(stats, 0, grid, c.weight[j]!, c.midBjdTdb[j]!, 1);
      expect(searchLogScore(stats, 0, grid)).toBeCloseTo(next, 10);
      expect(searchLogScore(stats, 0, grid, -1, c.weight[j]!, c.midBjdTdb[j]!)).toBeCloseTo(score, 9);
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
    const pMin = problem.targets[0]!.search!.periodMinDays;
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
