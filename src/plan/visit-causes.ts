// Why a star has no window, or no visit, on the nights that matter: the sky's reasons for each
// night without a window (src/sky/visibility.ts) counted over those nights, in one phrase for the
// plan's warnings ("too close to the Moon on all 3 planned nights").
import type { Plan } from './plan-schema.js';
import type { DropCause, DroppedWindow } from '../sky/visibility.js';
import type { Window } from '../model.js';
import type { Candidate } from './candidates.js';

/** What the planner saw of each star (keyed by star id): the nights with a window, the nights without one and why, the nights with a candidate visit. */
export interface SkyFacts {
  windowDates: Map<string, Set<string>>;
  dropped: Map<string, DroppedWindow[]>;
  candidateDates: Map<string, Set<string>>;
}

/** The sky's products indexed by star once, so each star's warnings cost its own nights, not the whole campaign's. */
export function skyFacts(windows: Window[], dropped: DroppedWindow[], candidates: Candidate[]): SkyFacts {
  const byStar = new Map<string, DroppedWindow[]>();
  for (const d of dropped) {
    const list = byStar.get(d.targetId);
    if (list) list.push(d);
    else byStar.set(d.targetId, [d]);
  }
  return {
    windowDates: datesByStar(
      windows,
      (w) => w.targetId,
      (w) => w.localDate,
    ),
    dropped: byStar,
    candidateDates: datesByStar(
      candidates,
      (c) => c.slot.targetId,
      (c) => c.localDate,
    ),
  };
}

/** Per star, the set of nights its items fall on. */
function datesByStar<T>(items: T[], star: (item: T) => string, date: (item: T) => string): Map<string, Set<string>> {
  const out = new Map<string, Set<string>>();
  for (const item of items) {
    const set = out.get(star(item));
    if (set) set.add(date(item));
    else out.set(star(item), new Set([date(item)]));
  }
  return out;
}

/** A star's nights without a window, and why. */
export const droppedOf = (sky: SkyFacts, starId: string): DroppedWindow[] => sky.dropped.get(starId) ?? [];

/** Causes that are the same every night: their reason says it all (it carries the star's culmination). */
const FIXED: DropCause[] = ['never rises', 'too low'];

const PHRASE: Record<DropCause, string> = {
  'no dark time': 'no dark time',
  'never rises': 'never rises',
  'too low': 'never high enough',
  daylight: 'high enough only in daylight or twilight',
  'hour-angle limits': 'outside the hour-angle limits',
  'horizon mask': 'behind the horizon mask',
  Moon: 'too close to the Moon',
  'short window': 'windows shorter than the minimum',
};

const nightsText = (n: number, of: number, kind: string) =>
  n === of ? (of === 1 ? `the ${kind} night` : `all ${of} ${kind} nights`) : `${n} of the ${of} ${kind} nights`;

/**
 * The star's nights without a window among `dates`, by cause, most frequent first: one phrase;
 * `kind` names the nights ("planned"), or is empty for bare counts ("too close to the Moon on 2").
 */
export function dropSummary(dropped: DroppedWindow[], dates: string[], kind: string): string {
  const inDates = new Set(dates);
  const byCause = new Map<DropCause, DroppedWindow[]>();
  for (const d of dropped) {
    if (!inDates.has(d.localDate)) continue;
    const list = byCause.get(d.cause);
    if (list) list.push(d);
    else byCause.set(d.cause, [d]);
  }
  const groups = [...byCause].sort((a, b) => b[1].length - a[1].length);
  if (groups.length === 1 && FIXED.includes(groups[0]![0])) return groups[0]![1][0]!.reason;
  const count = (n: number) => (kind ? nightsText(n, dates.length, kind) : String(n));
  return groups.map(([cause, list]) => `${PHRASE[cause]} on ${count(list.length)}`).join(kind ? '; ' : ', ');
}

/** The nights a star's visits could have used: the window's nights in hours mode, else the planned ones. */
export function usableDates(plan: Plan): { dates: string[]; kind: string } {
  if (plan.campaign.time.mode !== 'hours') return { dates: plan.plannedDates, kind: 'planned' };
  const lost = new Set(plan.campaign.lostDates);
  return { dates: plan.nights.filter((n) => !lost.has(n.localDate)).map((n) => n.localDate), kind: 'usable' };
}

/** Why a star observable in the window got no visit ahead: no window on the nights that matter, no visit block fitting, or the budget. */
export function noVisitCause(plan: Plan, starId: string, sky: SkyFacts): string {
  const { dates, kind } = usableDates(plan);
  const windowDates = sky.windowDates.get(starId) ?? new Set<string>();
  const withWindow = dates.filter((d) => windowDates.has(d));
  if (withWindow.length === 0) {
    const elsewhere = windowDates.size;
    const other = elsewhere > 0 && kind === 'planned' ? `; it has windows on ${elsewhere} other nights of the window` : '';
    return `no window on ${nightsText(dates.length, dates.length, kind)} (${dropSummary(droppedOf(sky, starId), dates, kind)})${other}`;
  }
  const candidates = sky.candidateDates.get(starId) ?? new Set<string>();
  if (!withWindow.some((d) => candidates.has(d)))
    return `its visit block fits none of its windows on the ${kind} nights (windows too short, or all in predicted transits)`;
  const windows = `${withWindow.length} of the ${dates.length} ${kind} nights`;
  return `the ${kind} time went to visits of more value, though it has windows on ${windows}: raise its priority or ask for more time`;
}

/** For a star with visits that falls short: the nights that matter on which it had no window, when there are any. */
export function missingWindowsText(plan: Plan, starId: string, sky: SkyFacts): string {
  const { dates, kind } = usableDates(plan);
  const windowDates = sky.windowDates.get(starId) ?? new Set<string>();
  const without = dates.filter((d) => !windowDates.has(d));
  if (without.length === 0) return '';
  return `; no window on ${without.length} of the ${dates.length} ${kind} nights (${dropSummary(droppedOf(sky, starId), without, '')})`;
}
