// The proposal paragraph says how much of the dark time asked for holds no visit, and the plan's
// totals give it: the planned nights' dark hours less the hours of the visits on them.
import { describe, expect, it } from 'vitest';
import { proposalParagraph } from '../../src/report/html/proposal-summary.js';
import { demoPlan } from '../support/demo-plan.js';

describe('idle dark time', () => {
  it('is the dark hours of the planned nights less the visit blocks, and the paragraph says so', () => {
    const plan = demoPlan();
    const planned = new Set(plan.plannedDates);
    const dark = plan.nights.filter((n) => planned.has(n.localDate)).reduce((sum, n) => sum + n.darkHours, 0);
    const used = plan.visits.reduce((sum, v) => sum + v.durationSec, 0) / 3600;
    expect(plan.totals.darkHours).toBeCloseTo(dark, 9);
    expect(plan.totals.idleHours).toBeCloseTo(dark - used, 9);
    // The demo asks for 14 nights and uses about half of their dark time.
    expect(plan.totals.idleHours! / dark).toBeGreaterThan(0.3);
    const text = proposalParagraph(plan);
    expect(text).toContain(
      `Of the ${dark.toFixed(1)} dark hours of these nights, ${(dark - used).toFixed(1)} h (${Math.round((100 * (dark - used)) / dark)}%) hold no visit`,
    );
    expect(text).toMatch(/fewer or shorter nights would do for these targets, or that time can go to other programmes\.$/);
  });
});
