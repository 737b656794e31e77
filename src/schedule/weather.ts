// Weather: each night is clear with its own probability, independently of the others (the
// site's clear-night fraction, per month if given; common practice). A clouded night loses all
// its visits. The plan is replayed over seeded random weather to estimate, per target, the
// probability of reaching K/sigma_K >= goal (a search: its completeness goal), and the mean of
// K/sigma_K (a search: of its completeness) and of the utility, per planet and per search (each star's information rebuilt from its clear visits every trial),
// and the probability that every planet and search reaches its goal in the same trial.
import { createRng, type Rng } from '../rv/random.js';
import { type CompiledProblem, compileProblem } from './compile.js';
import { StarOutcomes } from './star-outcomes.js';
import { PlanState } from './state.js';
import type { ScheduleProblem, ScheduleResult } from './types.js';
import { goalValue } from './utility.js';

export interface WeatherOptions {
  /** Must match the optimiser's (default 0.1). */
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
  /** meanKOverSigmaK of a search is its mean completeness. */
  targets: { targetId: string; goalProbability: number; meanKOverSigmaK: number }[];
}

/** The plan's visits as compiled slot positions, each star's in time order, and the calendar nights they use with their clear probabilities. */
export function plannedSlots(c: CompiledProblem, result: ScheduleResult): { perTarget: number[][]; usedNights: number[]; clearProbability: number[] } {
  const problem = c.problem;
  const byId = new Map<string, number>();
  for (let j = 0; j < c.slotCount; j++) byId.set(problem.slots[c.slotSource[j]!]!.slotId, j);
  const visits = result.slotIds.map((id) => {
    const j = byId.get(id);
    if (j === undefined) throw new Error(`schedule result names slot ${id}, which the problem does not have`);
    return j;
  });
  const usedNights = [...new Set(visits.map((j) => c.slotDay[j]!))].sort((a, b) => a - b);
  const dayNight = new Map<number, number>();
  for (const j of visits) dayNight.set(c.slotDay[j]!, c.slotNight[j]!);
  const clearProbability = usedNights.map((d) => problem.nights[c.nightOrder[dayNight.get(d)!]!]!.clearProbability);
  const perTarget: number[][] = problem.targets.map(() => []);
  for (const j of visits) perTarget[c.slotTarget[j]!]!.push(j);
  return { perTarget, usedNights, clearProbability };
}

/**
 * The weather draws of one trial: clear[d] = 1 for each used calendar night that is clear. The same seed
 * gives the same sequence of draws in every replay of the same plan (weather.ts, need.ts).
 */
export function drawWeather(rng: Rng, usedNights: number[], clearProbability: number[], clear: Uint8Array): number {
  let clearNights = 0;
  usedNights.forEach((n, i) => {
    clear[n] = rng.uniform() < clearProbability[i]! ? 1 : 0;
    clearNights += clear[n]!;
  });
  return clearNights;
}

/** A hair of tolerance so a plan that reaches the goal exactly counts as reaching it. */
export const reachesGoal = (value: number, goal: number) => value >= goal * (1 - 1e-9);

/** Replays `result`'s visits of `problem` under `trials` seeded weather draws. */
export function simulateWeather(problem: ScheduleProblem, result: ScheduleResult, trials: number, seed: number, options: WeatherOptions = {}): WeatherOutcome {
  const c = compileProblem(problem);
  const overshoot = options.overshootWeight ?? 0.1;
  const { perTarget, usedNights, clearProbability } = plannedSlots(c, result);
  const rng = createRng(seed);
  const clear = new Uint8Array(c.dayCount);
  const outcomes = new StarOutcomes(c);
  const reached = new Float64Array(outcomes.ids.length);
  const sumRatio = new Float64Array(outcomes.ids.length);
  const value = new Float64Array(outcomes.ids.length);
  // The plan state with prior visits alone gives each target's overshoot weight (utility.ts).
  const prior = new PlanState(c, Infinity, overshoot);
  const weight = Float64Array.from(outcomes.ids, (_, i) => (i < c.planetK.length ? prior.planetOvershoot[i]! : 0));
  outcomes.searchOutcome.forEach((at, t) => {
    if (at >= 0) weight[at] = prior.searchOvershoot[t]!;
  });
  let clearNights = 0;
  let utility = 0;
  let allReached = 0;
  for (let trial = 0; trial < trials; trial++) {
    let missed = false;
    clearNights += drawWeather(rng, usedNights, clearProbability, clear);
    for (let t = 0; t < c.targetCount; t++) {
      // Prior visits were made whatever the weather ahead.
      outcomes.start(t);
      for (const j of perTarget[t]!) if (clear[c.slotDay[j]!]) outcomes.add(j);
      outcomes.values(value);
      for (const at of outcomes.ofStar[t]!) {
        sumRatio[at] += value[at]!;
        if (reachesGoal(value[at]!, outcomes.goal[at]!)) reached[at]++;
        else missed = true;
        utility += outcomes.priority[at]! * goalValue(value[at]! / outcomes.goal[at]!, weight[at]!);
      }
    }
    if (!missed) allReached++;
  }
  return {
    trials,
    seed,
    meanClearNights: clearNights / trials,
    meanUtility: utility / trials,
    allGoalsProbability: allReached / trials,
    targets: outcomes.ids.map((targetId, i) => ({ targetId, goalProbability: reached[i]! / trials, meanKOverSigmaK: sumRatio[i]! / trials })),
  };
}
