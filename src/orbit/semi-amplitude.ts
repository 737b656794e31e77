import { DAY_SEC, GM_EARTH, GM_SUN } from '../astro/constants.js';

export interface SemiAmplitudeInput {
  starMassSun: number;
  planetMassEarth: number;
  periodDays: number;
  /** Eccentricity, 0 <= e < 1. */
  ecc?: number;
  /** Orbital inclination in degrees; 90 = edge-on. Omitted: K of m sin i = m. */
  inclinationDeg?: number;
}

/**
 * Semi-amplitude of the star's reflex velocity (m/s), planet mass not neglected:
 * K = (2πG/P)^(1/3) · m_p sin i / (M★ + m_p)^(2/3) · 1/√(1 − e²)
 * (Cumming, Marcy & Butler 1999, ApJ 526, 890; Lovis & Fischer 2010). Written with the nominal
 * mass parameters GM (IAU 2015 B3) so that G never multiplies a mass in kilograms.
 */
export function semiAmplitudeMps(input: SemiAmplitudeInput): number {
  const { starMassSun, planetMassEarth, periodDays, ecc = 0, inclinationDeg = 90 } = input;
  const periodSec = periodDays * DAY_SEC;
  const gmPlanet = planetMassEarth * GM_EARTH;
  const gmTotal = starMassSun * GM_SUN + gmPlanet;
  const sinI = Math.sin((inclinationDeg * Math.PI) / 180);
  return (Math.cbrt((2 * Math.PI) / periodSec) * (gmPlanet * sinI)) / gmTotal ** (2 / 3) / Math.sqrt(1 - ecc * ecc);
}
