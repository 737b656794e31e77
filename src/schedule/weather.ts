// Weather: each night is clear with its own probability, independently of the others (the
// site's clear-night fraction, per month if given; common practice). A clouded night loses all
// its visits. The plan is replayed over seeded random weather to estimate, per target, the
// probability of reaching K/sigma_K >= goal, and the mean of K/sigma_K and of the utility, per
// planet and per search (each star's information rebuilt from its clear visits every trial),
// and the probability that every planet and search reaches its goal in the same trial.
import { createRng } from '../rv/random.js';
import { StarInformation } from '../rv/information.js';
import { compileProblem, SlotVisit, slotTrig } from './compile.js';
import { searchLogScore, searchStatsLength, updateSearchStatsWith } from './objective-search.js';
import { seedInformation, seedSearchStats } from './prior.js';
import { PlanState } from './state.js';
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
  /** Fraction of trials in which every planet and search reached its goal (1 when there is none). */
  allGoalsProbability: number;
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
  // Outcome slots: the planets in compiled order, then one per search.
  const searchSlot = new Int32Array(c.targetCount).fill(-1);
  const ids = problem.targets.flatMap((t) => t.planets.map((p) => p.id));
  problem.targets.forEach((t, i) => {
    if (t.search) searchSlot[i] = ids.push(t.search.id) - 1;
  });
  const reached = new Float64Array(ids.length);
  const sumRatio = new Float64Array(ids.length);
  const stats = new Float64Array(Math.max(1, ...c.grids.map((g) => (g ? searchStatsLength(g) : 0))));
  const information = c.models.map((model) => (model ? new StarInformation(model) : null));
  const visit = new SlotVisit(c);
  const variance = new Float64Array(Math.max(1, ...c.models.map((m) => m?.planetCount ?? 0)));
  let clearNights = 0;
  let utility = 0;
  let allReached = 0;
  let missed = false;
  // The plan state with prior visits alone gives each target's overshoot weight (utility.ts).
  const prior = new PlanState(c, Infinity, overshoot);
  const count = (slot: number, ratio: number, goalSignificance: number, priority: number, weight: number) => {
    sumRatio[slot] += ratio;
    // A hair of tolerance so a plan that reaches the goal exactly counts as reaching it.
    if (ratio >= goalSignificance * (1 - 1e-9)) reached[slot]++;
    else missed = true;
    utility += priority * goalValue(ratio / goalSignificance, weight);
  };
  for (let trial = 0; trial < trials; trial++) {
    missed = false;
    usedNights.forEach((n, i) => {
      clear[n] = rng.uniform() < clearProbability[i]! ? 1 : 0;
      clearNights += clear[n]!;
    });
    for (let t = 0; t < c.targetCount; t++) {
      const grid = c.grids[t];
      const info = information[t];
      // Prior visits were made whatever the weather ahead.
      seedSearchStats(stats, c, c.prior, t, 0);
      if (info) {
        info.clear();
        seedInformation(info, c.prior, t);
      }
      for (const j of perTarget[t]!) {
        if (!clear[c.slotNight[j]!]) continue;
        if (grid) updateSearchStatsWith(stats, 0, grid, c.weight[j]!, slotTrig(c, j));
        if (info) {
          visit.slot = j;
          info.apply(visit, 1);
        }
      }
      if (info) {
        info.variances(variance);
        for (let i = 0; i < info.planetCount; i++) {
          const at = c.planetFrom[t]! + i;
          count(
            at,
            variance[i] === Infinity ? 0 : c.planetK[at]! / Math.sqrt(variance[i]!),
            c.planetGoalSignificance[at]!,
            c.planetPriority[at]!,
            prior.planetOvershoot[at]!,
          );
        }
      }
      if (grid) count(searchSlot[t]!, Math.exp(searchLogScore(stats, 0, grid)), c.searchGoalSignificance[t]!, c.searchPriority[t]!, prior.searchOvershoot[t]!);
    }
    if (!missed) allReached++;
  }
  return {
    trials,
    seed,
    meanClearNights: clearNights / trials,
    meanUtility: utility / trials,
    allGoalsProbability: allReached / trials,
    targets: ids.map((targetId, i) => ({ targetId, goalProbability: reached[i]! / trials, meanKOverSigmaK: sumRatio[i]! / trials })),
  };
}
