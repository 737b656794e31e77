// Re-planning a campaign under way (crest plan --now, lost nights): nothing before `now` moves,
// lost nights hold no visit, the time model's budget still holds, and the re-planned plans keep
// every property of a plan (plan-properties.ts). On random small campaigns and on the demo.
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { demoPlan } from '../support/demo-plan.js';
import { describePlanProperties, WEATHER_TRIALS } from './plan-properties.js';
import { randomPlans } from './random-plans.js';

const CAMPAIGNS = 8;
const key = (v: { starId: string; startUtc: string }) => `${v.starId} ${v.startUtc}`;

interface Case {
  before: Plan;
  /** Re-planned at `now` with one planned night after it lost. */
  after: Plan;
  now: Date;
  lost?: string;
  /** Re-planned at the same `now` with a planned night before it lost instead. */
  lostBefore?: { plan: Plan; date: string };
}

/** `now` in the middle of the plan's visits; the first planned night after it is lost. */
function replanCase(before: Plan, withLostBefore: boolean): Case {
  const starts = before.visits.map((v) => Date.parse(v.startUtc)).sort((a, b) => a - b);
  const now = starts.length > 0 ? new Date(starts[Math.floor(starts.length / 2)]! - 60_000) : new Date(`${before.campaign.window.start}T12:00:00Z`);
  const lost = before.plannedDates.find((d) => before.visits.some((v) => v.localDate === d && Date.parse(v.startUtc) > now.getTime() + 86_400_000));
  const campaign = { ...before.campaign, lostDates: lost ? [lost] : [] };
  const after = buildPlan(campaign, { now, previous: before, weatherTrials: WEATHER_TRIALS });
  const early = before.plannedDates.find((d) => before.visits.some((v) => v.localDate === d && Date.parse(v.startUtc) < now.getTime() - 86_400_000));
  const out: Case = { before, after, now, ...(lost ? { lost } : {}) };
  if (early && withLostBefore)
    out.lostBefore = { plan: buildPlan({ ...before.campaign, lostDates: [early] }, { now, previous: before, weatherTrials: WEATHER_TRIALS }), date: early };
  return out;
}

const cases = new Map<string, Case>();
const names = [...Array.from({ length: CAMPAIGNS }, (_, i) => `random ${i}`), 'demo'];

beforeAll(async () => {
  // The same plans as random-plans-0.test.ts's, shared (random-plans.ts).
  (await randomPlans(0, CAMPAIGNS)).forEach((plan, i) => {
    cases.set(`random ${i}`, replanCase(plan, true));
  });
  cases.set('demo', replanCase(demoPlan(), false));
}, 900_000);

describe('re-planning with --now', () => {
  it('samples enough campaigns, with lost nights before and after now', () => {
    const all = [...cases.values()];
    expect(all.filter((c) => c.after.visits.some((v) => v.kept) && c.after.visits.some((v) => !v.kept)).length).toBeGreaterThan(CAMPAIGNS / 2);
    expect(all.filter((c) => c.lost).length).toBeGreaterThan(CAMPAIGNS / 3);
    expect(all.filter((c) => c.lostBefore).length).toBeGreaterThan(CAMPAIGNS / 3);
  });

  it('never changes a visit before now, and plans nothing before it', () => {
    for (const name of names) {
      const { before, after, now } = cases.get(name)!;
      const past = (p: Plan) => p.visits.filter((v) => Date.parse(v.startUtc) < now.getTime()).map(key);
      expect(past(after), name).toEqual(past(before));
      expect(after.visits.filter((v) => v.kept).map(key), name).toEqual(past(before));
      expect(after.replan?.nowUtc).toBeDefined();
    }
  });

  it('a lost night after now holds no visit; one before now loses only its own visits', () => {
    for (const name of names) {
      const c = cases.get(name)!;
      if (c.lost)
        expect(
          c.after.visits.filter((v) => v.localDate === c.lost),
          name,
        ).toEqual([]);
      if (!c.lostBefore) continue;
      const past = (p: Plan) => p.visits.filter((v) => Date.parse(v.startUtc) < c.now.getTime()).map(key);
      const expected = c.before.visits.filter((v) => Date.parse(v.startUtc) < c.now.getTime() && v.localDate !== c.lostBefore!.date).map(key);
      expect(past(c.lostBefore.plan), name).toEqual(expected);
    }
  });

  it('the whole campaign keeps its budget: chosen nights, given nights or hours', () => {
    for (const name of names) {
      const { after } = cases.get(name)!;
      const time = after.campaign.time;
      if (time.mode === 'choose-nights') expect(new Set(after.visits.map((v) => v.localDate)).size, name).toBeLessThanOrEqual(time.nights);
      if (time.mode === 'hours') expect(after.totals.totalHours, name).toBeLessThanOrEqual(time.hours + 1e-6);
    }
  });
});

describePlanProperties(names, (name) => cases.get(name)!.after, 100);
