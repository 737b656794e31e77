// One meaning for a blind search's K: `crest plan` quotes it at the logarithmic middle of the
// search range, with that period, as `crest detect` does; its score is a completeness, with no σ_K.
import { describe, expect, it } from 'vitest';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { planetOfTarget } from '../../src/rv/target-detect.js';
import { demoPlan } from '../support/demo-plan.js';

describe('search targets in the plan summary', () => {
  it('quote K at √(Pmin · Pmax), the period detect uses, with the period, and a completeness instead of σ_K', () => {
    const plan = demoPlan();
    const searches = plan.targets.filter((t) => t.kind === 'search');
    expect(searches.map((t) => t.targetId)).toEqual(['Vira', 'Castell']);
    for (const s of searches) {
      const target = plan.campaign.targets.find((t) => t.id === s.targetId)!;
      const { periodMinDays, periodMaxDays, msiniEarth } = target.search!;
      const middle = Math.sqrt(periodMinDays * periodMaxDays);
      expect(s.kPeriodDays).toBeCloseTo(middle, 12);
      // K of the search mass at that period from the K formula itself, circular orbit.
      expect(s.kMps).toBeCloseTo(semiAmplitudeMps({ starMassSun: target.massSun, planetMassEarth: msiniEarth, periodDays: middle }), 9);
      // The same number `crest detect` gives for the same row.
      expect(s.kMps).toBeCloseTo(planetOfTarget(target)!.kMps, 9);
      expect(s.sigmaKMps).toBeUndefined();
      expect(s.kOverSigmaK).toBeUndefined();
      expect(s.completeness).toBeGreaterThan(0);
      expect(s.completeness).toBeLessThanOrEqual(1);
      expect(s.goalCompleteness).toBe(0.5);
    }
    // Ephemeris targets quote K at their own period.
    for (const s of plan.targets.filter((t) => t.kind === 'ephemeris')) {
      expect(s.kPeriodDays).toBe(plan.campaign.targets.find((t) => t.id === s.targetId)!.ephemeris!.periodDays);
    }
  });
});
