// The time request from need (src/schedule/need.ts) in the plan's terms: per target what its
// star's requested visits give, which planned visits are spare, and the nights the request holds.
// A night counts as a half night when all its requested visits fit in one half of its dark time
// (first: before the middle of the dark span; second: after it).
import type { Night } from '../model.js';
import type { NeedResult } from '../schedule/need.js';
import { darkMiddleMs, type Half, type PlannedHalf, plannedDarkHours } from './half-nights.js';
import type { RequestTotals, TargetSummary } from './plan-schema.js';

/** What the request needs of one planned visit. */
export interface RequestSlot {
  slotId: string;
  localDate: string;
  startMs: number;
  durationSec: number;
}

export interface PlanRequest {
  /** Slot ids of the planned visits the request holds. */
  requestedSlotIds: Set<string>;
  /** Per target id: its summary's request field. */
  byTarget: Map<string, NonNullable<TargetSummary['request']>>;
  totals: RequestTotals;
}

function halfOf(night: Night | undefined, visits: RequestSlot[]): Half | undefined {
  if (!night?.darkStart || !night.darkEnd) return undefined;
  const middleMs = darkMiddleMs(night);
  if (visits.every((v) => v.startMs + v.durationSec * 1000 <= middleMs)) return 'first';
  if (visits.every((v) => v.startMs >= middleMs)) return 'second';
  return undefined;
}

/** The plan's request from the need of each star, its planned slots by id and the nights planned (and those planned by one half). */
export function planRequest(
  need: NeedResult,
  slots: ReadonlyMap<string, RequestSlot>,
  nights: Night[],
  plannedDates: string[],
  plannedHalves: PlannedHalf[] = [],
): PlanRequest {
  const requestedSlotIds = new Set<string>();
  const starHours = new Map<string, { visits: number; hours: number }>();
  for (const star of need.stars) {
    const mine = star.slotIdsByValue.slice(0, star.requestedVisits);
    for (const id of mine) requestedSlotIds.add(id);
    starHours.set(star.starId, { visits: mine.length, hours: mine.reduce((sum, id) => sum + slots.get(id)!.durationSec, 0) / 3600 });
  }
  const byTarget = new Map<string, NonNullable<TargetSummary['request']>>();
  for (const outcome of need.outcomes) {
    const { visits, hours } = starHours.get(outcome.starId)!;
    byTarget.set(outcome.targetId, {
      neededVisits: outcome.neededVisits,
      reachable: outcome.reachable,
      visits,
      hours,
      goalProbability: outcome.goalProbability,
    });
  }
  const requested = [...requestedSlotIds].map((id) => slots.get(id)!);
  const dates = [...new Set(requested.map((v) => v.localDate))].sort();
  const nightOf = new Map(nights.map((n) => [n.localDate, n]));
  // Dates already planned by one half count half a night, and are not offered as half nights again.
  const plannedHalf = new Set(plannedHalves.map((h) => h.localDate));
  const nightsHeld = dates.reduce((sum, d) => sum + (plannedHalf.has(d) ? 0.5 : 1), 0);
  const halfNights = dates
    .filter((d) => !plannedHalf.has(d))
    .flatMap((localDate) => {
      const half = halfOf(
        nightOf.get(localDate),
        requested.filter((v) => v.localDate === localDate),
      );
      return half ? [{ localDate, half }] : [];
    });
  const darkHours = plannedDarkHours(nights, plannedDates, plannedHalves);
  const hours = requested.reduce((sum, v) => sum + v.durationSec, 0) / 3600;
  return {
    requestedSlotIds,
    byTarget,
    totals: { probability: need.probability, visits: requested.length, hours, nights: nightsHeld, halfNights, spareHours: Math.max(0, darkHours - hours) },
  };
}
