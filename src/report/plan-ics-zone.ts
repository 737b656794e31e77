// VTIMEZONE (RFC 5545 3.6.5) for one zone over one span of time, from the time-zone database that
// luxon reads (the runtime's Intl data). Each offset change inside the span is its own observance
// with no RRULE, so the calendar is exact for the span even where a zone's rule is not "the n-th
// Sunday of a month" (America/Santiago changes on the first Sunday on or after the 2nd).
import { DateTime } from 'luxon';

const STEP_MS = 6 * 3_600_000;

const offsetAt = (zone: string, ms: number) => DateTime.fromMillis(ms, { zone }).offset;

/** ±hhmm, as TZOFFSETFROM / TZOFFSETTO want it. */
function offsetText(minutes: number): string {
  const sign = minutes < 0 ? '-' : '+';
  const abs = Math.abs(minutes);
  return `${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}${String(abs % 60).padStart(2, '0')}`;
}

/** The instants (ms) at which the zone's UTC offset changes between fromMs and toMs: the first instant of each new offset. */
export function offsetChangesMs(zone: string, fromMs: number, toMs: number): number[] {
  const changes: number[] = [];
  for (let t = fromMs; t < toMs; t += STEP_MS) {
    const next = Math.min(t + STEP_MS, toMs);
    if (offsetAt(zone, t) === offsetAt(zone, next)) continue;
    let lo = t;
    let hi = next;
    while (hi - lo > 1) {
      const mid = Math.floor((lo + hi) / 2);
      if (offsetAt(zone, mid) === offsetAt(zone, t)) lo = mid;
      else hi = mid;
    }
    changes.push(hi);
  }
  return changes;
}

/** One observance: from onsetMs on, the offset in force at stateMs (DAYLIGHT when that is summer time). */
function observance(zone: string, onsetMs: number, stateMs: number, fromOffset: number): string[] {
  const state = DateTime.fromMillis(stateMs, { zone });
  const kind = state.isInDST ? 'DAYLIGHT' : 'STANDARD';
  // DTSTART is the onset as local time in the offset in force before it (RFC 5545 3.6.5).
  const onset = DateTime.fromMillis(onsetMs, { zone: 'utc' }).plus({ minutes: fromOffset });
  return [
    `BEGIN:${kind}`,
    `DTSTART:${onset.toFormat("yyyyLLdd'T'HHmmss")}`,
    `TZOFFSETFROM:${offsetText(fromOffset)}`,
    `TZOFFSETTO:${offsetText(state.offset)}`,
    `END:${kind}`,
  ];
}

/** How far back the first observance is looked for: a zone with summer time changes at least once a year. */
const YEAR_MS = 366 * 86_400_000;

/**
 * The VTIMEZONE block (CRLF lines) valid from fromMs to toMs. The first observance is the zone's
 * last offset change before fromMs, with its true offsets on either side; a zone without a change
 * in the year before has one STANDARD observance, a day before fromMs.
 */
export function vtimezone(zone: string, fromMs: number, toMs: number): string {
  const last = offsetChangesMs(zone, fromMs - YEAR_MS, fromMs).at(-1);
  const first =
    last === undefined
      ? observance(zone, Math.floor(fromMs / 86_400_000) * 86_400_000 - 86_400_000, fromMs, offsetAt(zone, fromMs))
      : observance(zone, last, last, offsetAt(zone, last - 1));
  const lines = ['BEGIN:VTIMEZONE', `TZID:${zone}`, ...first];
  for (const changeMs of offsetChangesMs(zone, fromMs, toMs)) lines.push(...observance(zone, changeMs, changeMs, offsetAt(zone, changeMs - 1)));
  lines.push('END:VTIMEZONE');
  return `${lines.join('\r\n')}\r\n`;
}
