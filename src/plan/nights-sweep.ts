// How many nights to ask for: the campaign planned in full for each night count of a range
// (choose-nights), each plan with its own weather trials, so that a proposer can read, per count,
// each goal's probability, the probability of reaching them all, the dark time left idle, and
// what the request from need asks at that count.
import type { Campaign } from './campaign.js';
import { buildPlan, type PlanOptions } from './build-plan.js';
import type { Plan, SweepRow } from './plan-schema.js';

/** The campaign asking for `nights` nights (choose-nights). */
export function withNightCount(campaign: Campaign, nights: number): Campaign {
  const halfNights = campaign.time.mode === 'choose-nights' && campaign.time.halfNights;
  return { ...campaign, time: { mode: 'choose-nights', nights, ...(halfNights ? { halfNights } : {}) } };
}

/** What one plan gives as a row of the sweep. */
export function sweepRow(plan: Plan, nights: number): SweepRow {
  const t = plan.totals;
  return {
    nights,
    visits: t.visits,
    totalHours: t.totalHours,
    darkHours: t.darkHours ?? 0,
    idleHours: t.idleHours ?? 0,
    allGoalsProbability: t.allGoalsProbability ?? 0,
    ...(t.request
      ? {
          requestedVisits: t.request.visits,
          requestedHours: t.request.hours,
          goalsAtProbability: plan.targets.filter((s) => s.request?.reachable).length,
        }
      : {}),
    goals: plan.targets.flatMap((s) => (s.goalProbability === undefined ? [] : [{ targetId: s.targetId, goalProbability: s.goalProbability }])),
  };
}

/**
 * The sweep over `counts`: each count planned as `crest plan --nights n` would (same seed and
 * options). `known` holds plans already built, by count, so the campaign's own plan is not built twice.
 */
export function nightsSweep(
  campaign: Campaign,
  counts: number[],
  options: PlanOptions = {},
  known: ReadonlyMap<number, Plan> = new Map(),
  /** Called after each count with (counts done, counts in all). */
  onProgress?: (done: number, total: number) => void,
): SweepRow[] {
  return counts.map((n, i) => {
    const row = sweepRow(known.get(n) ?? buildPlan(withNightCount(campaign, n), options), n);
    onProgress?.(i + 1, counts.length);
    return row;
  });
}
