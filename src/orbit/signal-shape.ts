// The shape of a planet's RV signal against orbital phase and its slope: what the information
// model (src/rv/information-model.ts) and the report need for an orbit of any eccentricity.
import { eccentricAnomalyRad } from './kepler-equation.js';
import { trueAnomalyRad } from './anomalies.js';
import { periastronFromConjunctionBjdTdb } from './periastron-time.js';

export interface SignalShape {
  ecc: number;
  omegaDeg: number;
  /** s(φ) with v = γ + K s, φ in cycles from mid-transit. */
  at(phase: number): number;
  /** ds/dφ (per cycle). */
  slope(phase: number): number;
}

/** The shape of a target's planet: its eccentric orbit if it has one, else the circular −sin 2πφ. */
export function planetSignalShape(planet: { ecc: number; omegaDeg: number } | undefined): SignalShape {
  return signalShape(planet?.ecc ?? 0, planet?.omegaDeg ?? 90);
}

/**
 * The signal of a Keplerian orbit: v = γ + K [cos(ν + ω) + e cos ω] (docs/references.md
 * [Kepler-RV]), with the mean anomaly M = 2π(φ − φ_p) counted from the periastron phase φ_p that
 * puts the transit at φ = 0 (periastronFromConjunctionBjdTdb). For e = 0 and ω = 90° this is
 * s = −sin 2πφ. The slope is ds/dφ = −sin(ν + ω) 2π dν/dM with dν/dM = (1 + e cos ν)² / (1 − e²)^(3/2)
 * (angular momentum r² dν/dt = const; [Murray-Dermott1999] §2.4).
 */
export function signalShape(ecc: number, omegaDeg: number): SignalShape {
  const omega = (omegaDeg * Math.PI) / 180;
  if (ecc === 0 && omegaDeg === 90) {
    return { ecc, omegaDeg, at: (phase) => -Math.sin(2 * Math.PI * phase), slope: (phase) => -2 * Math.PI * Math.cos(2 * Math.PI * phase) };
  }
  const periastronPhase = periastronFromConjunctionBjdTdb({ tcBjdTdb: 0, periodDays: 1, ecc, omegaDeg });
  const nuAt = (phase: number) => trueAnomalyRad(eccentricAnomalyRad(2 * Math.PI * (phase - periastronPhase), ecc), ecc);
  return {
    ecc,
    omegaDeg,
    at: (phase) => Math.cos(nuAt(phase) + omega) + ecc * Math.cos(omega),
    slope: (phase) => {
      const nu = nuAt(phase);
      return -Math.sin(nu + omega) * 2 * Math.PI * ((1 + ecc * Math.cos(nu)) ** 2 / (1 - ecc * ecc) ** 1.5);
    },
  };
}
