// Atmospheric refraction at standard conditions.
import { InverseRefraction, Refraction } from 'astronomy-engine';

/**
 * Apparent altitude from the geometric altitude (deg): Saemundsson's formula (Meeus 1998,
 * eq. 16.4) as implemented by astronomy-engine's Refraction('normal'); 10 C, 1010 hPa.
 */
export function apparentAltitudeDeg(trueAltitudeDeg: number): number {
  return trueAltitudeDeg + Refraction('normal', trueAltitudeDeg);
}

/** Geometric altitude (deg) whose apparent altitude is `apparentDeg` (inverse of the above). */
export function trueAltitudeDeg(apparentDeg: number): number {
  return apparentDeg + InverseRefraction('normal', apparentDeg);
}
