import { eccentricFromTrueRad } from './anomalies.js';
import { meanAnomalyRad } from './kepler-equation.js';

/**
 * Time of periastron (BJD_TDB) from a mid-transit (inferior conjunction) time Tc.
 *
 * With z pointing away from the observer, the star sits at z★ = r★ sin(ν + ω) sin i and at
 * r★ cos(ν + ω) along the line of nodes, the frame in which v = K [cos(ν + ω) + e cos ω]. The planet
 * transits when it crosses the line of sight in front of the star: cos(ν + ω) = 0 with the star
 * behind, sin(ν + ω) = 1. So the true anomaly at conjunction is ν_c = π/2 − ω (the standard
 * relation, common practice). Then E_c from ν_c, M_c = E_c − e sin E_c (Kepler's equation), and
 * T_p = Tc − P M_c / 2π. For e = 0 and ω = 90° this gives T_p = Tc.
 */
export function periastronFromConjunctionBjdTdb(input: { tcBjdTdb: number; periodDays: number; ecc: number; omegaDeg: number }): number {
  const { tcBjdTdb, periodDays, ecc, omegaDeg } = input;
  const nuConjunction = Math.PI / 2 - (omegaDeg * Math.PI) / 180;
  const meanAnomaly = meanAnomalyRad(eccentricFromTrueRad(nuConjunction, ecc), ecc);
  return tcBjdTdb - (periodDays * meanAnomaly) / (2 * Math.PI);
}
