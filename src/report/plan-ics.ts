import ical, { ICalEventStatus, type ICalCalendar } from 'ical-generator';
import { DateTime } from 'luxon';
import type { Plan, PlannedVisit } from '../plan/plan-schema.js';
import { sameCampaign, visitUids } from './ics-uid.js';
import { vtimezone } from './plan-ics-zone.js';
import { nightInterval } from './night-interval.js';
import { phasesText } from './plan-rows.js';
import { starPlaceAtVisit } from './star-place.js';

export interface PlanIcsOptions {
  /** The plan.json this plan replaces; its visits missing from this plan are written as cancelled. */
  previous?: Plan;
  /** DTSTAMP of every event (ms since 1970, UTC), e.g. from SOURCE_DATE_EPOCH. */
  stampMs?: number;
}

/**
 * plan.ics (RFC 5545): one event per visit in the site's time zone, with its VTIMEZONE.
 * Each event names its night (night-interval.ts) and carries the star's ICRS place and the site's GEO.
 * UIDs are `<star>-<localDate>-<k>@crest` (ics-uid.ts), so re-importing a re-plan updates events;
 * SEQUENCE is the visit's icsSequence (ics-sequence.ts). Every visit of a previous plan of the
 * same campaign whose UID this plan lacks is written at its old time with STATUS:CANCELLED
 * (RFC 5545 3.8.1.11) and one more SEQUENCE, so an importing calendar app drops it.
 * The VTIMEZONE lists the zone's actual offset changes from the day before each window to two days
 * after it (plan-ics-zone.ts), so every visit's start and end resolve to the right instant.
 */
export function renderPlanIcs(plan: Plan, options: PlanIcsOptions = {}): string {
  const previous = sameCampaign(plan, options.previous);
  const plans = previous ? [plan, previous] : [plan];
  const fromMs = Math.min(...plans.map((p) => DateTime.fromISO(p.campaign.window.start, { zone: p.campaign.site.timeZone }).minus({ days: 1 }).toMillis()));
  const toMs = Math.max(...plans.map((p) => DateTime.fromISO(p.campaign.window.end, { zone: p.campaign.site.timeZone }).plus({ days: 2 }).toMillis()));
  const calendar = ical({
    name: plan.campaign.name,
    prodId: { company: 'crest', product: 'crest-plan', language: 'EN' },
    // No calendar-wide zone: with one, the library writes DTSTAMP in local time, and RFC 5545
    // (3.8.7.2) asks for UTC. Each event carries the site's TZID; the generator adds its VTIMEZONE.
    timezone: { name: null, generator: (tz) => vtimezone(tz, fromMs, toMs) },
  });
  const stamp = DateTime.fromMillis(stampMs(plan, options.stampMs), { zone: 'utc' });
  const uids = visitUids(plan.visits);
  plan.visits.forEach((visit, i) => {
    addEvent(calendar, plan, visit, { uid: uids[i]!, stamp, sequence: visit.icsSequence ?? 0 });
  });
  if (previous) {
    const kept = new Set(uids);
    visitUids(previous.visits).forEach((uid, i) => {
      const visit = previous.visits[i]!;
      if (!kept.has(uid)) addEvent(calendar, previous, visit, { uid, stamp, sequence: (visit.icsSequence ?? 0) + 1, cancelled: true });
    });
  }
  return calendar.toString();
}

/**
 * DTSTAMP: the given instant; otherwise the re-planning time (`--now`); otherwise the window's
 * first day. Never the clock, so that the same inputs give the same bytes.
 */
function stampMs(plan: Plan, given: number | undefined): number {
  if (given !== undefined) return given;
  if (plan.replan) return Date.parse(plan.replan.nowUtc);
  return DateTime.fromISO(plan.campaign.window.start, { zone: 'utc' }).toMillis();
}

interface EventIdentity {
  uid: string;
  stamp: DateTime;
  sequence: number;
  cancelled?: boolean;
}

/** One visit of `plan` as an event in the site's zone. */
function addEvent(calendar: ICalCalendar, plan: Plan, visit: PlannedVisit, id: EventIdentity): void {
  const { site } = plan.campaign;
  const start = DateTime.fromISO(visit.startUtc, { zone: 'utc' }).setZone(site.timeZone);
  // RFC 5545 3.3.5: a repeated local time means its first occurrence, so a visit starting or
  // ending in the second occurrence of a repeated hour can only be written in UTC.
  const repeated = secondOccurrence(start) || secondOccurrence(start.plus({ seconds: visit.durationSec }));
  const phase = visit.phases.length === 0 ? '' : `; predicted phase ${phasesText(visit)}`;
  const night = nightInterval(visit.localDate);
  const place = starPlaceAtVisit(plan, visit);
  calendar.createEvent({
    id: id.uid,
    sequence: id.sequence,
    status: id.cancelled ? ICalEventStatus.CANCELLED : null,
    start: repeated ? start.toUTC() : start,
    end: (repeated ? start.toUTC() : start).plus({ seconds: visit.durationSec }),
    stamp: id.stamp,
    timezone: repeated ? null : site.timeZone,
    summary: `${id.cancelled ? 'Cancelled: ' : ''}RV ${visit.starId} (night ${night})`,
    location: { title: site.name, geo: { lat: site.latitudeDeg, lon: site.longitudeDeg } },
    description:
      `Night ${night}. Star ${visit.starId} at RA ${place.raIcrs} Dec ${place.decIcrs} (ICRS, at the visit's epoch); ` +
      `exposure ${visit.exposureSec.toFixed(0)} s (block ${visit.durationSec.toFixed(0)} s with overheads); ` +
      `airmass ${visit.airmass.toFixed(2)}${phase}; expected sigma ${visit.effectiveSigmaMps.toFixed(2)} m/s. ` +
      'Advisory: observatory safety rules take precedence.',
  });
}

/** True when the same wall-clock time occurred 30 or 60 minutes earlier (after a backward change). */
export function secondOccurrence(local: DateTime): boolean {
  const wall = (t: DateTime) => t.toFormat("yyyy-LL-dd'T'HH:mm:ss");
  return [60, 30].some((minutes) => wall(local.minus({ minutes })) === wall(local));
}
