// plan.ics time zones: the VTIMEZONE written by src/report/plan-ics-zone.ts, read back by ical.js,
// gives the same UTC offsets as the time-zone database (through luxon) at every bundled site; and a
// plan in the week a simplified "first Sunday of April" rule gets wrong for Chile resolves to the
// visits' true instants.
import ICAL from 'ical.js';
import { DateTime } from 'luxon';
import { beforeAll, describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { readBundledSites } from '../../src/io/site-list.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { offsetChangesMs, vtimezone } from '../../src/report/plan-ics-zone.js';
import { renderPlanIcs } from '../../src/report/plan-ics.js';
import { icsMismatches } from './check-ics.js';
import { fixture } from './fixtures.js';

function icalZone(text: string): ICAL.Timezone {
  const calendar = new ICAL.Component(ICAL.parse(`BEGIN:VCALENDAR\r\nVERSION:2.0\r\nPRODID:-//test//EN\r\n${text}END:VCALENDAR\r\n`));
  return new ICAL.Timezone(calendar.getFirstSubcomponent('vtimezone')!);
}

/** The instant (ms) that ical.js gives a wall-clock time of the zone, as a DTSTART with this TZID would be read. */
function icalInstantMs(zone: ICAL.Timezone, wall: DateTime): number {
  const time = new ICAL.Time({ year: wall.year, month: wall.month, day: wall.day, hour: wall.hour, minute: wall.minute, second: wall.second }, zone);
  return time.toUnixTime() * 1000;
}

describe('VTIMEZONE against the time-zone database', () => {
  const zones = [...new Set(readBundledSites().map((s) => s.timeZone))];
  const fromMs = Date.UTC(2025, 0, 1);
  const toMs = Date.UTC(2030, 11, 31);
  it.each(zones)('%s: wall-clock times every 7 hours from 2025 to 2030 and either side of each change', (zone) => {
    const tz = icalZone(vtimezone(zone, fromMs, toMs));
    const offsetMs = (ms: number) => DateTime.fromMillis(ms, { zone }).offset * 60_000;
    // A wall-clock time repeated after a backward change names two instants (RFC 5545 takes the
    // first): the instants within |change| of a backward change are left out.
    const changes = offsetChangesMs(zone, fromMs, toMs);
    const backward = changes.map((c) => ({ at: c, spanMs: Math.max(0, offsetMs(c - 1) - offsetMs(c)) }));
    const ambiguous = (t: number) => backward.some((b) => b.spanMs > 0 && t >= b.at - b.spanMs && t < b.at + b.spanMs);
    const instants: number[] = [];
    for (let t = fromMs; t < toMs; t += 7 * 3_600_000) if (!ambiguous(t)) instants.push(t);
    for (const b of backward) instants.push(b.at - b.spanMs - 1000, b.at + b.spanMs);
    const wrong = instants.filter((t) => icalInstantMs(tz, DateTime.fromMillis(t, { zone })) !== t).map((t) => new Date(t).toISOString());
    // None, or two a year for six years.
    expect([0, 12]).toContain(changes.length);
    expect(wrong).toEqual([]);
  });

  it('Chile leaves summer time on the first Sunday on or after 2 April (tz database Chile rule, from memory)', () => {
    const changes = offsetChangesMs('America/Santiago', Date.UTC(2029, 0, 1), Date.UTC(2030, 0, 1)).map((t) => new Date(t).toISOString());
    // 2029-04-01 is a Sunday, so the change falls on 8 April (03:00 UTC), and in September on the 2nd.
    expect(changes).toEqual(['2029-04-08T03:00:00.000Z', '2029-09-02T04:00:00.000Z']);
  });
});

describe('the first observance is the last real offset change before the span', () => {
  const first = (zone: string, fromMs: number) =>
    vtimezone(zone, fromMs, fromMs + 30 * 86_400_000)
      .split('\r\n')
      .slice(2, 7);
  it('a March 2027 window in Chile opens with the summer time begun 6 September 2026 at 00:00 local (tz database Chile rule, from memory)', () => {
    expect(first('America/Santiago', Date.UTC(2027, 2, 1))).toEqual([
      'BEGIN:DAYLIGHT',
      'DTSTART:20260906T000000',
      'TZOFFSETFROM:-0400',
      'TZOFFSETTO:-0300',
      'END:DAYLIGHT',
    ]);
  });
  // EU rule: summer time ends on the last Sunday of October at 01:00 UTC (from memory).
  it('a January 2027 window in London opens with the winter time begun 25 October 2026 at 02:00 local', () => {
    expect(first('Europe/London', Date.UTC(2027, 0, 10))).toEqual([
      'BEGIN:STANDARD',
      'DTSTART:20261025T020000',
      'TZOFFSETFROM:+0100',
      'TZOFFSETTO:+0000',
      'END:STANDARD',
    ]);
  });
  it('a zone without summer time has one standard observance whose offsets agree (Hawaii, -10:00 since 1947, from memory)', () => {
    const lines = vtimezone('Pacific/Honolulu', Date.UTC(2027, 0, 10), Date.UTC(2027, 3, 10)).split('\r\n');
    expect(lines.filter((l) => l.startsWith('BEGIN:'))).toEqual(['BEGIN:VTIMEZONE', 'BEGIN:STANDARD']);
    expect(lines.filter((l) => l.startsWith('TZOFFSET'))).toEqual(['TZOFFSETFROM:-1000', 'TZOFFSETTO:-1000']);
  });
});

describe('plan.ics in the week after 1 April 2029 at a Chilean site', () => {
  // One plan for both tests (neither changes it).
  let plan: Plan;
  beforeAll(() => {
    plan = buildPlan(readCampaign(fixture('chile-2029')), { weatherTrials: 10 });
  });

  it('every event starts at its visit', () => {
    expect(plan.campaign.site.timeZone).toBe('America/Santiago');
    expect(plan.visits.length).toBeGreaterThan(3);
    expect(icsMismatches(plan, renderPlanIcs(plan))).toEqual([]);
  });

  it('re-planned without the nights of 7 and 8 April: their visits, either side of the change, are cancelled at their old instants', () => {
    // The change is 2029-04-08T03:00Z, in the night of 7 April.
    const next = { ...plan, visits: plan.visits.filter((v) => v.localDate < '2029-04-07') };
    expect(plan.visits.length - next.visits.length).toBeGreaterThan(0);
    expect(icsMismatches(next, renderPlanIcs(next, { previous: plan }), plan)).toEqual([]);
  });
});
