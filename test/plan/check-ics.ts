// plan.ics read back with ical.js, a general-purpose iCalendar parser (RFC 5545), resolving each
// event's TZID through the VTIMEZONE the file itself carries.
import ICAL from 'ical.js';
import { DateTime } from 'luxon';
import type { Plan, PlannedVisit } from '../../src/plan/plan-schema.js';
import { placeOffsetMas } from './place-offset.js';
import { secondOccurrence } from '../../src/report/plan-ics.js';

export interface IcsEvent {
  uid: string;
  tzid: string | null;
  startMs: number;
  endMs: number;
  description: string;
  summary: string;
  /** GEO (RFC 5545 3.8.1.6) as [latitude, longitude] in degrees; null when absent. */
  geo: [number, number] | null;
  /** DTSTAMP is in UTC form (RFC 5545 3.8.7.2 requires it). */
  stampIsUtc: boolean;
  stampMs: number;
  /** STATUS (RFC 5545 3.8.1.11) and SEQUENCE (3.8.7.4); null when absent. */
  status: string | null;
  sequence: number | null;
}

export interface ParsedIcs {
  timezoneIds: string[];
  events: IcsEvent[];
}

export function parseIcs(text: string): ParsedIcs {
  const calendar = new ICAL.Component(ICAL.parse(text));
  const zones = new Map(calendar.getAllSubcomponents('vtimezone').map((c) => [String(c.getFirstPropertyValue('tzid')), new ICAL.Timezone(c)]));
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
      summary: String(event.getFirstPropertyValue('summary')),
      geo: (event.getFirstPropertyValue('geo') as [number, number] | null) ?? null,
      stampIsUtc: stamp.zone === ICAL.Timezone.utcTimezone,
      stampMs: stamp.toUnixTime() * 1000,
      status: (event.getFirstPropertyValue('status') as string | null) ?? null,
      sequence: (event.getFirstPropertyValue('sequence') as number | null) ?? null,
    };
  });
  return { timezoneIds: [...zones.keys()], events };
}

/**
 * The UIDs plan.ics documents (README, "plan.ics"): `<star>-<localDate>-<k>@crest`, k counting
 * that star's visits of that night in start order from 1.
 */
export function documentedUids(plan: Plan): Map<string, PlannedVisit> {
  const byNight = new Map<string, PlannedVisit[]>();
  for (const v of plan.visits) byNight.set(`${v.starId}-${v.localDate}`, [...(byNight.get(`${v.starId}-${v.localDate}`) ?? []), v]);
  const uids = new Map<string, PlannedVisit>();
  for (const [night, visits] of byNight) {
    const ordered = [...visits].sort((a, b) => Date.parse(a.startUtc) - Date.parse(b.startUtc));
    ordered.forEach((v, k) => {
      uids.set(`${night}-${k + 1}@crest`, v);
    });
  }
  return uids;
}

/**
 * Mismatches between plan.ics and the plan's visits (empty when they agree): one event per visit
 * under its documented UID at its start and end; and, when `previous` is a plan of the same
 * campaign, one STATUS:CANCELLED event (RFC 5545 3.8.1.11) at its old time for each of its
 * visits whose UID the plan no longer has.
 */
/**
 * What an event says of where and when: its summary names the night by the evening's date, its
 * GEO is the site's, and its description's RA and Dec lie within 0.1 arcsec of the catalogue place
 * moved by the proper motion since its epoch (small angles).
 */
function placeProblems(plan: Plan, v: PlannedVisit, e: IcsEvent): string[] {
  const problems: string[] = [];
  const { site } = plan.campaign;
  if (!e.summary.includes(`night ${v.localDate}/`)) problems.push(`summary "${e.summary}" does not name the night of ${v.localDate}`);
  if (!e.geo || Math.abs(e.geo[0] - site.latitudeDeg) > 1e-6 || Math.abs(e.geo[1] - site.longitudeDeg) > 1e-6) problems.push(`GEO ${e.geo} is not the site's`);
  const m = /RA (\d\d:\d\d:\d\d\.\d+) Dec ([+-]\d\d:\d\d:\d\d\.\d+)/.exec(e.description);
  const star = plan.campaign.targets.find((t) => t.starId === v.starId)!;
  if (!m) return [...problems, 'description lacks RA and Dec'];
  const { eastMas, northMas } = placeOffsetMas(star, m[1]!, m[2]!, v.startUtc);
  const offMas = Math.hypot(eastMas, northMas);
  if (offMas > 100) problems.push(`RA ${m[1]} Dec ${m[2]} is ${offMas.toFixed(0)} mas from the star's place`);
  return problems;
}

export function icsMismatches(plan: Plan, text: string, previous?: Plan): string[] {
  const zone = plan.campaign.site.timeZone;
  const { timezoneIds, events } = parseIcs(text);
  const problems: string[] = [];
  const live = events.filter((e) => e.status !== 'CANCELLED');
  const cancelled = events.filter((e) => e.status === 'CANCELLED');
  if (live.length !== plan.visits.length) problems.push(`${live.length} events for ${plan.visits.length} visits`);
  if (plan.visits.length > 0 && !timezoneIds.includes(zone)) problems.push(`no VTIMEZONE for ${zone}`);
  if (new Set(events.map((e) => e.uid)).size !== events.length) problems.push('UIDs repeat');
  const uids = documentedUids(plan);
  const byUid = new Map(events.map((e) => [e.uid, e]));
  for (const [uid, v] of uids) {
    const e = byUid.get(uid);
    const label = `${v.starId} ${v.startUtc}`;
    if (!e || e.status === 'CANCELLED') {
      problems.push(`${label}: no event with UID ${uid}`);
      continue;
    }
    if (e.startMs !== Date.parse(v.startUtc)) problems.push(`${label}: event ${uid} starts at ${new Date(e.startMs).toISOString()}`);
    if (e.status !== null) problems.push(`${label}: STATUS ${e.status}`);
    // A visit in the second occurrence of a repeated hour is written in UTC (RFC 5545 3.3.5).
    const start = DateTime.fromISO(v.startUtc, { zone });
    const utcAllowed = e.tzid === null && (secondOccurrence(start) || secondOccurrence(start.plus({ seconds: v.durationSec })));
    if (e.tzid !== zone && !utcAllowed) problems.push(`${label}: DTSTART TZID ${e.tzid}, not ${zone}`);
    if (e.endMs - e.startMs !== v.durationSec * 1000) problems.push(`${label}: event lasts ${(e.endMs - e.startMs) / 1000} s, block ${v.durationSec} s`);
    if (!e.description.includes(v.starId) || !e.description.includes(`${v.exposureSec.toFixed(0)} s`))
      problems.push(`${label}: description lacks target or exposure`);
    if (v.phases.some((p) => !e.description.includes(p.phase.toFixed(3)))) problems.push(`${label}: description lacks the phase`);
    if (!e.stampIsUtc) problems.push(`${label}: DTSTAMP not in UTC form`);
    problems.push(...placeProblems(plan, v, e).map((p) => `${label}: ${p}`));
  }
  const gone = previous?.campaign.name === plan.campaign.name ? [...documentedUids(previous)].filter(([uid]) => !uids.has(uid)) : [];
  if (cancelled.length !== gone.length) problems.push(`${cancelled.length} cancelled events for ${gone.length} visits gone from the previous plan`);
  for (const [uid, v] of gone) {
    const e = byUid.get(uid);
    if (e?.status !== 'CANCELLED') problems.push(`${uid}: gone from the plan but not cancelled`);
    else if (e.startMs !== Date.parse(v.startUtc) || e.endMs - e.startMs !== v.durationSec * 1000)
      problems.push(`${uid}: cancelled event not at the old visit's time`);
  }
  return problems;
}
