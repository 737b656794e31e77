// Invented scheduling problems for tests and the bench: nights one day apart, each target visible
// for a few hours a night in a window that drifts earlier by about 4 minutes a night (a sidereal
// day is shorter than a solar one, common practice), evenly spaced candidate slots in that window,
// one circular planet per ephemeris star, with catalogue errors on Tc and P that the star's
// information model carries as priors (src/rv/information-model.ts). All values are made up.
import { buildStarModel } from '../src/rv/information-model.js';
import { createRng, type Rng } from '../src/rv/random.js';
import type { CandidateSlot, ScheduleNight, ScheduleProblem, ScheduleTarget, ScheduleTimeModel } from '../src/schedule/types.js';

export interface SyntheticSpec {
  targets: number;
  nights: number;
  /** Candidate slots per target in each night it is visible. */
  slotsPerNight: number;
  /** Fraction of blind-search targets. */
  searchFraction: number;
  /** Fraction of nights on which a target is visible at all. */
  visibleFraction: number;
  time: ScheduleTimeModel;
  minSpacingHours: number;
  onePerNight: boolean;
  /** With onePerNight: visits a night allowed to every other target (the first, third, ...), and their spacing; default 1 and 0. */
  visitsPerNight?: number;
  sameNightSpacingHours?: number;
  /** Hours of dark time per night. */
  nightHours: number;
  seed: number;
  /** Ephemeris phase errors (false: every phase exact). */
  phaseErrors: boolean;
}

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;
/** 2027-01-01T00:00Z, the invented campaign's first evening. */
const FIRST_NIGHT_MS = Date.UTC(2027, 0, 1, 20);

function between(rng: Rng, lo: number, hi: number): number {
  return lo + (hi - lo) * rng.uniform();
}

interface SyntheticOrbit {
  periodDays: number;
  tcBjdTdb: number;
  tcErrDays: number;
  periodErrDays: number;
}

function syntheticTarget(rng: Rng, i: number, search: boolean, orbit: SyntheticOrbit, spanDays: [number, number]): ScheduleTarget {
  const id = `${search ? 'SRCH' : 'EPH'}-${String(i + 1).padStart(4, '0')}`;
  const priority = Math.ceil(between(rng, 0, 3));
  if (search) {
    const periodMinDays = Math.exp(between(rng, Math.log(2), Math.log(20)));
    return {
      id,
      planets: [],
      search: { id, priority, goalCompleteness: 0.5, kMps: between(rng, 2, 8), periodMinDays, periodMaxDays: periodMinDays * between(rng, 2, 8) },
    };
  }
  const kMps = between(rng, 2, 12);
  const model = buildStarModel({
    planets: [
      {
        id,
        kMps,
        periodDays: orbit.periodDays,
        tcBjdTdb: orbit.tcBjdTdb,
        periodErrDays: orbit.periodErrDays,
        tcErrDays: orbit.tcErrDays,
        ecc: 0,
        omegaDeg: 90,
      },
    ],
    nightlyJitterMps: 0,
    spanBjdTdb: spanDays,
  });
  return { id, planets: [{ id, priority, goalSignificance: 5, kMps }], model };
}

export function syntheticProblem(spec: SyntheticSpec): ScheduleProblem {
  const rng = createRng(spec.seed);
  const nights: ScheduleNight[] = Array.from({ length: spec.nights }, (_, i) => ({
    index: i,
    localDate: new Date(FIRST_NIGHT_MS + i * DAY_MS).toISOString().slice(0, 10),
    clearProbability: between(rng, 0.5, 0.9),
    hoursAvailable: spec.nightHours,
    midBjdTdb: i + spec.nightHours / 48,
  }));
  const searchCount = Math.round(spec.targets * spec.searchFraction);
  const kinds = Array.from({ length: spec.targets }, (_, i) => i >= spec.targets - searchCount);
  const targets: ScheduleTarget[] = [];
  const slots: CandidateSlot[] = [];
  kinds.forEach((search, i) => {
    const periodDays = Math.exp(between(rng, Math.log(1), Math.log(15)));
    const orbit: SyntheticOrbit = {
      periodDays,
      tcBjdTdb: between(rng, 0, periodDays),
      tcErrDays: spec.phaseErrors ? between(rng, 0.0005, 0.03) : 0,
      periodErrDays: spec.phaseErrors ? between(rng, 0, 0.002) : 0,
    };
    const target = syntheticTarget(rng, i, search, orbit, [0, spec.nights]);
    if (spec.visitsPerNight !== undefined && i % 2 === 0) target.visitsPerNight = spec.visitsPerNight;
    targets.push(target);
    const durationSec = Math.round(between(rng, 600, 2400));
    const whiteSigmaMps = between(rng, 1, 4);
    const windowHours = between(rng, 2, spec.nightHours);
    // Hours after dusk at which the window opens on the first night; drifts 4 min earlier per night.
    const openHours0 = between(rng, -spec.nightHours, spec.nightHours);
    for (const night of nights) {
      if (rng.uniform() > spec.visibleFraction) continue;
      const opens = Math.max(0, openHours0 - (4 / 60) * night.index);
      const closes = Math.min(spec.nightHours, openHours0 - (4 / 60) * night.index + windowHours);
      const usable = closes - opens - durationSec / 3600;
      if (usable < 0) continue;
      for (let k = 0; k < spec.slotsPerNight; k++) {
        const startMs =
          FIRST_NIGHT_MS + night.index * DAY_MS + (opens + (spec.slotsPerNight === 1 ? usable / 2 : (usable * k) / (spec.slotsPerNight - 1))) * HOUR_MS;
        const midBjdTdb = (startMs + (durationSec * 1000) / 2 - FIRST_NIGHT_MS) / DAY_MS;
        slots.push({
          slotId: `${target.id}/${night.index}/${k}`,
          targetId: target.id,
          nightIndex: night.index,
          startMs,
          durationSec,
          whiteSigmaMps: whiteSigmaMps * between(rng, 1, 1.3),
          midBjdTdb,
        });
      }
    }
  });
  return {
    nights,
    targets,
    slots,
    time: spec.time,
    constraints: { minSpacingHours: spec.minSpacingHours, onePerNight: spec.onePerNight, sameNightSpacingHours: spec.sameNightSpacingHours ?? 0 },
  };
}
