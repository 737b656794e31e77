import type { Ephemeris } from '../model.js';

/** Orbital cycles since the reference mid-transit time: x = (t − Tc) / P (any real number). */
export function cyclesSinceTc(eph: Ephemeris, tBjd: number): number {
  return (tBjd - eph.tcBjdTdb) / eph.periodDays;
}

/** The transit epoch n nearest to time t: Tc + n P is the closest predicted mid-transit. */
export function nearestEpoch(eph: Ephemeris, tBjd: number): number {
  return Math.round(cyclesSinceTc(eph, tBjd));
}

/** Predicted mid-transit time (BJD_TDB) of epoch n: Tc(n) = Tc + n P. */
export function tcAtEpochBjd(eph: Ephemeris, epoch: number): number {
  return eph.tcBjdTdb + epoch * eph.periodDays;
}

/**
 * Uncertainty (days) of the predicted mid-transit time after n orbits:
 * σ_Tc(n)² = σ_T0² + n² σ_P² (docs/references.md [Ephemeris-propagation], common practice; the two errors taken as independent).
 */
export function tcErrAtEpochDays(eph: Ephemeris, epoch: number): number {
  return Math.hypot(eph.tcErrDays, epoch * eph.periodErrDays);
}

/** Orbital phase at time t in [0, 1): 0 at mid-transit, 0.25 and 0.75 at the quadratures. */
export function phaseAt(eph: Ephemeris, tBjd: number): number {
  const x = cyclesSinceTc(eph, tBjd);
  const phase = x - Math.floor(x);
  return phase === 1 ? 0 : phase;
}

/**
 * One-sigma error of the phase at time t, in cycles. The phase is (t − Tc)/P mod 1, so linear error
 * propagation gives σ_φ² = (σ_T0² + x² σ_P²) / P² with x = (t − Tc)/P: the propagation law above at
 * the fractional epoch, divided by P. Values of 0.5 or more mean the phase is unknown.
 */
export function phaseErrCycles(eph: Ephemeris, tBjd: number): number {
  return Math.hypot(eph.tcErrDays, cyclesSinceTc(eph, tBjd) * eph.periodErrDays) / eph.periodDays;
}

/**
 * Whether [startBjd, endBjd] overlaps a predicted transit, widened on each side by the 1-sigma
 * error of that transit's time. RVs taken in transit are distorted by the Rossiter–McLaughlin
 * effect (Rossiter 1924; McLaughlin 1924), so RV programmes avoid them (common practice).
 * False when the ephemeris has no transit duration.
 */
export function overlapsTransit(eph: Ephemeris, startBjd: number, endBjd: number): boolean {
  if (eph.transitDurationHours === undefined) return false;
  const halfDays = eph.transitDurationHours / 48;
  for (const epoch of new Set([nearestEpoch(eph, startBjd), nearestEpoch(eph, endBjd)])) {
    const tc = tcAtEpochBjd(eph, epoch);
    const margin = halfDays + tcErrAtEpochDays(eph, epoch);
    if (startBjd < tc + margin && endBjd > tc - margin) return true;
  }
  return false;
}
