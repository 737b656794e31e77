// The optimiser against exhaustive search on small problems: within 2% of the best utility.
import { describe, expect, it } from 'vitest';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import { exhaustiveOptimum, referenceUtility, scheduleViolations } from '../../reference/schedule.js';
import { syntheticProblem, type SyntheticSpec } from '../../reference/synthetic.js';

const settings = { overshootWeight: 0.1 };

const families: { name: string; spec: Omit<SyntheticSpec, 'seed' | 'searchFraction' | 'phaseErrors'> }[] = [
  {
    name: 'choose 3 of 12 nights, 3 targets',
    spec: {
      targets: 3,
      nights: 12,
      slotsPerNight: 1,
      visibleFraction: 0.7,
      time: { mode: 'choose-nights', nights: 3 },
      minSpacingHours: 0,
      onePerNight: true,
      nightHours: 3,
    },
  },
  {
    name: 'choose 4 of 14 nights, 2 targets',
    spec: {
      targets: 2,
      nights: 14,
      slotsPerNight: 1,
      visibleFraction: 0.6,
      time: { mode: 'choose-nights', nights: 4 },
      minSpacingHours: 0,
      onePerNight: true,
      nightHours: 3,
    },
  },
  {
    name: 'choose 3 of 9 nights, 2 targets, 2 slots a night',
    spec: {
      targets: 2,
      nights: 9,
      slotsPerNight: 2,
      visibleFraction: 0.7,
      time: { mode: 'choose-nights', nights: 3 },
      minSpacingHours: 0,
      onePerNight: true,
      nightHours: 3,
    },
  },
  {
    name: 'choose 3 of 8 nights, 2 targets, 3 slots a night, the first up to 2 a night 1 h apart',
    spec: {
      targets: 2,
      nights: 8,
      slotsPerNight: 3,
      visibleFraction: 0.7,
      time: { mode: 'choose-nights', nights: 3 },
      minSpacingHours: 20,
      onePerNight: true,
      visitsPerNight: 2,
      sameNightSpacingHours: 1,
      nightHours: 4,
    },
  },
  {
    name: '2.5 hours over 8 nights, 30 h spacing',
    spec: {
      targets: 2,
      nights: 8,
      slotsPerNight: 1,
      visibleFraction: 0.7,
      time: { mode: 'hours', hours: 2.5 },
      minSpacingHours: 30,
      onePerNight: false,
      nightHours: 3,
    },
  },
];

describe('optimiser versus exhaustive search', () => {
  for (const family of families) {
    it(family.name, () => {
      for (let seed = 1; seed <= 8; seed++) {
        const problem = syntheticProblem({ ...family.spec, seed, searchFraction: seed % 3 === 0 ? 0.34 : 0, phaseErrors: seed % 2 === 0 });
        const best = exhaustiveOptimum(problem, settings);
        // The exhaustive optimum is itself feasible and scored by the slow reference.
        expect(scheduleViolations(problem, best.visits)).toEqual([]);
        expect(best.utility).toBeCloseTo(referenceUtility(problem, best.visits, settings), 12);
        const result = optimiseSchedule(problem, { seed, ...settings });
        expect(result.utility, `seed ${seed}`).toBeLessThanOrEqual(best.utility + 1e-9);
        expect(result.utility, `seed ${seed}`).toBeGreaterThanOrEqual(0.98 * best.utility);
      }
    });
  }
});
