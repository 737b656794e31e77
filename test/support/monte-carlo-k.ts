// The claimed σ_K of src/rv/information.ts against what fitting simulated data actually gives,
// shared by test/rv/monte-carlo-k-*.test.ts (one file per case, so that the two test workers
// share the load): 2,000 data sets per case, each fitted with the full nonlinear Keplerian model,
// the catalogue ephemeris as a prior and the true noise covariance (test/support/fit-rv.ts). For
// a well sampled orbit the Cramér–Rao bound of the linearised model is what such a fit attains
// (Kay 1993, Fundamentals of Statistical Signal Processing I, ch. 3 and 7: the MLE is
// asymptotically efficient), so the RMS of (fitted K − true K) should match sqrt(Var K) to within
// the Monte Carlo error (about 1/sqrt(2 × 2000) = 1.6 % on an RMS) plus a little nonlinearity.
import { expect } from 'vitest';
import { type PlanetInput, type StarInput, buildStarModel } from '../../src/rv/information-model.js';
import { informationVisits, kVariances } from '../../src/rv/information.js';
import { type Rng, createRng } from '../../src/rv/random.js';
import { type FitVisit, monteCarloKErrors, rms } from './fit-rv.js';

export const DATA_SETS = 2000;
const TOLERANCE = 0.1;
export const BJD0 = 2460500.5;

/** The describe title every case file shares. */
export const MONTE_CARLO_TITLE = 'claimed σ_K against Monte Carlo fits (2,000 data sets each)';

/**
 * A circular planet whose catalogue transit is `ageDays` before the span starts, with σ_Tc =
 * 0.004 P and σ_P set so that the phase error at the span's end is `phaseErrEnd` cycles:
 * σ_φ(end)² = (σ_Tc² + N² σ_P²) / P², N the orbits from Tc to the end (common practice).
 */
export function stalePlanet(
  id: string,
  kMps: number,
  periodDays: number,
  phaseErrEnd: number,
  span: [number, number],
  ageDays: number,
  offset: number,
): PlanetInput {
  const tcBjdTdb = span[0] - ageDays + offset * periodDays;
  const tcErrDays = 0.004 * periodDays;
  const orbits = (span[1] - tcBjdTdb) / periodDays;
  const periodErrDays = Math.sqrt((phaseErrEnd * periodDays) ** 2 - tcErrDays ** 2) / orbits;
  return { id, kMps, periodDays, tcBjdTdb, tcErrDays, periodErrDays, ecc: 0, omegaDeg: 90 };
}

/** One visit per night on `nights` distinct random nights of the span, at a random time in each. */
export function onePerNight(rng: Rng, span: [number, number], nights: number, whiteSigmaMps: number): FitVisit[] {
  const days = new Set<number>();
  while (days.size < nights) days.add(Math.floor(span[0] - BJD0 + rng.uniform() * (span[1] - span[0] - 1)));
  return [...days]
    .sort((a, b) => a - b)
    .map((night) => {
      const bjd = BJD0 + night + 0.1 + 0.3 * rng.uniform();
      return { bjdTdb: bjd, whiteSigmaMps, night, nightBjdTdb: BJD0 + night + 0.25 };
    });
}

/** The claimed σ_K per planet and the Monte Carlo RMS of the fitted K errors. */
function compare(name: string, star: StarInput, visits: FitVisit[], seed: number): { claimed: number[]; measured: number[] } {
  const model = buildStarModel(star);
  const claimed = Array.from(kVariances(model, informationVisits(model, visits)), Math.sqrt);
  const result = monteCarloKErrors(
    { planets: star.planets, nightlyJitterMps: star.nightlyJitterMps, activity: star.activity, visits },
    DATA_SETS,
    createRng(seed),
  );
  const measured = result.kErrors.map(rms);
  const bias = result.kErrors.map((e) => e.reduce((s, v) => s + v, 0) / e.length);
  result.kErrors.forEach((e, i) => {
    const sorted = [...e].sort((a, b) => a - b);
    const q = (f: number) => sorted[Math.floor(f * (sorted.length - 1))]!;
    const mad = [...e].map((v) => Math.abs(v - q(0.5))).sort((a, b) => a - b)[Math.floor(e.length / 2)]!;
    console.log(
      `monte carlo ${name}, planet ${star.planets[i]!.id}: error quantiles 1/5/25/50/75/95/99%: ` +
        `${[0.01, 0.05, 0.25, 0.5, 0.75, 0.95, 0.99].map((f) => q(f).toFixed(2)).join(' ')}; ` +
        `1.4826 MAD ${(1.4826 * mad).toFixed(3)}; beyond 4 claimed σ: ${e.filter((v) => Math.abs(v) > 4 * claimed[i]!).length}`,
    );
  });
  star.planets.forEach((pl, i) => {
    console.log(
      `monte carlo ${name}, planet ${pl.id}: claimed σ_K ${claimed[i]!.toFixed(4)} m/s, measured RMS ${measured[i]!.toFixed(4)} m/s ` +
        `(ratio ${(measured[i]! / claimed[i]!).toFixed(3)}, mean error ${bias[i]!.toFixed(4)} m/s, ${result.failures} of ${DATA_SETS} fits failed)`,
    );
  });
  expect(result.failures).toBeLessThan(DATA_SETS / 100);
  return { claimed, measured };
}

/**
 * Fits `DATA_SETS` simulated data sets of `star` on `visits` (noise drawn from `seed`) and
 * expects each planet's measured RMS K error within TOLERANCE of the claimed σ_K.
 */
export function expectClaimedSigmaK(name: string, star: StarInput, visits: FitVisit[], seed: number): void {
  const { claimed, measured } = compare(name, star, visits, seed);
  claimed.forEach((c, i) => {
    expect(Number.isFinite(c)).toBe(true);
    expect(Math.abs(measured[i]! / c - 1), `planet ${i}: claimed ${c}, measured ${measured[i]}`).toBeLessThan(TOLERANCE);
  });
}
