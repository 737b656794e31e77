// plan.ics read back with ical.js, a general-purpose iCalendar parser (RFC 5545), resolving each
// event's TZID through the VTIMEZONE the file itself carries.
import ICAL from 'ical.js';
import { DateTime } from 'luxon';
import type { Plan } from '../../src/model.js';
import { secondOccurrence } from '../../src/report/plan-ics.js';

export interface IcsEvent {
  uid: string;
  tzid: string | null;
  startMs: number;
  endMs: number;
  description: string;
  /** DTSTAMP is in UTC form (RFC 5545 3.8.7.2 requires it). */
  stampIsUtc: boolean;
}

export interface ParsedIcs {
  timezoneIds: string[];
  events: IcsEvent[];
}

export function parseIcs(text: string): ParsedIcs {
  const calendar = new ICAL.Component(ICAL.parse(text));
  const zones = new Map(
    calendar.getAllSubcomponents('vtimezone').map((c) => [String(c.getFirstPropertyValue('tzid')), new ICAL.Timezone(c)]),
  );
  const instant = (value: ICAL.Time, tzid: string | null): number => {
    const zone = tzid ? zones.get(tzid) : undefined;
    if (tzid && !zone) throw new Error(`TZID ${tzid} has no VTIMEZONE`);
    if (zone) value.zone = zone;
    const ms = value.toUnixTime() * 1000;
    // RFC 5545 3.3.5: a local time that occurs twice (a backward change) refers to the first
    // occurrence; ical.js takes the second, so step back when the wall clock repeats.
    if (!tzid) return ms;
    const wall = (t: number) => DateTime.fromMillis(t, { zone: tzid }).toFormat("yyyy-LL-dd'T'HH:mm:ss");
    const earlier = [3_600_000, 1_800_000].map((d) => ms - d).find((t) => wall(t) === wall(ms));
    return earlier ?? ms;
  };
  const events = calendar.getAllSubcomponents('vevent').map((event) => {
    const start = event.getFirstProperty('dtstart')!;
    const end = event.getFirstProperty('dtend')!;
    const tzid = (start.getParameter('tzid') as string | undefined) ?? null;
    const stamp = event.getFirstPropertyValue('dtstamp') as ICAL.Time;
    return {
      uid: String(event.getFirstPropertyValue('uid')),
      tzid,
      startMs: instant(start.getFirstValue() as ICAL.Time, tzid),
      endMs: instant(end.getFirstValue() as ICAL.Time, (end.getParameter('tzid') as string | undefined) ?? null),
      description: String(event.getFirstPropertyValue('description')),
      stampIsUtc: stamp.zone === ICAL.Timezone.utcTimezone,
    };
  });
  return { timezoneIds: [...zones.keys()], events };
}

/** Mismatches between plan.ics and the plan's visits (empty when they agree). */
export function icsMismatches(plan: Plan, text: string): string[] {
  const zone = plan.campaign.site.timeZone;
  const { timezoneIds, events } = parseIcs(text);
  const problems: string[] = [];
  if (events.length !== plan.visits.length) problems.push(`${events.length} events for ${plan.visits.length} visits`);
  if (plan.visits.length > 0 && !timezoneIds.includes(zone)) problems.push(`no VTIMEZONE for ${zone}`);
  if (new Set(events.map((e) => e.uid)).size !== events.length) problems.push('UIDs repeat');
  const byStart = new Map(events.map((e) => [e.startMs, e]));
  for (const v of plan.visits) {
    const e = byStart.get(Date.parse(v.startUtc));
    const label = `${v.starId} ${v.startUtc}`;
    if (!e) {
      problems.push(`${label}: no event starts then`);
      continue;
    }
    // A visit in the second occurrence of a repeated hour is written in UTC (RFC 5545 3.3.5).
    const start = DateTime.fromISO(v.startUtc, { zone });
    const utcAllowed = e.tzid === null && (secondOccurrence(start) || secondOccurrence(start.plus({ seconds: v.durationSec })));
    if (e.tzid !== zone && !utcAllowed) problems.push(`${label}: DTSTART TZID ${e.tzid}, not ${zone}`);
    if (e.endMs - e.startMs !== v.durationSec * 1000) problems.push(`${label}: event lasts ${(e.endMs - e.startMs) / 1000} s, block ${v.durationSec} s`);
    if (!e.description.includes(v.starId) || !e.description.includes(`${v.exposureSec.toFixed(0)} s`)) problems.push(`${label}: description lacks target or exposure`);
    if (v.phases.some((p) => !e.description.includes(p.phase.toFixed(3)))) problems.push(`${label}: description lacks the phase`);
    if (!e.stampIsUtc) problems.push(`${label}: DTSTAMP not in UTC form`);
  }
  return problems;
}
