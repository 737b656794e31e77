// Issue 13 part 3's check on the demo: blind searches judged by detection. Injection–recovery
// completeness at the search mass (test/support/search-check.ts: periods log-uniform over the
// range, circular, random phase, GLS with Baluev's 1% FAP over the band, seeded) of each search
// star's planned visits against random visits of the same star and count drawn from its own
// candidate slots over the whole window under the campaign's spacing: planned minus random must
// exceed three standard errors. Also measured (printed, not asserted): random visits on the plan's
// own nights only. Random campaigns: search-vs-random-campaigns.test.ts.
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';
import { demoPlan } from '../support/demo-plan.js';
import { searchChecks } from '../support/search-check.js';
import { expectMargin } from '../support/search-margin.js';

describe('search stars: planned visits detect more than random visits of the same star and count', () => {
  it('on the demo (Vira, Castell)', () => {
    const checks = searchChecks(readCampaign(DEMO_CAMPAIGN), demoPlan(), 5, 1);
    expect(checks.map((c) => c.targetId)).toEqual(['Vira', 'Castell']);
    expectMargin(checks);
  });
});
