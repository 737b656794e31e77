// Airmass from the apparent altitude.
import { validationError } from '../errors.js';

/**
 * Kasten & Young 1989 (Applied Optics 28, 4735):
 * X = 1 / (cos z + 0.50572 (96.07995 - z)^-1.6364), z the apparent zenith angle in degrees.
 * Below the formula's range (z >= 96.07995 deg) the airmass is Infinity.
 */
export function kastenYoungAirmass(apparentAltitudeDeg: number): number {
  const zDeg = 90 - apparentAltitudeDeg;
  if (zDeg >= 96.07995) return Infinity;
  return 1 / (Math.cos((zDeg * Math.PI) / 180) + 0.50572 * (96.07995 - zDeg) ** -1.6364);
}

/**
 * The apparent altitude (deg) where the Kasten & Young airmass equals `airmass` (>= 1): the
 * formula is monotone in altitude, so bisection to 1e-9 deg.
 */
export function altitudeForAirmassDeg(airmass: number): number {
  if (!(airmass >= 1)) throw validationError('airmass', airmass, 'at least 1');
  let lo = -6.07995;
  let hi = 90;
  if (kastenYoungAirmass(hi) >= airmass) return hi;
  while (hi - lo > 1e-9) {
    const mid = (lo + hi) / 2;
    if (kastenYoungAirmass(mid) > airmass) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
