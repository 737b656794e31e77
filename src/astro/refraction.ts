// Atmospheric refraction of star altitudes, scaled to the site's air pressure.
import { Refraction } from 'astronomy-engine';

/** The pressure of the refraction formula's standard conditions (10 °C, 1010 hPa) [Meeus1998 ch. 16]. */
const REFRACTION_REFERENCE_HPA = 1010;

/**
 * Refraction (deg) at a geometric altitude: Saemundsson's formula at 10 °C and 1010 hPa
 * [Meeus1998 ch. 16, eq. 16.4] as astronomy-engine's Refraction('normal') computes it, times
 * P / 1010 for the pressure P (the same chapter's correction; the temperature stays at 10 °C).
 */
function refractionDeg(trueAltitudeDeg: number, pressureHpa: number): number {
  return (pressureHpa / REFRACTION_REFERENCE_HPA) * Refraction('normal', trueAltitudeDeg);
}

/** Apparent altitude (deg) from the geometric altitude at air pressure `pressureHpa`. */
export function apparentAltitudeDeg(trueAltitudeDeg: number, pressureHpa: number): number {
  return trueAltitudeDeg + refractionDeg(trueAltitudeDeg, pressureHpa);
}

/**
 * Geometric altitude (deg) whose apparent altitude is `apparentDeg` (inverse of the above):
 * fixed-point iteration h = h_app − R(h), which contracts because |dR/dh| < 0.3 (common practice).
 */
export function trueAltitudeDeg(apparentDeg: number, pressureHpa: number): number {
  let h = apparentDeg - refractionDeg(apparentDeg, pressureHpa);
  for (let i = 0; i < 50; i++) {
    const next = apparentDeg - refractionDeg(h, pressureHpa);
    if (Math.abs(next - h) < 1e-12) return next;
    h = next;
  }
  return h;
}
