const TWO_PI = 2 * Math.PI;

/**
 * Eccentric anomaly E (radians) from the mean anomaly M (radians, any value) and the
 * eccentricity e (0 <= e < 1, tested to 0.99): solves Kepler's equation E − e sin E = M
 * (Meeus, Astronomical Algorithms, 2nd ed. 1998, ch. 30).
 *
 * M is reduced to [0, π] by periodicity and the symmetry E(−M) = −E(M). There the root lies in
 * [M, M + e] ⊂ [0, π], and f(E) = E − e sin E − M is increasing (f' = 1 − e cos E >= 1 − e), so
 * Newton's method from Danby's start E0 = M + 0.85 e (Danby 1987, Celest. Mech. 40, 303) is kept
 * inside that bracket, falling back to bisection whenever a step would leave it. The answer is
 * returned in the revolution of the given M.
 */
export function eccentricAnomalyRad(meanAnomalyRad: number, ecc: number): number {
  const turns = Math.floor(meanAnomalyRad / TWO_PI + 0.5);
  const reduced = meanAnomalyRad - turns * TWO_PI; // in [−π, π)
  const sign = reduced < 0 ? -1 : 1;
  const m = Math.abs(reduced);
  if (ecc === 0 || m === 0) return meanAnomalyRad;
  let lo = m;
  let hi = Math.min(m + ecc, Math.PI);
  let e = Math.min(m + 0.85 * ecc, hi);
  for (let i = 0; i < 100; i++) {
    const f = e - ecc * Math.sin(e) - m;
    if (f === 0) break;
    if (f < 0) lo = e;
    else hi = e;
    let next = e - f / (1 - ecc * Math.cos(e));
    if (!(next >= lo && next <= hi)) next = (lo + hi) / 2;
    const step = Math.abs(next - e);
    e = next;
    if (step <= 4 * Number.EPSILON * Math.max(1, e)) break;
  }
  return turns * TWO_PI + sign * e;
}

/** Mean anomaly from the eccentric anomaly: Kepler's equation M = E − e sin E. */
export function meanAnomalyRad(eccentricAnomalyRad: number, ecc: number): number {
  return eccentricAnomalyRad - ecc * Math.sin(eccentricAnomalyRad);
}
