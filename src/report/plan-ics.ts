import ical from 'ical-generator';
import { DateTime } from 'luxon';
import type { Plan } from '../model.js';
import { vtimezone } from './plan-ics-zone.js';
import { phasesText } from './plan-rows.js';

/**
 * plan.ics (RFC 5545): one event per visit in the site's time zone, with its VTIMEZONE.
 * DTSTAMP is the window's first day (not the clock) so that the same inputs give the same bytes.
 * The VTIMEZONE lists the zone's actual offset changes from the day before the window to two days
 * after it (plan-ics-zone.ts), so every visit's start and end resolve to the right instant.
 */
export function renderPlanIcs(plan: Plan): string {
  const c = plan.campaign;
  const zone = c.site.timeZone;
  const fromMs = DateTime.fromISO(c.window.start, { zone }).minus({ days: 1 }).toMillis();
  const toMs = DateTime.fromISO(c.window.end, { zone }).plus({ days: 2 }).toMillis();
  const calendar = ical({
    name: c.name,
    prodId: { company: 'crest', product: 'crest-plan', language: 'EN' },
    // No calendar-wide zone: with one, the library writes DTSTAMP in local time, and RFC 5545
    // (3.8.7.2) asks for UTC. Each event carries the site's TZID; the generator adds its VTIMEZONE.
    timezone: { name: null, generator: (tz) => vtimezone(tz, fromMs, toMs) },
  });
  const stamp = DateTime.fromISO(c.window.start, { zone: 'utc' });
  for (const visit of plan.visits) {
    const start = DateTime.fromISO(visit.startUtc, { zone: 'utc' }).setZone(zone);
    // RFC 5545 3.3.5: a repeated local time means its first occurrence, so a visit starting or
    // ending in the second occurrence of a repeated hour can only be written in UTC.
    const repeated = secondOccurrence(start) || secondOccurrence(start.plus({ seconds: visit.durationSec }));
    const phase = visit.phases.length === 0 ? '' : `; predicted phase ${phasesText(visit)}`;
    calendar.createEvent({
      id: `${visit.starId}-${start.toUTC().toFormat("yyyyLLdd'T'HHmmss")}@crest`,
      start: repeated ? start.toUTC() : start,
      end: (repeated ? start.toUTC() : start).plus({ seconds: visit.durationSec }),
      stamp,
      timezone: repeated ? null : zone,
      summary: `RV ${visit.starId}`,
      location: c.site.name,
      description:
        `Star ${visit.starId}; exposure ${visit.exposureSec.toFixed(0)} s (block ${visit.durationSec.toFixed(0)} s with overheads); ` +
        `airmass ${visit.airmass.toFixed(2)}${phase}; expected sigma ${visit.sigmaEffMps.toFixed(2)} m/s. Advisory: observatory safety rules take precedence.`,
    });
  }
  return calendar.toString();
}

/** True when the same wall-clock time occurred 30 or 60 minutes earlier (after a backward change). */
export function secondOccurrence(local: DateTime): boolean {
  const wall = (t: DateTime) => t.toFormat("yyyy-LL-dd'T'HH:mm:ss");
  return [60, 30].some((minutes) => wall(local.minus({ minutes })) === wall(local));
}
