import { describe, expect, it } from 'vitest';
import { overlapsTransit, type TransitRule } from '../../src/orbit/ephemeris.js';
import type { Ephemeris } from '../../src/model.js';
import { createRng } from '../../src/rv/random.js';

const RULE: TransitRule = { zScore: 1.96, maxOrbitFraction: 0.2 };

/** Slow reference: every epoch from well before to well after the interval, each widened by z of its own errors unless that removes over 20% of the orbit. */
function overlapsByScan(eph: Ephemeris, startBjdTdb: number, endBjdTdb: number): boolean {
  const first = Math.floor((startBjdTdb - eph.tcBjdTdb) / eph.periodDays) - 3;
  const last = Math.ceil((endBjdTdb - eph.tcBjdTdb) / eph.periodDays) + 3;
  for (let n = first; n <= last; n++) {
    const tc = eph.tcBjdTdb + n * eph.periodDays;
    const margin = eph.transitDurationHours! / 48 + RULE.zScore * Math.sqrt(eph.tcErrDays ** 2 + (n * eph.periodErrDays) ** 2);
    if (2 * margin > RULE.maxOrbitFraction * eph.periodDays) continue;
    if (startBjdTdb < tc + margin && endBjdTdb > tc - margin) return true;
  }
  return false;
}

describe('visits kept out of transits', () => {
  it('agrees with a scan over every epoch on 3,000 random intervals (property)', () => {
    const rng = createRng(11);
    for (let i = 0; i < 3000; i++) {
      const eph: Ephemeris = {
        periodDays: 0.6 + 20 * rng.uniform(),
        periodErrDays: 0.002 * rng.uniform(),
        tcBjdTdb: 2461300 + 10 * rng.uniform(),
        tcErrDays: 0.01 * rng.uniform(),
        transitDurationHours: 0.5 + 5 * rng.uniform(),
      };
      const start = 2461400 + 100 * rng.uniform();
      const end = start + (2 * rng.uniform()) / 24;
      expect(overlapsTransit(eph, start, end, RULE)).toBe(overlapsByScan(eph, start, end));
    }
  });

  it('is false without a transit duration, and true for an exposure across mid-transit', () => {
    const eph: Ephemeris = { periodDays: 3, periodErrDays: 0, tcBjdTdb: 2461400, tcErrDays: 0 };
    expect(overlapsTransit(eph, 2461403 - 0.01, 2461403 + 0.01, RULE)).toBe(false);
    const withDuration = { ...eph, transitDurationHours: 2 };
    expect(overlapsTransit(withDuration, 2461403 - 0.01, 2461403 + 0.01, RULE)).toBe(true);
    // One hour after mid-transit is the end of a 2-hour transit: an exposure starting 1.2 h after is clear.
    expect(overlapsTransit(withDuration, 2461403 + 1.2 / 24, 2461403 + 1.5 / 24, RULE)).toBe(false);
  });

  it('never removes more than the stated fraction of the orbit: a transit time known to a tenth of the period is kept', () => {
    // 2 h transit on a 3 d orbit, Tc uncertain by 0.3 d: 2 x (1 h + 1.96 x 0.3 d) = 1.26 d > 0.2 x 3 d.
    const stale: Ephemeris = { periodDays: 3, periodErrDays: 0, tcBjdTdb: 2461400, tcErrDays: 0.3, transitDurationHours: 2 };
    expect(overlapsTransit(stale, 2461403 - 0.01, 2461403 + 0.01, RULE)).toBe(false);
    // The same with Tc known to 0.05 d: 2 x (1/24 + 0.098) d = 0.28 d < 0.6 d, so the transit is avoided.
    expect(overlapsTransit({ ...stale, tcErrDays: 0.05 }, 2461403 - 0.01, 2461403 + 0.01, RULE)).toBe(true);
  });
});
