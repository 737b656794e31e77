// Re-planning a campaign under way: what stays as it was (visits before `--now`, observed
// visits), which candidate visits are still open, and how much of the time model is left.
// Rules (docs/design.md, "Re-planning"):
// - a visit of the previous plan that starts before `now` is kept as planned unless its night is
//   lost or the observed file holds a visit of the same star that evening (which replaces it);
// - kept and observed visits enter each star's information as prior visits;
// - candidate visits start at or after `now`, on nights not lost, clear of prior visits by the
//   campaign's spacing (and on another evening when visits are one a night, unless the star
//   allows several a night: then sameNightSpacingHours from those of the evening);
// - choose-nights: nights before `now` that the previous plan chose or that hold prior visits
//   inside the window are spent; the night in progress, when spent, stays granted for free;
//   hours: the kept visits' hours are spent; given nights: the lost ones are dropped.
import type { Campaign } from './campaign.js';
import type { ObservedVisit, Plan, PlannedVisit } from './plan-schema.js';
import type { PriorVisit, ScheduleNight, ScheduleTimeModel } from '../schedule/types.js';
import type { Candidate } from './candidates.js';
import { eveningDate } from './observed-visits.js';

export interface ReplanOptions {
  /** Nothing before this instant moves. */
  now?: Date;
  /** The plan made before (its visits before `now` are kept). */
  previous?: Plan;
}

export interface History {
  kept: PlannedVisit[];
  observed: ObservedVisit[];
  /** The evening of `now` (site zone), when re-planning. */
  nowDate?: string;
}

export function history(campaign: Campaign, observed: ObservedVisit[], options: ReplanOptions): History {
  const lost = new Set(campaign.lostDates);
  const { now, previous } = options;
  if (!now) return { kept: [], observed };
  const seen = new Set(observed.map((v) => `${v.starId}|${v.localDate}`));
  const kept = (previous?.visits ?? [])
    .filter((v) => Date.parse(v.startUtc) < now.getTime() && !lost.has(v.localDate) && !seen.has(`${v.starId}|${v.localDate}`))
    .map((v): PlannedVisit => ({ ...v, kept: true }));
  return { kept, observed, nowDate: eveningDate(now, campaign.site.timeZone) };
}

/** Kept and observed visits as the scheduler's prior visits; an RV of a star fitted so far informs only its offset and K's. */
export function priorVisits(h: History, fittedStars: ReadonlySet<string>, nights: ScheduleNight[]): PriorVisit[] {
  const middle = new Map(nights.flatMap((n) => (n.midBjdTdb === undefined ? [] : [[n.localDate, n.midBjdTdb] as const])));
  const prior = (v: PlannedVisit | ObservedVisit, phaseInPrior: boolean): PriorVisit => ({
    targetId: v.starId,
    localDate: v.localDate,
    midBjdTdb: v.midBjdTdb,
    whiteSigmaMps: v.whiteSigmaMps,
    ...(middle.has(v.localDate) ? { nightMidBjdTdb: middle.get(v.localDate)! } : {}),
    ...(phaseInPrior ? { phaseInPrior } : {}),
  });
  return [...h.kept.map((v) => prior(v, false)), ...h.observed.map((v) => prior(v, v.rvMps !== undefined && fittedStars.has(v.starId)))];
}

/**
 * Whether a candidate visit is still open: after `now`, not on a lost night, clear of the star's
 * prior visits (when visits go by nights: on their evening by sameNightSpacingHours, and only for
 * a star with visitsPerNight > 1, whose count the scheduler holds to the cap; on other evenings by
 * minSpacingHours).
 */
export function openSlot(campaign: Campaign, h: History, now: Date | undefined): (d: Candidate) => boolean {
  const lost = new Set(campaign.lostDates);
  const { minSpacingHours, sameNightSpacingHours } = campaign.constraints;
  const onePerNight = minSpacingHours >= 12;
  const perNight = new Map(campaign.targets.map((t) => [t.starId, t.visitsPerNight ?? 1]));
  const byStar = new Map<string, { bjdTdb: number; date: string }[]>();
  for (const v of [...h.kept, ...h.observed]) {
    const mine = byStar.get(v.starId) ?? [];
    mine.push({ bjdTdb: v.midBjdTdb, date: v.localDate });
    byStar.set(v.starId, mine);
  }
  return (d) => {
    if (lost.has(d.localDate) || (now && d.slot.startMs < now.getTime())) return false;
    const prior = byStar.get(d.slot.targetId) ?? [];
    const several = (perNight.get(d.slot.targetId) ?? 1) > 1;
    return !prior.some((p) => {
      const apartDays = Math.abs(p.bjdTdb - d.slot.midBjdTdb);
      if (onePerNight && p.date === d.localDate) return !several || apartDays < sameNightSpacingHours / 24;
      return apartDays < minSpacingHours / 24;
    });
  };
}

/** The dates before the night in progress that are spent, and whether the night in progress is. */
function spentNights(campaign: Campaign, h: History, previous: Plan | undefined): { before: string[]; nightsBefore: number; current: boolean } {
  const { start, end } = campaign.window;
  const dates = new Set([...(previous?.plannedDates ?? []), ...[...h.kept, ...h.observed].map((v) => v.localDate)].filter((d) => d >= start && d <= end));
  const before = [...dates].filter((d) => d < h.nowDate!).sort();
  // A night the previous plan held only half of counts as half a night (half-nights.ts).
  const halves = new Set((previous?.plannedHalves ?? []).map((p) => p.localDate));
  return { before, nightsBefore: before.reduce((sum, d) => sum + (halves.has(d) ? 0.5 : 1), 0), current: dates.has(h.nowDate!) };
}

export interface Remaining {
  time: ScheduleTimeModel;
  nights: ScheduleNight[];
  /** Nights spent before the one in progress (choose-nights), listed in the plan's dates. */
  spentDates: string[];
}

/** The problem's nights and time model once the spent part and the lost nights are taken out. */
export function remaining(campaign: Campaign, h: History, previous: Plan | undefined, nights: ScheduleNight[]): Remaining {
  const lost = new Set(campaign.lostDates);
  const time = campaign.time;
  const ahead = nights.filter((n) => !lost.has(n.localDate) && (!h.nowDate || n.localDate >= h.nowDate));
  if (time.mode === 'given-nights') {
    const given = new Set(time.dates.filter((d) => !lost.has(d)));
    return { time: { mode: 'given-nights' }, nights: ahead.filter((n) => given.has(n.localDate)), spentDates: [] };
  }
  if (time.mode === 'hours') {
    const spentHours = h.kept.reduce((sum, v) => sum + v.durationSec / 3600, 0);
    return { time: { mode: 'hours', hours: Math.max(0, time.hours - spentHours) }, nights: ahead, spentDates: [] };
  }
  if (!h.nowDate) return { time, nights: ahead, spentDates: [] };
  const spent = spentNights(campaign, h, previous);
  const granted = spent.current && !lost.has(h.nowDate);
  const left = Math.max(0, time.nights - spent.nightsBefore - (granted ? 1 : 0));
  return {
    time: { ...time, nights: left },
    nights: ahead.map((n) => (granted && n.localDate === h.nowDate ? { ...n, granted: true } : n)),
    spentDates: spent.before,
  };
}
