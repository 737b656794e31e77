import type { Ephemeris } from '../model.js';

/** Orbital cycles since the reference mid-transit time: x = (t − Tc) / P (any real number). */
export function cyclesSinceTc(eph: Ephemeris, tBjdTdb: number): number {
  return (tBjdTdb - eph.tcBjdTdb) / eph.periodDays;
}

/** The transit epoch n nearest to time t: Tc + n P is the closest predicted mid-transit. */
export function nearestEpoch(eph: Ephemeris, tBjdTdb: number): number {
  return Math.round(cyclesSinceTc(eph, tBjdTdb));
}

/** Predicted mid-transit time (BJD_TDB) of epoch n: Tc(n) = Tc + n P. */
export function tcAtEpochBjdTdb(eph: Ephemeris, epoch: number): number {
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
export function phaseAt(eph: Ephemeris, tBjdTdb: number): number {
  const x = cyclesSinceTc(eph, tBjdTdb);
  const phase = x - Math.floor(x);
  return phase === 1 ? 0 : phase;
}

/**
 * One-sigma error of the phase at time t, in cycles. The phase is (t − Tc)/P mod 1, so linear error
 * propagation gives σ_φ² = (σ_T0² + x² σ_P²) / P² with x = (t − Tc)/P: the propagation law above at
 * the fractional epoch, divided by P. Values of 0.5 or more mean the phase is unknown.
 */
export function phaseErrCycles(eph: Ephemeris, tBjdTdb: number): number {
  return Math.hypot(eph.tcErrDays, cyclesSinceTc(eph, tBjdTdb) * eph.periodErrDays) / eph.periodDays;
}

/** How visits are kept out of transits: the margin in standard deviations and the largest fraction of the orbit removed. */
export interface TransitRule {
  zScore: number;
  maxOrbitFraction: number;
}

/**
 * Half-width (days) of the span kept free around transit epoch n: half the duration plus z
 * standard deviations of that transit's time; Infinity-free: when the whole span (twice this)
 * would exceed maxOrbitFraction of the period, the transit time is too uncertain to avoid and 0 is
 * returned (the phases are kept; the plan warns). 0 without a transit duration.
 */
export function transitHalfWidthDays(eph: Ephemeris, epoch: number, rule: TransitRule): number {
  if (eph.transitDurationHours === undefined) return 0;
  const halfDays = eph.transitDurationHours / 48 + rule.zScore * tcErrAtEpochDays(eph, epoch);
  return 2 * halfDays > rule.maxOrbitFraction * eph.periodDays ? 0 : halfDays;
}

/**
 * Whether [startBjdTdb, endBjdTdb] overlaps a predicted transit widened as transitHalfWidthDays says.
 * RVs taken in transit are distorted by the Rossiter–McLaughlin effect (Rossiter 1924;
 * McLaughlin 1924), so RV programmes avoid them (common practice). False when the ephemeris has
 * no transit duration, or when the transit is too uncertain to avoid.
 */
export function overlapsTransit(eph: Ephemeris, startBjdTdb: number, endBjdTdb: number, rule: TransitRule): boolean {
  for (const epoch of new Set([nearestEpoch(eph, startBjdTdb), nearestEpoch(eph, endBjdTdb)])) {
    const tc = tcAtEpochBjdTdb(eph, epoch);
    const margin = transitHalfWidthDays(eph, epoch, rule);
    if (margin > 0 && startBjdTdb < tc + margin && endBjdTdb > tc - margin) return true;
  }
  return false;
}
