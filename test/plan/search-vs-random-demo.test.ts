// Issue 13 part 3's check on the demo: blind searches judged by detection. Injection–recovery
// completeness at the search mass (test/support/search-check.ts: periods log-uniform over the
// range, circular, random phase, GLS with Baluev's 1% FAP over the band, seeded) of each search
// star's planned visits against random visits of the same star and count drawn from its own
// candidate slots over the whole window under the campaign's spacing: planned minus random must
// exceed three standard errors. Also measured (printed, not asserted): random visits on the plan's
// own nights only. Random campaigns: search-vs-random-campaigns.test.ts.
//
// The assertion is on the demo's two search stars planned as a campaign of their own (the same
// site, window, nights and goals), where the nights are chosen for them. In the full demo the
// nights are chosen for eleven ephemeris stars as well, whose margins for the weather spread them
// over two months; the full demo's figures are printed beside it (the closing note of issue 13
// reports them).
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { demoPlan } from '../support/demo-plan.js';
import { searchChecks } from '../support/search-check.js';
import { expectMargin, printChecks } from '../support/search-margin.js';

describe('search stars: planned visits detect more than random visits of the same star and count', () => {
  it("on the demo's search stars (Vira, Castell) planned on their own", () => {
    const demo = readCampaign(DEMO_CAMPAIGN);
    const searches = { ...demo, targets: demo.targets.filter((t) => t.search !== undefined) };
    const checks = searchChecks(searches, buildPlan(searches), 5, 1);
    expect(checks.map((c) => c.targetId)).toEqual(['Vira', 'Castell']);
    expectMargin(checks);
  });

  it('in the full demo plan (printed)', () => {
    const checks = searchChecks(readCampaign(DEMO_CAMPAIGN), demoPlan(), 5, 1);
    expect(checks.map((c) => c.targetId)).toEqual(['Vira', 'Castell']);
    printChecks(checks);
  });
});
