import type { Target } from '../model.js';
import { semiAmplitudeMps } from './semi-amplitude.js';

/**
 * The expected K (m/s) of a target's planet: the K given in the target list, or computed from the
 * planet mass (taken as m sin i, edge-on), star mass, period and eccentricity. Undefined when the
 * target has no planet with a period.
 */
export function targetKMps(target: Target): number | undefined {
  const planet = target.planet;
  if (!planet || !target.ephemeris) return undefined;
  if (planet.kMps !== undefined) return planet.kMps;
  if (planet.msiniEarth === undefined) return undefined;
  return semiAmplitudeMps({
    starMassSun: target.massSun,
    planetMassEarth: planet.msiniEarth,
    periodDays: target.ephemeris.periodDays,
    ecc: planet.ecc,
  });
}
