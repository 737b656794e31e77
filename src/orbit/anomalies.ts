// Conversions between the true anomaly ν and the eccentric anomaly E of a Keplerian ellipse.

/**
 * True anomaly (radians) from the eccentric anomaly: tan(ν/2) = √((1 + e)/(1 − e)) tan(E/2)
 * (Meeus, Astronomical Algorithms, 2nd ed. 1998, ch. 30), written with atan2 so that it stays in
 * the revolution of E and is exact at E = π.
 */
export function trueAnomalyRad(eccentricAnomalyRad: number, ecc: number): number {
  const half = eccentricAnomalyRad / 2;
  const nu = 2 * Math.atan2(Math.sqrt(1 + ecc) * Math.sin(half), Math.sqrt(1 - ecc) * Math.cos(half));
  // 2·atan2 returns ν in (−2π, 2π]; ν and E differ by less than π, so bring ν to E's revolution.
  return nu + 2 * Math.PI * Math.round((eccentricAnomalyRad - nu) / (2 * Math.PI));
}

/** Eccentric anomaly (radians) from the true anomaly: the same relation solved for E. */
export function eccentricFromTrueRad(trueAnomalyRad: number, ecc: number): number {
  const half = trueAnomalyRad / 2;
  const e = 2 * Math.atan2(Math.sqrt(1 - ecc) * Math.sin(half), Math.sqrt(1 + ecc) * Math.cos(half));
  return e + 2 * Math.PI * Math.round((trueAnomalyRad - e) / (2 * Math.PI));
}
