// plan.ics across re-plans, on the demo plan (test/support/demo-plan.ts) and hand-made variants of
// it, read back with ical.js (check-ics.ts): stable UIDs (RFC 5545 3.8.4.7), cancelled events
// (3.8.1.11), SEQUENCE (3.8.7.4) and a deterministic DTSTAMP (3.8.7.2).
import { beforeAll, describe, expect, it } from 'vitest';
import { planFromJson } from '../../src/io/plan-json.js';
import type { Plan, PlannedVisit } from '../../src/plan/plan-schema.js';
import { withIcsSequences } from '../../src/report/ics-sequence.js';
import { renderPlanIcs } from '../../src/report/plan-ics.js';
import { renderPlanJson } from '../../src/report/plan-json.js';
import { demoPlan } from '../support/demo-plan.js';
import { documentedUids, icsMismatches, parseIcs } from './check-ics.js';

let plan: Plan;
beforeAll(() => {
  plan = demoPlan();
});

const shifted = (v: PlannedVisit, minutes: number): PlannedVisit => ({ ...v, startUtc: new Date(Date.parse(v.startUtc) + minutes * 60_000).toISOString() });
const withVisits = (p: Plan, visits: PlannedVisit[]): Plan => ({ ...p, visits });
const eventsOf = (p: Plan, options?: Parameters<typeof renderPlanIcs>[1]) => parseIcs(renderPlanIcs(p, options)).events;

describe('UIDs across re-plans', () => {
  it('the demo plan.ics matches its visits under the documented UIDs', () => {
    expect(plan.visits.length).toBeGreaterThan(10);
    expect(icsMismatches(plan, renderPlanIcs(plan))).toEqual([]);
  });

  it('a re-plan with one visit moved 20 minutes within its night: every UID as before, the moved event at its new time', () => {
    const moved = withVisits(
      plan,
      plan.visits.map((v, i) => (i === 3 ? shifted(v, 20) : v)),
    );
    const before = eventsOf(plan);
    const after = eventsOf(moved);
    expect(after.map((e) => e.uid)).toEqual(before.map((e) => e.uid));
    const uid = [...documentedUids(plan)].find(([, v]) => v === plan.visits[3])![0];
    expect(after.find((e) => e.uid === uid)!.startMs).toBe(Date.parse(plan.visits[3]!.startUtc) + 20 * 60_000);
    expect(icsMismatches(moved, renderPlanIcs(moved, { previous: plan }), plan)).toEqual([]);
  });

  it("a star's two visits of one night are -1 and -2 in start order", () => {
    const v = plan.visits[0]!;
    const twice = withVisits(plan, [shifted(v, 120), ...plan.visits]);
    const uids = eventsOf(twice).map((e) => e.uid);
    const night = `${v.starId}-${v.localDate}`;
    expect(uids[0]).toBe(`${night}-2@crest`);
    expect(uids[1]).toBe(`${night}-1@crest`);
    expect(icsMismatches(twice, renderPlanIcs(twice))).toEqual([]);
  });
});

describe('visits gone from the previous plan', () => {
  it('appear once each with STATUS:CANCELLED at their old time, one SEQUENCE higher', () => {
    const gone = plan.visits[5]!;
    const next = withVisits(
      plan,
      plan.visits.filter((v) => v !== gone),
    );
    const events = eventsOf(next, { previous: plan });
    const cancelled = events.filter((e) => e.status === 'CANCELLED');
    expect(cancelled).toHaveLength(1);
    expect(cancelled[0]!.uid).toBe(`${gone.starId}-${gone.localDate}-1@crest`);
    expect(cancelled[0]!.startMs).toBe(Date.parse(gone.startUtc));
    expect(cancelled[0]!.sequence).toBe(1);
    expect(icsMismatches(next, renderPlanIcs(next, { previous: plan }), plan)).toEqual([]);
  });

  it('a previous plan of another campaign name cancels nothing', () => {
    const other: Plan = { ...plan, campaign: { ...plan.campaign, name: 'Moravec survey' } };
    const next = withVisits(plan, plan.visits.slice(1));
    expect(eventsOf(next, { previous: other }).filter((e) => e.status !== null)).toEqual([]);
  });
});

describe('SEQUENCE (RFC 5545 3.8.7.4: raised when the start or end changes)', () => {
  it('is 0 unchanged, one more each time the visit moves, and survives plan.json', () => {
    const once = withIcsSequences(
      withVisits(
        plan,
        plan.visits.map((v, i) => (i === 2 ? shifted(v, 15) : v)),
      ),
      plan,
    );
    const saved = planFromJson(JSON.parse(renderPlanJson(once)), 'plan.json');
    expect(saved.visits[2]!.icsSequence).toBe(1);
    const twice = withIcsSequences(
      withVisits(
        saved,
        saved.visits.map((v, i) => (i === 2 ? shifted(v, 15) : v)),
      ),
      saved,
    );
    const again = withIcsSequences(twice, twice);
    const events = eventsOf(again, { previous: twice });
    const uid = `${plan.visits[2]!.starId}-${plan.visits[2]!.localDate}-1@crest`;
    expect(events.find((e) => e.uid === uid)!.sequence).toBe(2);
    expect(events.filter((e) => e.uid !== uid).every((e) => e.sequence === 0)).toBe(true);
  });

  it('a fresh plan writes no icsSequence into plan.json', () => {
    expect(renderPlanJson(withIcsSequences(plan, undefined))).not.toContain('icsSequence');
  });
});

describe('DTSTAMP', () => {
  it('is the given stamp, else the re-planning time, else the window start (midnight UTC)', () => {
    // 1700000000 s since 1970 is 2023-11-14T22:13:20Z (date -u -d @1700000000, common practice).
    expect(eventsOf(plan, { stampMs: 1_700_000_000_000 }).map((e) => e.stampMs)).toEqual(plan.visits.map(() => Date.parse('2023-11-14T22:13:20Z')));
    const replanned: Plan = { ...plan, replan: { nowUtc: '2027-03-05T12:00:00Z', lostDates: [] } };
    expect(new Set(eventsOf(replanned).map((e) => e.stampMs))).toEqual(new Set([Date.parse('2027-03-05T12:00:00Z')]));
    expect(new Set(eventsOf(plan).map((e) => e.stampMs))).toEqual(new Set([Date.parse(`${plan.campaign.window.start}T00:00:00Z`)]));
    expect(eventsOf(plan).every((e) => e.stampIsUtc)).toBe(true);
  });
});
