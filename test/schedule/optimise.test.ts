import { describe, expect, it } from 'vitest';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import { referenceKOverSigmaK, referenceUtility, scheduleViolations } from '../../reference/schedule.js';
import { syntheticProblem, type SyntheticSpec } from '../../reference/synthetic.js';
import type { CandidateSlot, ScheduleProblem, ScheduleResult, ScheduleTimeModel } from '../../src/schedule/types.js';
import { onePlanetStar } from '../support/one-planet.js';

const settings = { overshootWeight: 0.1 };

function visitsOf(problem: ScheduleProblem, result: ScheduleResult): CandidateSlot[] {
  const byId = new Map(problem.slots.map((s) => [s.slotId, s]));
  return result.slotIds.map((id) => byId.get(id)!);
}

const times: ScheduleTimeModel[] = [{ mode: 'choose-nights', nights: 5 }, { mode: 'given-nights' }, { mode: 'hours', hours: 12 }];

function randomCase(seed: number): ScheduleProblem {
  const spec: SyntheticSpec = {
    targets: 3 + (seed % 5),
    nights: 20 + (seed % 7),
    slotsPerNight: 1 + (seed % 4),
    searchFraction: (seed % 3) / 4,
    visibleFraction: 0.7,
    time: times[seed % 3]!,
    minSpacingHours: seed % 2 ? 0 : 2,
    onePerNight: seed % 4 !== 0,
    nightHours: 6,
    seed,
    phaseErrors: seed % 2 === 0,
  };
  return syntheticProblem(spec);
}

describe('optimiseSchedule on random problems', () => {
  for (let seed = 1; seed <= 18; seed++) {
    it(`case ${seed}: feasible, honest, non-decreasing, repeatable`, () => {
      const problem = randomCase(seed);
      const trace: number[] = [];
      const result = optimiseSchedule(problem, { seed, onProgress: (u) => trace.push(u) });
      const visits = visitsOf(problem, result);
      // Only candidate slots, no overlaps, spacing, one per night, night hours and budgets (checked pairwise).
      expect(scheduleViolations(problem, visits)).toEqual([]);
      // The claimed utility and K/sigma_K equal a recomputation from the chosen slots.
      expect(result.utility).toBeCloseTo(referenceUtility(problem, visits, settings), 8);
      const ratios = referenceKOverSigmaK(problem, visits);
      result.targets.forEach((t, i) => {
        expect(t.kOverSigmaK ?? t.completeness).toBeCloseTo(ratios[i]!, 8);
      });
      expect(result.hours).toBeCloseTo(
        visits.reduce((sum, v) => sum + v.durationSec / 3600, 0),
        9,
      );
      // Utility never decreases from the greedy pass through every kept move.
      for (let i = 1; i < trace.length; i++) expect(trace[i]!).toBeGreaterThanOrEqual(trace[i - 1]! - 1e-9);
      expect(result.utility).toBeGreaterThanOrEqual(trace[0]! - 1e-9);
      // The same seed gives the same plan.
      expect(optimiseSchedule(problem, { seed }).slotIds).toEqual(result.slotIds);
      if (problem.time.mode === 'choose-nights') {
        expect(result.nightIndices.length).toBeLessThanOrEqual(problem.time.nights);
        for (const b of result.backups) expect(result.nightIndices).not.toContain(b.nightIndex);
        for (let i = 1; i < result.backups.length; i++) expect(result.backups[i]!.utilityGain).toBeLessThanOrEqual(result.backups[i - 1]!.utilityGain);
      } else {
        expect(result.backups).toEqual([]);
      }
    });
  }
});

describe('several visits a night', () => {
  let several = 0;
  for (let seed = 1; seed <= 6; seed++) {
    it(`case ${seed}: every other star up to 3 a night, 1.5 h apart; the rest one a night`, () => {
      const problem = syntheticProblem({
        targets: 4,
        nights: 15,
        slotsPerNight: 8,
        searchFraction: seed % 3 === 0 ? 0.25 : 0,
        visibleFraction: 0.8,
        time: times[seed % 3]!,
        minSpacingHours: 20,
        onePerNight: true,
        visitsPerNight: 3,
        sameNightSpacingHours: 1.5,
        nightHours: 8,
        seed,
        phaseErrors: seed % 2 === 0,
      });
      const visits = visitsOf(problem, optimiseSchedule(problem, { seed }));
      expect(scheduleViolations(problem, visits)).toEqual([]);
      // The rules restated on the chosen visits: per star and night, the count and each pair's spacing.
      for (const target of problem.targets) {
        const cap = target.visitsPerNight ?? 1;
        for (const night of problem.nights) {
          const mine = visits
            .filter((v) => v.targetId === target.id && v.nightIndex === night.index)
            .map((v) => v.startMs)
            .sort((a, b) => a - b);
          expect(mine.length).toBeLessThanOrEqual(cap);
          for (let i = 1; i < mine.length; i++) expect(mine[i]! - mine[i - 1]!).toBeGreaterThanOrEqual(1.5 * 3_600_000);
          if (mine.length > 1) several++;
        }
      }
    });
  }
  it('uses the option in some of those plans', () => {
    expect(several).toBeGreaterThan(0);
  });
});

/** One ephemeris target, slots every 20 minutes for `hoursPerNight` each night, equal sigma, exact phases. */
function singleTarget(periodDays: number, nights: number, hoursPerNight: number): ScheduleProblem {
  const slots: CandidateSlot[] = [];
  const t0 = Date.UTC(2027, 3, 1, 20);
  for (let n = 0; n < nights; n++) {
    for (let k = 0; k < hoursPerNight * 3; k++) {
      const startMs = t0 + n * 86_400_000 + k * 1_200_000;
      slots.push({
        slotId: `n${n}k${k}`,
        targetId: 'LONE-1',
        nightIndex: n,
        startMs,
        durationSec: 1200,
        whiteSigmaMps: 2,
        midBjdTdb: (startMs + 600_000 - t0) / 86_400_000,
      });
    }
  }
  return {
    nights: Array.from({ length: nights }, (_, n) => ({
      index: n,
      localDate: `2027-04-${String(n + 1).padStart(2, '0')}`,
      clearProbability: 0.8,
      hoursAvailable: hoursPerNight,
    })),
    targets: [onePlanetStar('LONE-1', { kMps: 3, periodDays, tcBjdTdb: 0, goalSignificance: 100 }, [0, nights])],
    slots,
    time: { mode: 'given-nights' },
    constraints: { minSpacingHours: 0, onePerNight: true },
  };
}

describe('information efficiency', () => {
  for (const periodDays of [2.7, 4.13, 9.6]) {
    it(`reaches above 0.95 for one target with perfect visibility (P = ${periodDays} d)`, () => {
      // Visible around the clock for 12 days; a budget of 24 visits of 20 minutes.
      const problem: ScheduleProblem = {
        ...singleTarget(periodDays, 12, 24),
        time: { mode: 'hours', hours: 8 },
        constraints: { minSpacingHours: 0, onePerNight: false },
      };
      const result = optimiseSchedule(problem, { seed: 1 });
      const target = result.targets[0]!;
      expect(target.visits).toBe(24);
      // (sigma^2/N) / Var(K^) with Var(K^) = 1/I (docs/references.md [Information-efficiency]).
      const efficiency = (2 ** 2 / target.visits) * target.informationPerMps2!;
      expect(efficiency).toBeCloseTo(target.informationEfficiency!, 12);
      expect(efficiency).toBeGreaterThan(0.95);
    });
  }
});

describe('what the utility asks of a plan', () => {
  it('moves time to other targets once one reaches its goal', () => {
    const problem = randomCase(4);
    const relaxed = optimiseSchedule(problem, { seed: 1 });
    // The planet star with the most visits in the plan as it is.
    const busiest = relaxed.targets.filter((t) => t.kind === 'ephemeris').sort((a, b) => b.visits - a.visits)[0]!;
    const easy = problem.targets.find((t) => t.id === busiest.starId)!;
    // Make the first target's goal tiny: it should keep few visits and give the rest away.
    const lowered = {
      ...problem,
      targets: problem.targets.map((t) => (t === easy ? { ...t, planets: t.planets.map((p) => ({ ...p, goalSignificance: 0.5 })) } : t)),
    };
    const capped = optimiseSchedule(lowered, { seed: 1 });
    const before = relaxed.targets.find((t) => t.starId === easy.id)!;
    const after = capped.targets.find((t) => t.starId === easy.id)!;
    expect(after.visits).toBeLessThan(before.visits);
    const othersBefore = relaxed.targets.filter((t) => t.starId !== easy.id).reduce((s, t) => s + t.visits, 0);
    const othersAfter = capped.targets.filter((t) => t.starId !== easy.id).reduce((s, t) => s + t.visits, 0);
    expect(othersAfter).toBeGreaterThan(othersBefore);
  });

  it('spends visits away from the quadratures when the ephemeris is stale, and none when it is fresh', () => {
    // The same slots; a catalogue Tc and P whose phase error reaches 0.15 cycles by the window's end.
    const fresh = { ...singleTarget(3.3, 40, 9), time: { mode: 'choose-nights' as const, nights: 12 } };
    const stale = {
      ...fresh,
      targets: [onePlanetStar('LONE-1', { kMps: 3, periodDays: 3.3, tcBjdTdb: -300, tcErrDays: 0.05, periodErrDays: 0.0015, goalSignificance: 100 }, [0, 40])],
    };
    // |sin 2 pi phi| below 0.7: more than 0.125 cycles from both quadratures (common practice).
    const offQuadrature = (problem: ScheduleProblem) => {
      const visits = visitsOf(problem, optimiseSchedule(problem, { seed: 2 }));
      return visits.filter((v) => Math.abs(Math.sin((2 * Math.PI * v.midBjdTdb) / 3.3)) < 0.7).length / visits.length;
    };
    expect(offQuadrature(fresh)).toBe(0);
    expect(offQuadrature(stale)).toBeGreaterThan(0.1);
  });

  it('rejects slots that name an unknown target', () => {
    const problem = singleTarget(3, 2, 9);
    const bad = { ...problem, slots: [{ ...problem.slots[0]!, targetId: 'NOBODY' }] };
    expect(() => optimiseSchedule(bad, { seed: 1 })).toThrow(/unknown star NOBODY/);
  });
});
