import { AU_M, DAY_SEC, GM_EARTH, GM_SUN } from '../astro/constants.js';

/** Total mass parameter G(M★ + m_p) in m³/s², from the nominal GM values (IAU 2015 B3). */
export function systemGm(starMassSun: number, planetMassEarth: number): number {
  return starMassSun * GM_SUN + planetMassEarth * GM_EARTH;
}

/** Planet-to-total mass ratio m_p / (M★ + m_p). */
export function planetMassFraction(starMassSun: number, planetMassEarth: number): number {
  return (planetMassEarth * GM_EARTH) / systemGm(starMassSun, planetMassEarth);
}

export interface TwoBody {
  starMassSun: number;
  planetMassEarth: number;
}

/**
 * Semi-major axis of the relative orbit (au) from the period.
 * Kepler's third law in Newton's form, a³ = G (M★ + m_p) P² / 4π² (docs/references.md [Kepler-third-law]).
 */
export function semiMajorAxisAu(bodies: TwoBody & { periodDays: number }): number {
  const periodSec = bodies.periodDays * DAY_SEC;
  const gm = systemGm(bodies.starMassSun, bodies.planetMassEarth);
  return Math.cbrt((gm * periodSec * periodSec) / (4 * Math.PI * Math.PI)) / AU_M;
}

/** Orbital period (days) from the semi-major axis: the same law, P = 2π √(a³ / G(M★ + m_p)). */
export function periodDaysFromAu(bodies: TwoBody & { semiMajorAxisAu: number }): number {
  const aM = bodies.semiMajorAxisAu * AU_M;
  const gm = systemGm(bodies.starMassSun, bodies.planetMassEarth);
  return (2 * Math.PI * Math.sqrt((aM * aM * aM) / gm)) / DAY_SEC;
}
