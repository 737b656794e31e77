// crest plan's properties on the bundled demo campaign (plan-properties.ts), on the plan.json
// that `crest plan` wrote in the global setup (test/support/demo-plan.ts).
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/model.js';
import { demoPlan } from '../support/demo-plan.js';
import { describePlanProperties } from './plan-properties.js';

let plan: Plan;
beforeAll(() => {
  plan = demoPlan();
});

describePlanProperties(['demo'], () => plan, 50);

describe('demo plan and transits', () => {
  it('plans no exposure that overlaps a predicted transit, widened by its 1-sigma error (scan over epochs)', () => {
    let checked = 0;
    for (const v of plan.visits) {
      const eph = plan.campaign.targets.find((t) => t.id === v.starId)!.ephemeris;
      if (!eph?.transitDurationHours) continue;
      const half = v.exposureSec / 2 / 86_400;
      const n = Math.round((v.midBjdTdb - eph.tcBjdTdb) / eph.periodDays);
      for (let k = n - 1; k <= n + 1; k++) {
        const tc = eph.tcBjdTdb + k * eph.periodDays;
        const margin = eph.transitDurationHours / 48 + Math.hypot(eph.tcErrDays, k * eph.periodErrDays);
        expect(v.midBjdTdb + half <= tc - margin || v.midBjdTdb - half >= tc + margin, `${v.starId} ${v.startUtc}`).toBe(true);
      }
      checked++;
    }
    expect(checked).toBeGreaterThan(50);
  });
});
