// What the planned visits deliver, judged the way an astronomer would: the plan's claimed σ_K
// against Monte Carlo fits of simulated RVs at the planned times (test/support/fit-rv.ts: the
// full Keplerian model, γ, K, Tc and P of every planet fitted with the catalogue ephemeris as a
// prior, the true noise covariance), and the same fits at random visits in the same windows.
import { describe, expect, it } from 'vitest';
import { buildStarModel, type PlanetInput, type StarInput } from '../../src/rv/information-model.js';
import { informationVisits, kVariances } from '../../src/rv/information.js';
import { createRng, type Rng } from '../../src/rv/random.js';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import type { CandidateSlot, ScheduleProblem } from '../../src/schedule/types.js';
import { monteCarloKErrors, rms, type FitVisit } from '../support/fit-rv.js';

const BJD0 = 2461100.5;
const NIGHTS = 60;
const SLOT_SEC = 1200;
const SIGMA_MPS = 2.5;
/** Monte Carlo data sets per visit set (the RMS is then good to about 1/sqrt(2 n) = 1.6%). */
const DATA_SETS = 2000;

/**
 * Candidate slots every 30 minutes in an 8-hour window a night (the window opens 4 minutes
 * earlier each night, as a star's does), for one star; night n's middle at BJD0 + n + 0.25.
 */
function slots(starId: string): CandidateSlot[] {
  const out: CandidateSlot[] = [];
  for (let n = 0; n < NIGHTS; n++) {
    const opens = 0.08 - (4 / 1440) * n;
    for (let k = 0; k < 16; k++) {
      const midBjdTdb = BJD0 + n + opens + (k * 30 + 10) / 1440;
      out.push({
        slotId: `${n}/${k}`,
        targetId: starId,
        nightIndex: n,
        startMs: (midBjdTdb - 2440587.5) * 86_400_000 - 600_000,
        durationSec: SLOT_SEC,
        whiteSigmaMps: SIGMA_MPS,
        midBjdTdb,
      });
    }
  }
  return out;
}

function problemOf(star: StarInput, visits: number, onePerNight: boolean, goalSignificance: number): ScheduleProblem {
  const model = buildStarModel(star);
  return {
    nights: Array.from({ length: NIGHTS }, (_, n) => ({ index: n, localDate: `n${n}`, clearProbability: 1, hoursAvailable: 8, midBjdTdb: BJD0 + n + 0.25 })),
    targets: [{ id: 'S', planets: star.planets.map((p) => ({ id: p.id, priority: 1, kMps: p.kMps, goalSignificance })), model }],
    slots: slots('S'),
    time: { mode: 'hours', hours: (visits * SLOT_SEC) / 3600 + 1e-6 },
    constraints: { minSpacingHours: onePerNight ? 0 : 1, onePerNight },
  };
}

const asFit = (s: CandidateSlot): FitVisit => ({
  bjdTdb: s.midBjdTdb,
  whiteSigmaMps: s.whiteSigmaMps,
  night: s.nightIndex,
  nightBjdTdb: BJD0 + s.nightIndex + 0.25,
});

function plannedVisits(problem: ScheduleProblem): FitVisit[] {
  const byId = new Map(problem.slots.map((s) => [s.slotId, s]));
  return optimiseSchedule(problem, { seed: 1 }).slotIds.map((id) => asFit(byId.get(id)!));
}

/** `count` random slots of the problem that its constraints allow: distinct nights, or at least an hour apart. */
function randomVisits(problem: ScheduleProblem, count: number, rng: Rng): FitVisit[] {
  const chosen: CandidateSlot[] = [];
  while (chosen.length < count) {
    const s = problem.slots[Math.floor(rng.uniform() * problem.slots.length)]!;
    const clash = chosen.some((c) => (problem.constraints.onePerNight ? c.nightIndex === s.nightIndex : Math.abs(c.midBjdTdb - s.midBjdTdb) < 1 / 24));
    if (!clash) chosen.push(s);
  }
  return chosen.sort((a, b) => a.midBjdTdb - b.midBjdTdb).map(asFit);
}

function claimedSigmaK(star: StarInput, visits: FitVisit[]): number[] {
  const model = buildStarModel(star);
  return Array.from(kVariances(model, informationVisits(model, visits)), Math.sqrt);
}

function measuredSigmaK(star: StarInput, visitSets: FitVisit[][], seed: number): number[] {
  const rng = createRng(seed);
  const errors = star.planets.map(() => [] as number[]);
  for (const visits of visitSets) {
    const result = monteCarloKErrors({ planets: star.planets, nightlyJitterMps: star.nightlyJitterMps, visits }, Math.ceil(DATA_SETS / visitSets.length), rng);
    result.kErrors.forEach((e, i) => {
      errors[i]!.push(...e);
    });
  }
  return errors.map(rms);
}

/** A catalogue ephemeris measured `ageDays` before the window, with the phase error `phaseErrEnd` cycles at the window's end. */
function planet(id: string, kMps: number, periodDays: number, phaseErrEnd: number, ageDays: number): PlanetInput {
  const tcBjdTdb = BJD0 - ageDays + 0.37 * periodDays;
  const tcErrDays = 0.002 * periodDays;
  const orbits = (BJD0 + NIGHTS - tcBjdTdb) / periodDays;
  const periodErrDays = Math.sqrt(Math.max(0, (phaseErrEnd * periodDays) ** 2 - tcErrDays ** 2)) / orbits;
  return { id, kMps, periodDays, tcBjdTdb, tcErrDays, periodErrDays, ecc: 0, omegaDeg: 90 };
}

const span: [number, number] = [BJD0, BJD0 + NIGHTS];

const CASES: { name: string; star: StarInput; visits: number; onePerNight: boolean; margin: number }[] = [
  {
    name: 'phase error 0.15 cycles at the end',
    star: { planets: [planet('b', 4, 3.71, 0.15, 700)], nightlyJitterMps: 0, spanBjdTdb: span },
    visits: 20,
    onePerNight: true,
    margin: 1,
  },
  {
    name: 'nightly jitter 2 m/s, several visits a night',
    star: { planets: [planet('b', 4, 5.93, 0.01, 200)], nightlyJitterMps: 2, spanBjdTdb: span },
    visits: 24,
    onePerNight: false,
    margin: 0.85,
  },
  {
    name: 'two planets',
    star: { planets: [planet('b', 4, 3.71, 0.02, 300), planet('c', 3, 11.2, 0.03, 300)], nightlyJitterMps: 0, spanBjdTdb: span },
    visits: 24,
    onePerNight: true,
    margin: 0.9,
  },
];

describe('planned visits, fitted as an astronomer would', () => {
  for (const c of CASES) {
    it(`${c.name}: claimed σ_K within 10% of the fits, and better than random visits fitted the same way`, () => {
      const problem = problemOf(c.star, c.visits, c.onePerNight, 100);
      const planned = plannedVisits(problem);
      expect(planned.length).toBe(c.visits);
      const claimed = claimedSigmaK(c.star, planned);
      const measured = measuredSigmaK(c.star, [planned], 11);
      const rng = createRng(5);
      const random = measuredSigmaK(
        c.star,
        Array.from({ length: 8 }, () => randomVisits(problem, c.visits, rng)),
        12,
      );
      c.star.planets.forEach((p, i) => {
        console.log(
          `${c.name}, planet ${p.id}: claimed ${claimed[i]!.toFixed(3)} m/s, fitted ${measured[i]!.toFixed(3)} m/s; ` +
            `random visits fitted ${random[i]!.toFixed(3)} m/s`,
        );
        expect(Math.abs(measured[i]! / claimed[i]! - 1)).toBeLessThan(0.1);
        // The planned visits are worth more than random ones (each RMS is good to about 1.6% at
        // 2,000 data sets). The stale case is the close one, 2% apart: random visits also spread
        // in phase, which is what a stale ephemeris needs; the others are 20-30% apart.
        expect(measured[i]!).toBeLessThan(c.margin * random[i]!);
      });
    });
  }
});

describe('visits needed on a fresh ephemeris', () => {
  it('the plan reaches K/σ_K = 5 with at most 0.55 times the visits random nights need', () => {
    const star: StarInput = { planets: [planet('b', 3, 3.3, 0, 100)], nightlyJitterMps: 0, spanBjdTdb: span };
    const reachesWithPlan = (n: number) => 3 / claimedSigmaK(star, plannedVisits(problemOf(star, n, true, 5)))[0]! >= 5;
    let planned = 2;
    while (!reachesWithPlan(planned)) planned++;
    // Random nights: the median K/σ_K over 200 draws of n visits (exact here: with a fresh
    // ephemeris the model is linear in γ and K, so the fit's σ_K is the Fisher one).
    const rng = createRng(9);
    const problem = problemOf(star, 1, true, 5);
    const medianRatio = (n: number) => {
      const ratios = Array.from({ length: 200 }, () => 3 / claimedSigmaK(star, randomVisits(problem, n, rng))[0]!).sort((a, b) => a - b);
      return ratios[100]!;
    };
    let random = planned;
    while (medianRatio(random) < 5) random++;
    console.log(`visits to K/σ_K = 5: planned ${planned}, random ${random} (ratio ${(planned / random).toFixed(2)})`);
    expect(planned).toBeLessThanOrEqual(0.55 * random);
  });
});
