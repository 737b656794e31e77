// Visits already made (ScheduleProblem.prior): they count as information, share a night's
// noise with new visits of that night, and a target they alone carry to its goal gets no more.
import { describe, expect, it } from 'vitest';
import { buildStarModel } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import { referenceKOverSigmaK, referenceUtility } from '../../reference/schedule.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import type { CandidateSlot, PriorVisit, ScheduleProblem } from '../../src/schedule/types.js';
import { simulateWeather } from '../../src/schedule/weather.js';

const SETTINGS = { overshootWeight: 0.1 };

/** A synthetic problem whose first nights are already observed: some of their slots become prior visits. */
function withPrior(seed: number, sharedNight: boolean): ScheduleProblem {
  const problem = syntheticProblem({
    targets: 6,
    nights: 10,
    slotsPerNight: 4,
    searchFraction: 0.34,
    visibleFraction: 0.8,
    time: { mode: 'choose-nights', nights: 3 },
    minSpacingHours: 1,
    onePerNight: false,
    nightHours: 6,
    seed,
    phaseErrors: true,
  });
  const rng = createRng(seed + 100);
  const past = new Set([0, 1, 2]);
  const prior: PriorVisit[] = problem.slots
    .filter((s) => past.has(s.nightIndex) && rng.uniform() < 0.3)
    .map((s) => ({ targetId: s.targetId, localDate: problem.nights[s.nightIndex]!.localDate, midBjdTdb: s.midBjdTdb, whiteSigmaMps: s.whiteSigmaMps }));
  // With `sharedNight`, night 3 stays in the problem and also holds a prior visit of every star.
  const keep = (s: CandidateSlot) => !past.has(s.nightIndex);
  if (sharedNight) {
    for (const s of problem.slots.filter((x) => x.nightIndex === 3 && x.slotId.endsWith('/0'))) {
      prior.push({ targetId: s.targetId, localDate: problem.nights[3]!.localDate, midBjdTdb: s.midBjdTdb - 0.01, whiteSigmaMps: s.whiteSigmaMps });
    }
  }
  return { ...problem, nights: problem.nights.filter((n) => !past.has(n.index)), slots: problem.slots.filter(keep), prior };
}

function chosen(problem: ScheduleProblem, ids: string[]): CandidateSlot[] {
  const byId = new Map(problem.slots.map((s) => [s.slotId, s]));
  return ids.map((id) => byId.get(id)!);
}

describe('prior visits in the optimiser', () => {
  it('the plan utility counts them exactly as a from-scratch recomputation does (slow reference)', () => {
    for (const seed of [1, 2, 3, 4]) {
      for (const sharedNight of [false, true]) {
        const problem = withPrior(seed, sharedNight);
        expect(problem.prior!.length).toBeGreaterThan(3);
        const result = optimiseSchedule(problem, { seed, restarts: 2 });
        expect(result.utility).toBeCloseTo(referenceUtility(problem, chosen(problem, result.slotIds), SETTINGS), 9);
        // And they are worth something: without them the same visits reach less.
        const without = { ...problem, prior: [] };
        expect(referenceUtility(without, chosen(problem, result.slotIds), SETTINGS)).toBeLessThan(result.utility);
      }
    }
  });

  it('a granted night stays open, is not counted, and the plan is what a from-scratch recomputation says (restarts included)', () => {
    for (const seed of [6, 7, 8]) {
      const base = withPrior(seed, true);
      const granted = base.nights[0]!.index;
      const problem = {
        ...base,
        nights: base.nights.map((n) => (n.index === granted ? { ...n, granted: true } : n)),
        time: { mode: 'choose-nights' as const, nights: 2 },
      };
      const result = optimiseSchedule(problem, { seed, restarts: 12 });
      expect(new Set(result.slotIds).size).toBe(result.slotIds.length);
      expect(result.nightIndices).toContain(granted);
      expect(result.nightIndices.filter((n) => n !== granted).length).toBeLessThanOrEqual(2);
      expect(result.utility).toBeCloseTo(referenceUtility(problem, chosen(problem, result.slotIds), SETTINGS), 9);
    }
  });

  it('a clear-sky weather replay keeps them (each planet and search reaches what the plan says)', () => {
    const problem = withPrior(5, true);
    const clear = { ...problem, nights: problem.nights.map((n) => ({ ...n, clearProbability: 1 })) };
    const result = optimiseSchedule(clear, { seed: 1, restarts: 1 });
    const weather = simulateWeather(clear, result, 3, 1);
    const reference = referenceKOverSigmaK(clear, chosen(clear, result.slotIds));
    weather.targets.forEach((t, i) => {
      expect(t.meanKOverSigmaK).toBeCloseTo(reference[i]!, 9);
    });
    expect(weather.meanUtility).toBeCloseTo(result.utility, 9);
  });

  it('a planet whose past visits already reach its goal gets no further visits, even with nights to spare', () => {
    const nights = Array.from({ length: 6 }, (_, n) => ({
      index: n,
      localDate: `2027-03-0${n + 1}`,
      clearProbability: 1,
      hoursAvailable: 8,
      midBjdTdb: 100 + n + 0.25,
    }));
    const star = (id: string, periodDays: number) => ({
      id,
      planets: [{ id: `${id} b`, priority: 1, kMps: 8, goalSignificance: 5 }],
      model: buildStarModel({
        planets: [{ id: `${id} b`, kMps: 8, periodDays, tcBjdTdb: 99.3, periodErrDays: 0, tcErrDays: 0, ecc: 0, omegaDeg: 90 }],
        nightlyJitterMps: 0,
        spanBjdTdb: [100, 106],
      }),
    });
    const slots: CandidateSlot[] = [];
    for (const id of ['DONE', 'OPEN']) {
      for (const n of nights) {
        for (let k = 0; k < 8; k++) {
          const midBjdTdb = n.midBjdTdb - 0.15 + k * 0.04;
          slots.push({
            slotId: `${id}/${n.index}/${k}`,
            targetId: id,
            nightIndex: n.index,
            startMs: (midBjdTdb - 2440587.5) * 86_400_000,
            durationSec: 900,
            whiteSigmaMps: 2,
            midBjdTdb,
          });
        }
      }
    }
    // Twelve past visits of DONE, six at each quadrature, σ = 1 m/s: K/σ_K = 8 √12 ≈ 28, far past 5.
    const prior: PriorVisit[] = Array.from({ length: 12 }, (_, i) => ({
      targetId: 'DONE',
      localDate: `2027-02-${10 + i}`,
      midBjdTdb: 99.3 - 3.1 * (10 - Math.floor(i / 2)) + 3.1 * (i % 2 ? 0.75 : 0.25),
      whiteSigmaMps: 1,
    }));
    const problem: ScheduleProblem = {
      nights,
      targets: [star('DONE', 3.1), star('OPEN', 4.3)],
      slots,
      time: { mode: 'given-nights' },
      constraints: { minSpacingHours: 20, onePerNight: true },
      prior,
    };
    const before = referenceKOverSigmaK({ ...problem, slots: [] }, []);
    expect(before[0]).toBeGreaterThan(5);
    const result = optimiseSchedule(problem, { seed: 1 });
    expect(result.targets[0]!.priorVisits).toBe(12);
    expect(result.targets[0]!.visits).toBe(0);
    expect(result.targets[1]!.visits).toBeGreaterThan(0);
  });
});
