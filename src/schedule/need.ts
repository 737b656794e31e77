// Time from need: how many of the plan's visits each star needs so that its planets and search
// reach their goals with a chosen probability under the site's weather, the rest being spare.
//
// Order of value: each star's planned visits are dropped one at a time (backward elimination, a
// standard subset-selection scheme: Miller 2002, Subset Selection in Regression, ch. 3, from
// memory), always the visit whose removal leaves the largest sum over the star's outcomes of
// log(value/goal) on clear nights (K/sigma_K for a planet, the completeness for a search: balanced, so
// no outcome is starved for another); read backwards, the drops rank the visits most valuable first.
//
// Probability: the weather trials of weather.ts are replayed with the same seed (the same clear
// nights in every trial). Information only grows as visits are added (Fisher information is a sum
// of positive semi-definite terms), so in each trial an outcome reached by the first n visits of
// that order stays reached for every longer prefix: P(goal | first n) is non-decreasing in n,
// and the need of an outcome is the smallest n with P >= the chosen probability, or every
// planned visit when even all of them fall short. A star's request is the largest need of its
// outcomes; at the full count the probabilities are the weather replay's exactly.
import { createRng } from '../rv/random.js';
import { compileProblem } from './compile.js';
import { StarOutcomes } from './star-outcomes.js';
import type { ScheduleProblem, ScheduleResult } from './types.js';
import { drawWeather, plannedSlots, reachesGoal } from './weather.js';

export interface OutcomeNeed {
  /** The planet's or search's id, and its star's. */
  targetId: string;
  starId: string;
  /** Fewest planned visits of its star (in order of value) that reach the goal with the chosen probability; all of them when none do. */
  neededVisits: number;
  /** Whether the chosen probability is reached with neededVisits. */
  reachable: boolean;
  /** Probability of reaching the goal with the star's requested visits (its outcomes' largest need). */
  goalProbability: number;
}

export interface StarNeed {
  starId: string;
  /** The star's planned slot ids, most valuable first. */
  slotIdsByValue: string[];
  /** Visits requested: the first this many of slotIdsByValue. */
  requestedVisits: number;
}

export interface NeedResult {
  probability: number;
  outcomes: OutcomeNeed[];
  stars: StarNeed[];
}

const logFraction = (value: number, goal: number) => Math.log(1e-12 + value / goal);

/** Star t's planned slots (compiled positions), most valuable first, by backward elimination on clear nights. */
function byValue(outcomes: StarOutcomes, t: number, slots: number[]): number[] {
  const kept = [...slots];
  const dropped: number[] = [];
  const value = new Float64Array(outcomes.ids.length);
  const positions = outcomes.ofStar[t]!;
  while (kept.length > 0) {
    outcomes.start(t);
    for (const j of kept) outcomes.add(j);
    let best = 0;
    let bestScore = -Infinity;
    kept.forEach((j, k) => {
      outcomes.values(value, j);
      let score = 0;
      for (const at of positions) score += logFraction(value[at]!, outcomes.goal[at]!);
      // Ties go to the later visit, so equal visits keep the earlier ones.
      if (score >= bestScore) {
        bestScore = score;
        best = k;
      }
    });
    dropped.push(kept.splice(best, 1)[0]!);
  }
  return dropped.reverse();
}

/**
 * The visits each star of `result` needs to reach its goals with `probability` under `trials`
 * weather draws of `seed` (those of simulateWeather with the same seed).
 */
export function needFromPlan(problem: ScheduleProblem, result: ScheduleResult, probability: number, trials: number, seed: number): NeedResult {
  const c = compileProblem(problem);
  const { perTarget, usedNights, clearProbability } = plannedSlots(c, result);
  const outcomes = new StarOutcomes(c);
  const order = perTarget.map((slots, t) => byValue(outcomes, t, slots));
  // firstReached[at][n]: trials in which outcome at is first reached by the first n visits of its star.
  const firstReached = outcomes.ids.map((_, at) => new Float64Array(order[outcomes.starOfOutcome[at]!]!.length + 1));
  const value = new Float64Array(outcomes.ids.length);
  const clear = new Uint8Array(c.dayCount);
  const rng = createRng(seed);
  for (let trial = 0; trial < trials; trial++) {
    drawWeather(rng, usedNights, clearProbability, clear);
    for (let t = 0; t < c.targetCount; t++) {
      const positions = outcomes.ofStar[t]!;
      if (!positions.length) continue;
      // All the clear visits first: an outcome they leave short is short for every prefix.
      outcomes.start(t);
      for (const j of order[t]!) if (clear[c.slotDay[j]!]) outcomes.add(j);
      outcomes.values(value);
      let open = positions.filter((at) => reachesGoal(value[at]!, outcomes.goal[at]!));
      if (!open.length) continue;
      // Then the prefixes, from the visits already made alone (n = 0), which may reach a goal by themselves.
      outcomes.start(t);
      outcomes.values(value);
      for (let n = 0; open.length; n++) {
        open = open.filter((at) => {
          if (!reachesGoal(value[at]!, outcomes.goal[at]!)) return true;
          firstReached[at]![n]++;
          return false;
        });
        const j = order[t]![n];
        if (j === undefined || !open.length) break;
        if (!clear[c.slotDay[j]!]) continue;
        outcomes.add(j);
        outcomes.values(value);
      }
    }
  }
  const needs = outcomes.ids.map((_, at) => {
    const counts = firstReached[at]!;
    const cumulative = new Float64Array(counts.length);
    let sum = 0;
    counts.forEach((k, n) => {
      sum += k;
      cumulative[n] = sum / trials;
    });
    const n = cumulative.findIndex((p) => p >= probability);
    return { cumulative, neededVisits: n < 0 ? counts.length - 1 : n, reachable: n >= 0 };
  });
  const requested = outcomes.ofStar.map((positions) => Math.max(0, ...positions.map((at) => needs[at]!.neededVisits)));
  return {
    probability,
    outcomes: outcomes.ids.map((targetId, at) => ({
      targetId,
      starId: problem.targets[outcomes.starOfOutcome[at]!]!.id,
      neededVisits: needs[at]!.neededVisits,
      reachable: needs[at]!.reachable,
      goalProbability: needs[at]!.cumulative[requested[outcomes.starOfOutcome[at]!]!]!,
    })),
    stars: problem.targets.map((target, t) => ({
      starId: target.id,
      slotIdsByValue: order[t]!.map((j) => problem.slots[c.slotSource[j]!]!.slotId),
      requestedVisits: requested[t]!,
    })),
  };
}
