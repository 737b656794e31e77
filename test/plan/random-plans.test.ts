// crest plan's properties (plan-properties.ts) on 50 random small campaigns (random-campaign.ts).
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { describePlanProperties, WEATHER_TRIALS } from './plan-properties.js';
import { randomCampaign } from './random-campaign.js';

const RANDOM_CAMPAIGNS = 50;
const names = Array.from({ length: RANDOM_CAMPAIGNS }, (_, i) => `random ${i}`);
const plans = new Map<string, Plan>();
const planOf = (name: string) => plans.get(name)!;

// Fifty plans take about a minute on one core; the default hook limit is too tight on a loaded machine.
beforeAll(() => {
  names.forEach((name, i) => plans.set(name, buildPlan(randomCampaign(i), { weatherTrials: WEATHER_TRIALS })));
}, 600_000);

describe('the sample', () => {
  it('covers both hemispheres, all three time models, search targets and plans with many visits', () => {
    const all = names.map(planOf);
    const modes = new Set(all.map((p) => p.campaign.time.mode));
    expect([...modes].sort()).toEqual(['choose-nights', 'given-nights', 'hours']);
    expect(all.some((p) => p.campaign.site.latitudeDeg < 0 && p.visits.length > 0)).toBe(true);
    expect(all.some((p) => p.campaign.site.latitudeDeg > 0 && p.visits.length > 0)).toBe(true);
    expect(all.filter((p) => p.targets.some((t) => t.kind === 'search' && t.visits >= 2)).length).toBeGreaterThan(3);
    expect(all.filter((p) => p.visits.length >= 5).length).toBeGreaterThan(RANDOM_CAMPAIGNS / 2);
  });
});

describePlanProperties(names, planOf, 200);
