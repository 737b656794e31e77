// crest plan's properties (plan-properties.ts) on 50 random small campaigns (random-campaign.ts),
// ten to a test file (test/plan/random-plans-*.test.ts, so that the two test workers share them).
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { sharedPlans } from '../support/plan-cache.js';
import { describePlanProperties, WEATHER_TRIALS } from './plan-properties.js';
import { randomCampaign } from './random-campaign.js';

export const RANDOM_CAMPAIGNS = 50;
const PER_FILE = 10;

/** The plans of random campaigns first .. first + count - 1, built once per test run (replan.test.ts re-plans the first eight). */
export function randomPlans(first: number, count: number): Promise<Plan[]> {
  const indices = Array.from({ length: count }, (_, i) => first + i);
  return sharedPlans(indices.map((i) => ({ key: `random-${i}`, build: () => buildPlan(randomCampaign(i), { weatherTrials: WEATHER_TRIALS }) })));
}

/**
 * Registers the tests of random campaigns first .. first + 9. Each ten hold at least 40 visits
 * (200 over the fifty), a plan with visits in each hemisphere, a search target with two visits
 * or more and more than half of their plans with five visits or more (more than 25 of the fifty).
 * The time models are the campaigns' own: the fifty cover all three.
 */
export function describeRandomPlans(first: number): void {
  const names = Array.from({ length: PER_FILE }, (_, i) => `random ${first + i}`);
  const plans = new Map<string, Plan>();
  const planOf = (name: string) => plans.get(name)!;

  // Ten plans take up to 15 s on one core; the default hook limit is too tight on a loaded machine.
  beforeAll(async () => {
    (await randomPlans(first, PER_FILE)).forEach((plan, i) => {
      plans.set(names[i]!, plan);
    });
  }, 600_000);

  describe('the sample', () => {
    if (first === 0) {
      it('covers all three time models', () => {
        const modes = new Set(Array.from({ length: RANDOM_CAMPAIGNS }, (_, i) => randomCampaign(i).time.mode));
        expect([...modes].sort()).toEqual(['choose-nights', 'given-nights', 'hours']);
      });
    }
    it(`random ${first} to ${first + PER_FILE - 1} cover both hemispheres, search targets and plans with many visits`, () => {
      const all = names.map(planOf);
      expect(all.some((p) => p.campaign.site.latitudeDeg < 0 && p.visits.length > 0)).toBe(true);
      expect(all.some((p) => p.campaign.site.latitudeDeg > 0 && p.visits.length > 0)).toBe(true);
      expect(all.filter((p) => p.targets.some((t) => t.kind === 'search' && t.visits >= 2)).length).toBeGreaterThan(0);
      expect(all.filter((p) => p.visits.length >= 5).length).toBeGreaterThan(PER_FILE / 2);
    });
  });

  describePlanProperties(names, planOf, (200 * PER_FILE) / RANDOM_CAMPAIGNS);
}
