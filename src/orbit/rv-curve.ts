import { trueAnomalyRad } from './anomalies.js';
import { eccentricAnomalyRad } from './kepler-equation.js';

/** A Keplerian orbit as seen in the star's radial velocity. */
export interface RvOrbit {
  kMps: number;
  periodDays: number;
  ecc: number;
  /** Argument of periastron of the star's orbit (degrees). */
  omegaDeg: number;
  /** Time of periastron passage, BJD_TDB. */
  periastronBjdTdb: number;
  /** Systemic velocity γ (m/s); default 0. */
  gammaMps?: number;
}

/** Mean anomaly (radians) at time t: M = 2π (t − T_p) / P. */
export function meanAnomalyAtRad(orbit: Pick<RvOrbit, 'periodDays' | 'periastronBjdTdb'>, tBjdTdb: number): number {
  return (2 * Math.PI * (tBjdTdb - orbit.periastronBjdTdb)) / orbit.periodDays;
}

/** True anomaly (radians) at time t, through Kepler's equation. */
export function trueAnomalyAtRad(orbit: Pick<RvOrbit, 'periodDays' | 'periastronBjdTdb' | 'ecc'>, tBjdTdb: number): number {
  return trueAnomalyRad(eccentricAnomalyRad(meanAnomalyAtRad(orbit, tBjdTdb), orbit.ecc), orbit.ecc);
}

/**
 * The star's radial velocity (m/s, positive away from the observer) at time t (BJD_TDB):
 * v(t) = γ + K [cos(ν + ω) + e cos ω] (docs/references.md [Kepler-RV]; [LovisFischer2010]).
 */
export function radialVelocityMps(orbit: RvOrbit, tBjdTdb: number): number {
  const omega = (orbit.omegaDeg * Math.PI) / 180;
  const nu = trueAnomalyAtRad(orbit, tBjdTdb);
  return (orbit.gammaMps ?? 0) + orbit.kMps * (Math.cos(nu + omega) + orbit.ecc * Math.cos(omega));
}
