import { describe, expect, it } from 'vitest';
import { referenceGreedy, referenceUtility, scheduleViolations } from '../../reference/schedule.js';
import { syntheticProblem } from '../../reference/synthetic.js';

describe('the from-scratch greedy of the bench', () => {
  it('returns a feasible schedule whose utility it reports honestly, and stops when nothing adds', () => {
    const settings = { overshootWeight: 0.1 };
    for (const seed of [1, 2, 3]) {
      const problem = syntheticProblem({
        targets: 3,
        nights: 6,
        slotsPerNight: 2,
        searchFraction: 0.34,
        visibleFraction: 0.7,
        time: { mode: 'hours', hours: 4 },
        minSpacingHours: 0,
        onePerNight: true,
        nightHours: 6,
        seed,
        phaseErrors: true,
      });
      const { utility, visits } = referenceGreedy(problem, settings);
      expect(scheduleViolations(problem, visits)).toEqual([]);
      expect(utility).toBeCloseTo(referenceUtility(problem, visits, settings), 12);
      for (const slot of problem.slots.filter((s) => !visits.includes(s))) {
        const more = [...visits, slot];
        if (scheduleViolations(problem, more).length === 0) expect(referenceUtility(problem, more, settings)).toBeLessThanOrEqual(utility + 1e-12);
      }
    }
  });
});
