import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/rv/random.js';
import { compileProblem } from '../../src/schedule/compile.js';
import { searchCompleteness, searchStatsLength, updateSearchStats } from '../../src/schedule/objective-search.js';
import { referenceCompleteness } from '../../reference/search-completeness.js';
import { referenceKOverSigmaK } from '../../reference/schedule.js';
import { PlanState } from '../../src/schedule/state.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import { goalValue } from '../../src/schedule/utility.js';

describe('the plan state against a recomputation from scratch', () => {
  it("keeps every planet's K/sigma_K and every search's completeness equal to fresh accumulators, also after removals", () => {
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
    const c = compileProblem(problem);
    const state = new PlanState(c, Infinity, 0.1);
    for (let n = 0; n < c.nightCount; n++) state.openNight(n);
    const rng = createRng(3);
    const chosen: number[] = [];
    for (let j = 0; j < c.slotCount; j++) if (rng.uniform() < 0.3) chosen.push(j);
    const dropped = chosen.filter(() => rng.uniform() < 0.3);
    for (const j of chosen) state.add(j);
    for (const j of dropped) state.remove(j);
    const kept = chosen.filter((j) => !dropped.includes(j)).map((j) => problem.slots[c.slotSource[j]!]!);
    const expected = referenceKOverSigmaK(problem, kept);
    let k = 0;
    problem.targets.forEach((target, t) => {
      target.planets.forEach((planet, i) => {
        expect(state.planetFractionOfGoal(c.planetFrom[t]! + i) * planet.goalSignificance).toBeCloseTo(expected[k++]!, 8);
      });
      if (target.search) expect(state.searchCompleteness(t, 0, 0)).toBeCloseTo(expected[k++]!, 8);
    });
    expect(k).toBe(expected.length);
  });
});

describe('search completeness', () => {
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
  const c = compileProblem(problem);
  const grid = c.grids[0]!;
  const completenessOf = (slots: number[]) => {
    const stats = new Float64Array(searchStatsLength(grid));
    for (const j of slots) updateSearchStats(stats, 0, grid, c.weight[j]!, c.midBjdTdb[j]!, 1);
    return searchCompleteness(stats, 0, grid);
  };

  it('a visit priced in equals the visit added, and a visit removed restores the completeness', () => {
    const stats = new Float64Array(searchStatsLength(grid));
    let before = searchCompleteness(stats, 0, grid);
    for (let j = 0; j < c.slotCount; j += 3) {
      const next = searchCompleteness(stats, 0, grid, 1, c.weight[j]!, c.midBjdTdb[j]!);
      updateSearchStats(stats, 0, grid, c.weight[j]!, c.midBjdTdb[j]!, 1);
      expect(searchCompleteness(stats, 0, grid)).toBeCloseTo(next, 10);
      expect(searchCompleteness(stats, 0, grid, -1, c.weight[j]!, c.midBjdTdb[j]!)).toBeCloseTo(before, 9);
      before = next;
    }
    expect(before).toBeGreaterThan(0);
  });

  it('the table and two phase nodes stay within 0.002 of the Poisson series integrated over 64 phases (slow reference)', () => {
    const rng = createRng(8);
    for (let trial = 0; trial < 6; trial++) {
      const slots = Array.from({ length: c.slotCount }, (_, j) => j).filter(() => rng.uniform() < 0.1 + 0.05 * trial);
      const exact = referenceCompleteness(
        grid,
        slots.map((j) => c.midBjdTdb[j]!),
        slots.map((j) => c.weight[j]!),
        'exact',
      );
      expect(Math.abs(completenessOf(slots) - exact)).toBeLessThan(0.002);
    }
  });

  it('prefers visits spread in phase to visits bunched at one phase', () => {
    const stats = (times: number[]) => {
      const s = new Float64Array(searchStatsLength(grid));
      for (const t of times) updateSearchStats(s, 0, grid, 4, t, 1);
      return searchCompleteness(s, 0, grid);
    };
    // Twelve visits in one night sit at one phase of every searched period; twelve 3.1 days apart do not.
    const t0 = c.midBjdTdb[0]!;
    const bunched = stats(Array.from({ length: 12 }, (_, i) => t0 + i * 0.02));
    const spread = stats(Array.from({ length: 12 }, (_, i) => t0 + i * 3.1));
    expect(spread).toBeGreaterThan(bunched + 0.1);
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
