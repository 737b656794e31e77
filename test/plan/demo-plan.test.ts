// crest plan's properties on the bundled demo campaign (plan-properties.ts).
import { beforeAll } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';
import type { Plan } from '../../src/model.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { describePlanProperties, WEATHER_TRIALS } from './plan-properties.js';

let plan: Plan;
beforeAll(() => {
  plan = buildPlan(readCampaign(DEMO_CAMPAIGN), { weatherTrials: WEATHER_TRIALS });
});

describePlanProperties(['demo'], () => plan, 50);
