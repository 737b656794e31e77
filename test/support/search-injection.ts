// Injection–recovery completeness of one star's visits at its search mass (src/rv/injection.ts:
// GLS periodogram, Baluev FAP over the search band, the highest peak within 1/T of the injected
// frequency), periods drawn log-uniform over the search range (seeded), circular orbits, random
// phase; and random visit sets of the same star and count from its candidate slots, under the
// campaign's spacing (one a night when minSpacingHours >= 12).
import { injectionRecovery } from '../../src/rv/injection.js';
import { createRng, type Rng } from '../../src/rv/random.js';

export interface SearchCase {
  periodMinDays: number;
  periodMaxDays: number;
  msiniEarth: number;
  starMassSun: number;
}

export interface Visit {
  bjdTdb: number;
  sigmaMps: number;
  /** The evening's date or any night key. */
  night: string;
}

/** Detections and trials: `periods` log-uniform periods (seeded), `trialsPerPeriod` phases and noise draws each. */
export function injectedCompleteness(
  visits: Visit[],
  search: SearchCase,
  periods: number,
  trialsPerPeriod: number,
  seed: number,
): { detected: number; trials: number } {
  const rng = createRng(seed);
  const logMin = Math.log(search.periodMinDays);
  const logSpan = Math.log(search.periodMaxDays / search.periodMinDays);
  const periodsDays = Array.from({ length: periods }, () => Math.exp(logMin + logSpan * rng.uniform()));
  const map = injectionRecovery({
    timesBjdTdb: visits.map((v) => v.bjdTdb),
    rvErrorsMps: visits.map((v) => v.sigmaMps),
    periodsDays,
    msinisEarth: [search.msiniEarth],
    starMassSun: search.starMassSun,
    trialsPerCell: trialsPerPeriod,
    seed: seed + 1,
    grid: { minPeriodDays: search.periodMinDays, maxPeriodDays: search.periodMaxDays },
  });
  const detected = map.detection.reduce((sum, row) => sum + row[0]! * trialsPerPeriod, 0);
  return { detected: Math.round(detected), trials: periods * trialsPerPeriod };
}

/** The campaign's spacing rules (src/schedule/types.ts ScheduleConstraints); perNight: the star's visitsPerNight. */
export interface Spacing {
  minSpacingHours: number;
  onePerNight: boolean;
  perNight: number;
  sameNightSpacingHours: number;
}

/**
 * `count` of the candidate visits drawn at random, no two closer than minSpacingHours (and, with
 * onePerNight, at most perNight a night): the candidates shuffled and taken in turn when they fit, again when
 * it gets stuck; undefined when 200 shuffles give none (a plan packed tight by the optimiser, such
 * as 14 visits 3 hours apart on 5 nights, is rarely matched by chance).
 */
export function randomVisitSet(candidates: Visit[], count: number, spacing: Spacing, rng: Rng): Visit[] | undefined {
  const { minSpacingHours, onePerNight, perNight, sameNightSpacingHours } = spacing;
  const order = candidates.map((_, i) => i);
  for (let attempt = 0; attempt < 200; attempt++) {
    // Fisher–Yates shuffle (common practice), then each candidate in turn if it fits.
    for (let i = order.length - 1; i > 0; i--) {
      const k = Math.floor(rng.uniform() * (i + 1));
      [order[i], order[k]] = [order[k]!, order[i]!];
    }
    const chosen: Visit[] = [];
    for (let i = 0; i < order.length && chosen.length < count; i++) {
      const v = candidates[order[i]!]!;
      const hours = (c: Visit) => Math.abs(c.bjdTdb - v.bjdTdb) * 24;
      const clash = onePerNight
        ? chosen.filter((c) => c.night === v.night).length >= perNight ||
          chosen.some((c) => (c.night === v.night ? hours(c) < sameNightSpacingHours : hours(c) < minSpacingHours))
        : chosen.some((c) => hours(c) < minSpacingHours);
      if (!clash) chosen.push(v);
    }
    if (chosen.length === count) return chosen.sort((a, b) => a.bjdTdb - b.bjdTdb);
  }
  return undefined;
}

/** Detections of `sets` random visit sets, each injected with `periods` x `trialsPerPeriod` trials; undefined when no random set fits. */
export function randomCompleteness(
  candidates: Visit[],
  count: number,
  spacing: Spacing,
  search: SearchCase,
  sets: number,
  periods: number,
  trialsPerPeriod: number,
  seed: number,
): { detected: number; trials: number } | undefined {
  const rng = createRng(seed);
  let detected = 0;
  let trials = 0;
  for (let s = 0; s < sets; s++) {
    const visits = randomVisitSet(candidates, count, spacing, rng);
    if (!visits) return undefined;
    const r = injectedCompleteness(visits, search, periods, trialsPerPeriod, seed + 1000 * (s + 1));
    detected += r.detected;
    trials += r.trials;
  }
  return { detected, trials };
}

/** planned − random and its standard error (independent binomial trials). */
export function margin(
  planned: { detected: number; trials: number },
  random: { detected: number; trials: number },
): { diff: number; se: number; p: number; r: number } {
  const p = planned.detected / planned.trials;
  const r = random.detected / random.trials;
  return { diff: p - r, se: Math.sqrt((p * (1 - p)) / planned.trials + (r * (1 - r)) / random.trials), p, r };
}
