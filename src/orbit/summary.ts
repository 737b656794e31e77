import { EARTH_PER_JUPITER } from '../astro/constants.js';
import { semiMajorAxisAu } from './kepler-third-law.js';
import { orbitalSpeedsMps, starOrbitRadiusM } from './reflex.js';
import { semiAmplitudeMps, type SemiAmplitudeInput } from './semi-amplitude.js';

/** Everything `crest amplitude` reports about one star–planet pair; units in the names. */
export interface OrbitSummary {
  starMassSun: number;
  periodDays: number;
  ecc: number;
  inclinationDeg: number;
  kMps: number;
  massEarth: number;
  massJupiter: number;
  msiniEarth: number;
  msiniJupiter: number;
  semiMajorAxisAu: number;
  starOrbitRadiusKm: number;
  /** a★ sin i, what the RV curve measures. */
  starOrbitProjectedKm: number;
  /** Barycentric speeds where the separation equals a (exact for circular orbits). */
  planetSpeedKmps: number;
  starSpeedMps: number;
}

/** Combines Kepler's third law, K and the reflex orbit for one star–planet pair. */
export function summarizeOrbit(input: SemiAmplitudeInput): OrbitSummary {
  const { starMassSun, planetMassEarth, periodDays, ecc = 0, inclinationDeg = 90 } = input;
  const sinI = Math.sin((inclinationDeg * Math.PI) / 180);
  const starOrbitRadiusKm = starOrbitRadiusM(input) / 1000;
  const speeds = orbitalSpeedsMps(input);
  return {
    starMassSun,
    periodDays,
    ecc,
    inclinationDeg,
    kMps: semiAmplitudeMps({ starMassSun, planetMassEarth, periodDays, ecc, inclinationDeg }),
    massEarth: planetMassEarth,
    massJupiter: planetMassEarth / EARTH_PER_JUPITER,
    msiniEarth: planetMassEarth * sinI,
    msiniJupiter: (planetMassEarth * sinI) / EARTH_PER_JUPITER,
    semiMajorAxisAu: semiMajorAxisAu(input),
    starOrbitRadiusKm,
    starOrbitProjectedKm: starOrbitRadiusKm * sinI,
    planetSpeedKmps: speeds.planetMps / 1000,
    starSpeedMps: speeds.starMps,
  };
}
