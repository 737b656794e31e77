// Weather: each night is clear with its own probability, independently of the others (the
// site's clear-night fraction, per month if given; common practice). A clouded night loses all
// its visits. The plan is replayed over seeded random weather to estimate, per target, the
// probability of reaching K/sigma_K >= goal, and the mean of K/sigma_K and of the utility.
import { createRng } from '../rv/random.js';
import { compileProblem } from './compile.js';
import { EPHEMERIS_STATS, ephemerisInformation, updateEphemerisStats } from './objective-ephemeris.js';
import { searchLogScore, searchStatsLength, updateSearchStats } from './objective-search.js';
import type { ScheduleProblem, ScheduleResult } from './types.js';
import { goalValue } from './utility.js';

export interface WeatherOptions {
  /** Must match the optimiser's (default 48 and 0.1). */
  searchGridSize?: number;
  overshootWeight?: number;
}

export interface WeatherOutcome {
  trials: number;
  seed: number;
  /** Mean number of planned nights with visits that were clear. */
  meanClearNights: number;
  meanUtility: number;
  targets: { targetId: string; goalProbability: number; meanKOverSigmaK: number }[];
}

/** Replays `result`'s visits of `problem` under `trials` seeded weather draws. */
export function simulateWeather(problem: ScheduleProblem, result: ScheduleResult, trials: number, seed: number, options: WeatherOptions = {}): WeatherOutcome {
  const c = compileProblem(problem, options.searchGridSize ?? 48);
  const overshoot = options.overshootWeight ?? 0.1;
  const byId = new Map<string, number>();
  for (let j = 0; j < c.slotCount; j++) byId.set(problem.slots[c.slotSource[j]!]!.slotId, j);
  const visits = result.slotIds.map((id) => {
    const j = byId.get(id);
    if (j === undefined) throw new Error(`schedule result names slot ${id}, which the problem does not have`);
    return j;
  });
  const usedNights = [...new Set(visits.map((j) => c.slotNight[j]!))].sort((a, b) => a - b);
  const clearProbability = usedNights.map((n) => problem.nights[c.nightOrder[n]!]!.clearProbability);
  const perTarget: number[][] = problem.targets.map(() => []);
  for (const j of visits) perTarget[c.slotTarget[j]!]!.push(j);

  const rng = createRng(seed);
  const clear = new Uint8Array(c.nightCount);
  const reached = new Float64Array(c.targetCount);
  const sumRatio = new Float64Array(c.targetCount);
  const stats = new Float64Array(Math.max(EPHEMERIS_STATS, ...c.grids.map((g) => (g ? searchStatsLength(g) : 0))));
  let clearNights = 0;
  let utility = 0;
  for (let trial = 0; trial < trials; trial++) {
    usedNights.forEach((n, i) => {
      clear[n] = rng.uniform() < clearProbability[i]! ? 1 : 0;
      clearNights += clear[n]!;
    });
    for (let t = 0; t < c.targetCount; t++) {
      stats.fill(0);
      const grid = c.grids[t];
      for (const j of perTarget[t]!) {
        if (!clear[c.slotNight[j]!]) continue;
        if (grid) updateSearchStats(stats, 0, grid, c.weight[j]!, c.valueA[j]!, 1);
        else updateEphemerisStats(stats, 0, c.weight[j]!, c.valueA[j]!, c.valueB[j]!, 1);
      }
      const ratio = grid ? Math.exp(searchLogScore(stats, 0, grid)) : c.kMps[t]! * Math.sqrt(ephemerisInformation(stats, 0));
      sumRatio[t] += ratio;
      // A hair of tolerance so a plan that reaches the goal exactly counts as reaching it.
      if (ratio >= c.goal[t]! * (1 - 1e-9)) reached[t]++;
      utility += c.priority[t]! * goalValue(ratio / c.goal[t]!, overshoot);
    }
  }
  return {
    trials,
    seed,
    meanClearNights: clearNights / trials,
    meanUtility: utility / trials,
    targets: problem.targets.map((target, t) => ({ targetId: target.id, goalProbability: reached[t]! / trials, meanKOverSigmaK: sumRatio[t]! / trials })),
  };
}
