// The RVs so far as crest plan takes them (src/plan/orbit-update.ts), on the demo 18 days in
// (examples/under-way: invented RVs): which stars are fitted, which keep the catalogue, and the
// warning for visits from another instrument than the campaign's.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import type { Campaign } from '../../src/plan/campaign.js';
import { planInputs } from '../../src/plan/plan-inputs.js';

const CAMPAIGN = path.join(path.dirname(fileURLToPath(import.meta.url)), '../../examples/under-way/campaign.yaml');
/** One night of the campaign (the fit does not depend on the window; planning one night is quick). */
const oneNight = (c: Campaign): Campaign => ({
  ...c,
  window: { start: '2027-03-20', end: '2027-03-20' },
  time: { mode: 'given-nights', dates: ['2027-03-20'] },
});

describe('the RVs so far in the plan', () => {
  const campaign = readCampaign(CAMPAIGN);

  it('fits every star with more RVs than offsets and K s, and plans it with the fitted values', () => {
    const { rv, campaign: planned } = planInputs(oneNight(campaign), {});
    expect(rv.warnings).toEqual([]);
    for (const [id, fit] of rv.fits) {
      const target = planned.targets.find((t) => t.id === id)!;
      expect(target.ephemeris!.tcBjdTdb).toBe(fit.tcBjdTdb);
      expect(target.ephemeris!.periodErrDays).toBe(fit.periodErrDays);
      expect(target.planet!.kMps).toBe(fit.kMps);
      // A fit only adds information: the period is known at least as well as the catalogue said.
      expect(fit.periodErrDays).toBeLessThanOrEqual(fit.catalogue.periodErrDays * (1 + 1e-9));
    }
    expect(rv.fits.size).toBe(11);
  });

  it('a star with no more RVs than its offset and K s keeps its catalogue values', () => {
    const rows = campaign
      .observed!.rows.filter((r) => r.targetId !== 'SELVA-12')
      .concat(campaign.observed!.rows.filter((r) => r.targetId === 'SELVA-12').slice(0, 2));
    const { rv, campaign: planned } = planInputs(oneNight({ ...campaign, observed: { ...campaign.observed!, rows } }), {});
    expect(rv.fits.has('SELVA-12')).toBe(false);
    expect(planned.targets.find((t) => t.id === 'SELVA-12')).toEqual(campaign.targets.find((t) => t.id === 'SELVA-12'));
  });

  it("warns once when visits come from another instrument than the campaign's", () => {
    const rows = campaign.observed!.rows.map((r, i) => (i < 3 ? { ...r, instrument: 'other-spec' } : r));
    const { rv } = planInputs(oneNight({ ...campaign, observed: { ...campaign.observed!, rows } }), {});
    expect(rv.warnings.filter((w) => w.includes('other-spec'))).toHaveLength(1);
  });
});
