// Half nights (campaign `time.halfNights`): each night of the problem is split at the middle of its
// dark time into a first and a second half that the planner chooses on their own, two halves
// making a whole night. The halves share the night's calendar key (one weather draw, one nightly
// noise term, one count under one-visit-a-night: src/schedule/types.ts calendarNight). A visit
// must lie wholly in one half, so a candidate visit that straddles the middle is dropped.
import type { Night } from '../model.js';
import type { ScheduleNight, ScheduleProblem } from '../schedule/types.js';

export type Half = 'first' | 'second';

/** The middle of a night's dark time (ms), where its two halves meet. */
export function darkMiddleMs(night: Night): number {
  return (night.darkStart!.getTime() + night.darkEnd!.getTime()) / 2;
}

/** Problem night index of a half: 2i for the first half of night i, 2i + 1 for the second. */
export const halfIndex = (nightIndex: number, half: Half) => 2 * nightIndex + (half === 'first' ? 0 : 1);
export const halfOfIndex = (index: number): { nightIndex: number; half: Half } => ({ nightIndex: index >> 1, half: index % 2 === 0 ? 'first' : 'second' });

/** A planned night held by one half only. */
export interface PlannedHalf {
  localDate: string;
  half: Half;
}

/** The nights a result of a split problem chose: each date once, and the dates of which it chose one half only. */
export function chosenHalves(nightIndices: number[], nights: Night[]): { dates: string[]; halves: PlannedHalf[] } {
  const byNight = new Map<number, Half[]>();
  for (const index of nightIndices) {
    const { nightIndex, half } = halfOfIndex(index);
    byNight.set(nightIndex, [...(byNight.get(nightIndex) ?? []), half]);
  }
  const entries = [...byNight.entries()].sort((a, b) => a[0] - b[0]);
  return {
    dates: entries.map(([n]) => nights[n]!.localDate),
    halves: entries.filter(([, h]) => h.length === 1).map(([n, h]) => ({ localDate: nights[n]!.localDate, half: h[0]! })),
  };
}

/** Dark hours of the planned dates, a date held by one half counting half its dark hours. */
export function plannedDarkHours(nights: Night[], plannedDates: string[], halves: PlannedHalf[] = []): number {
  const planned = new Set(plannedDates);
  const half = new Set(halves.map((h) => h.localDate));
  return nights.filter((n) => planned.has(n.localDate)).reduce((sum, n) => sum + (half.has(n.localDate) ? n.darkHours / 2 : n.darkHours), 0);
}

/** The problem with every night replaced by its two halves and the night count doubled. */
export function splitHalves(problem: ScheduleProblem, nights: Night[]): ScheduleProblem {
  const halves: ScheduleNight[] = problem.nights.flatMap((n) =>
    (['first', 'second'] as const).map((half) => ({ ...n, index: halfIndex(n.index, half), calendarNight: n.index, hoursAvailable: n.hoursAvailable / 2 })),
  );
  const slots = problem.slots.flatMap((s) => {
    const night = nights[s.nightIndex]!;
    if (!night.darkStart || !night.darkEnd) return [];
    const middle = darkMiddleMs(night);
    if (s.startMs + s.durationSec * 1000 <= middle) return [{ ...s, nightIndex: halfIndex(s.nightIndex, 'first') }];
    if (s.startMs >= middle) return [{ ...s, nightIndex: halfIndex(s.nightIndex, 'second') }];
    return [];
  });
  const time = problem.time.mode === 'choose-nights' ? { mode: 'choose-nights' as const, nights: Math.round(2 * problem.time.nights) } : problem.time;
  return { ...problem, nights: halves, slots, time };
}
