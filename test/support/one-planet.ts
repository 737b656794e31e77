// A star with one circular planet for scheduler tests: its information model from the given
// ephemeris (times in the slots' midBjdTdb scale).
import { buildStarModel } from '../../src/rv/information-model.js';
import type { ScheduleTarget } from '../../src/schedule/types.js';

export function onePlanetStar(
  id: string,
  planet: { kMps: number; periodDays: number; tcBjdTdb: number; tcErrDays?: number; periodErrDays?: number; goalSignificance?: number; priority?: number },
  spanDays: [number, number],
  nightlyJitterMps = 0,
): ScheduleTarget {
  const model = buildStarModel({
    planets: [
      {
        id,
        kMps: planet.kMps,
        periodDays: planet.periodDays,
        tcBjdTdb: planet.tcBjdTdb,
        tcErrDays: planet.tcErrDays ?? 0,
        periodErrDays: planet.periodErrDays ?? 0,
        ecc: 0,
        omegaDeg: 90,
      },
    ],
    nightlyJitterMps,
    spanBjdTdb: spanDays,
  });
  return { id, planets: [{ id, priority: planet.priority ?? 1, kMps: planet.kMps, goalSignificance: planet.goalSignificance ?? 5 }], model };
}
