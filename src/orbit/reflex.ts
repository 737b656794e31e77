import { AU_M, DAY_SEC } from '../astro/constants.js';
import { planetMassFraction, semiMajorAxisAu, systemGm, type TwoBody } from './kepler-third-law.js';

type Orbit = TwoBody & { periodDays: number };

/**
 * Semi-major axis of the star's own orbit about the barycentre (m):
 * a★ = a · m_p / (M★ + m_p) (docs/references.md [Reflex-orbit]).
 */
export function starOrbitRadiusM(orbit: Orbit): number {
  return semiMajorAxisAu(orbit) * AU_M * planetMassFraction(orbit.starMassSun, orbit.planetMassEarth);
}

/**
 * Projected semi-major axis of the star's orbit (m) from its RV semi-amplitude:
 * a★ sin i = K P √(1 − e²) / 2π (docs/references.md [Reflex-orbit]).
 */
export function projectedStarOrbitM(input: { kMps: number; periodDays: number; ecc?: number }): number {
  const { kMps, periodDays, ecc = 0 } = input;
  return (kMps * periodDays * DAY_SEC * Math.sqrt(1 - ecc * ecc)) / (2 * Math.PI);
}

export interface OrbitalSpeeds {
  /** Speed of the planet about the barycentre (m/s). */
  planetMps: number;
  /** Speed of the star about the barycentre (m/s). */
  starMps: number;
}

/**
 * Barycentric speeds of planet and star where their separation equals a (exact at all times for a
 * circular orbit). Vis-viva, v² = G(M★ + m_p)(2/r − 1/a), gives the relative speed √(G(M★ + m_p)/a)
 * = 2πa/P at r = a; the bodies share it in inverse proportion to their masses, so that momentum
 * balances, M★ v★ = m_p v_p (docs/references.md [Reflex-orbit]).
 */
export function orbitalSpeedsMps(orbit: Orbit): OrbitalSpeeds {
  const aM = semiMajorAxisAu(orbit) * AU_M;
  const relativeMps = Math.sqrt(systemGm(orbit.starMassSun, orbit.planetMassEarth) / aM);
  const fraction = planetMassFraction(orbit.starMassSun, orbit.planetMassEarth);
  return { planetMps: relativeMps * (1 - fraction), starMps: relativeMps * fraction };
}
