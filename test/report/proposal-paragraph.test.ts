// The proposal paragraph: each search's expected completeness, and how much of the dark time asked for holds no requested visit;
// the plan's totals give it: the planned nights' dark hours less the hours of the visits the
// request holds (idle: less every planned visit, spare ones included).
import { describe, expect, it } from 'vitest';
import { proposalParagraph } from '../../src/report/html/proposal-summary.js';
import { demoPlan } from '../support/demo-plan.js';

describe('the search sentence', () => {
  it("quotes each search's expected completeness at its search mass, the number the planner optimised", () => {
    const plan = demoPlan();
    const text = proposalParagraph(plan);
    for (const id of ['Vira', 'Castell']) {
      const s = plan.targets.find((t) => t.targetId === id)!;
      const search = plan.campaign.targets.find((t) => t.id === id)!.search!;
      expect(text).toContain(`${Math.round(s.completeness! * 100)}% of planets of ${search.msiniEarth} M⊕ with periods of 2–60 d around ${id}`);
    }
  });
});

describe('spare dark time', () => {
  it('is the dark hours of the planned nights less the requested visit blocks, and the paragraph says so', () => {
    const plan = demoPlan();
    const planned = new Set(plan.plannedDates);
    const dark = plan.nights.filter((n) => planned.has(n.localDate)).reduce((sum, n) => sum + n.darkHours, 0);
    const hours = (visits: typeof plan.visits) => visits.reduce((sum, v) => sum + v.durationSec, 0) / 3600;
    const used = hours(plan.visits);
    const requested = hours(plan.visits.filter((v) => !v.spare));
    expect(plan.totals.darkHours).toBeCloseTo(dark, 9);
    expect(plan.totals.idleHours).toBeCloseTo(dark - used, 9);
    expect(plan.totals.request!.spareHours).toBeCloseTo(dark - requested, 9);
    // The demo asks for 14 nights and its request uses about half of their dark time.
    expect(plan.totals.request!.spareHours / dark).toBeGreaterThan(0.3);
    const text = proposalParagraph(plan);
    expect(text).toContain(
      `Of the ${dark.toFixed(1)} dark hours of these nights, ${(dark - requested).toFixed(1)} h ` +
        `(${Math.round((100 * (dark - requested)) / dark)}%) hold no requested visit.`,
    );
    expect(text).toMatch(
      /They could be given back by asking for fewer nights or for half nights \(.*\), or be used for the targets that fall short, lowest priority first: /,
    );
  });
});
