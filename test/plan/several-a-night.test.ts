// Several visits a night on the invented example (examples/several-a-night): the plan's
// properties (plan-properties.ts, whose check-visits holds the count and the spacing), the check
// itself catching a broken plan, and the option taken where it pays.
import { beforeAll, describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import type { Campaign } from '../../src/plan/campaign.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { checkVisits } from './check-visits.js';
import { describePlanProperties, WEATHER_TRIALS } from './plan-properties.js';

const FILE = 'examples/several-a-night/campaign.yaml';
const STAR = 'TARN-9';
let campaign: Campaign;
let plan: Plan;
let oneANight: Plan;

beforeAll(() => {
  campaign = readCampaign(FILE);
  plan = buildPlan(campaign, { weatherTrials: WEATHER_TRIALS });
  const targets = campaign.targets.map((t) => ({ ...t, visitsPerNight: undefined }));
  oneANight = buildPlan({ ...campaign, targets }, { weatherTrials: WEATHER_TRIALS });
}, 120_000);

describePlanProperties(['several a night'], () => plan, 20);

function perNight(p: Plan, starId: string): number[] {
  const counts = new Map<string, number>();
  for (const v of p.visits) if (v.starId === starId) counts.set(v.localDate, (counts.get(v.localDate) ?? 0) + 1);
  return [...counts.values()];
}

describe('several visits a night', () => {
  it(`gives ${STAR} up to 3 visits a night, 2 h apart, and the other stars one`, () => {
    expect(campaign.targets.find((t) => t.id === STAR)!.visitsPerNight).toBe(3);
    expect(Math.max(...perNight(plan, STAR))).toBe(3);
    for (const t of campaign.targets.filter((t) => t.id !== STAR)) expect(Math.max(...perNight(plan, t.starId))).toBe(1);
  });

  it('the visit check finds a fourth visit in a night and two visits closer than the spacing', () => {
    const mine = plan.visits.filter((v) => v.starId === STAR);
    const night = mine[0]!.localDate;
    const evening = mine.filter((v) => v.localDate === night);
    expect(evening).toHaveLength(3);
    // A copy of the first visit of the evening one hour later: a fourth visit, 1 h from the first.
    const start = new Date(Date.parse(evening[0]!.startUtc) + 3_600_000);
    const extra = { ...evening[0]!, startUtc: start.toISOString().replace('.000Z', 'Z') };
    const violations = checkVisits({ ...plan, visits: [...plan.visits, extra] }).violations;
    expect(violations.some((v) => v.includes(`4 visits on ${night}, at most 3`))).toBe(true);
    expect(violations.some((v) => v.includes('closer than 2 h'))).toBe(true);
  });

  it(`raises ${STAR}'s K/sigma_K over one visit a night, which keeps every star at one`, () => {
    for (const t of oneANight.campaign.targets) expect(Math.max(...perNight(oneANight, t.starId))).toBe(1);
    const ratio = (p: Plan) => p.targets.find((t) => t.targetId === STAR)!.kOverSigmaK!;
    expect(ratio(plan)).toBeGreaterThan(ratio(oneANight));
  });
});
