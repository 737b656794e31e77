// Exposure choice and the cost of one visit.

import type { Instrument } from '../model.js';
import { photonNoise, quadratureSum, visitPrecision, type PrecisionBudget, type PrecisionOptions, type PrecisionStar } from './precision.js';

export interface ExposureChoice {
  /** The chosen exposure (s): whole seconds, inside the instrument's limits. */
  exposureSec: number;
  /** The exposure the goal asks for before rounding and clipping (s); Infinity when unreachable. */
  requiredSec: number;
  /**
   * 'target-sigma': σ_visit (photon + floor) at or below the requested value;
   * 'photon-at-noise-floor': photon noise at or below √(jitter² + floor²), beyond which a longer
   * exposure buys little because the other terms dominate;
   * 'fixed': the exposure was given, not chosen.
   */
  goal: 'target-sigma' | 'photon-at-noise-floor' | 'fixed';
  /** The σ the goal is about (m/s): the requested σ_visit, √(jitter² + floor²), or (fixed) the σ_visit reached. */
  goalMps: number;
  clippedTo: 'min' | 'max' | null;
  /** True when the goal needs more than the maximum exposure (or cannot be reached at all); see `warning`. */
  tooFaint: boolean;
  warning?: string;
  budget: PrecisionBudget;
}

/**
 * The exposure for a star (see ExposureChoice.goal). Photon noise falls as t^(−1/2)
 * (Bouchy, Pepe & Queloz 2001), so the photon σ needed, σ_goal, is reached at
 * t = 1 s · (σ_photon(1 s) / σ_goal)². With a requested σ_visit the photon part must reach
 * √(σ_request² − σ_floor²) (σ_visit² = σ_photon² + σ_floor², common practice).
 * The result is rounded up to whole seconds and clipped to [minExposureSec, maxExposureSec].
 */
export function chooseExposureSec(
  instrument: Instrument,
  star: PrecisionStar,
  airmass: number,
  targetSigmaMps?: number,
  options: PrecisionOptions = {},
): ExposureChoice {
  const photonAtOneSec = photonNoise(instrument, star, 1, airmass, options).photonMps;
  const goal = targetSigmaMps === undefined ? 'photon-at-noise-floor' : 'target-sigma';
  const goalMps = targetSigmaMps ?? quadratureSum(star.jitterMps, instrument.floorMps);
  const photonGoalMps =
    targetSigmaMps === undefined ? goalMps : targetSigmaMps > instrument.floorMps ? Math.sqrt(targetSigmaMps ** 2 - instrument.floorMps ** 2) : 0;
  const requiredSec = photonGoalMps > 0 ? (photonAtOneSec / photonGoalMps) ** 2 : Infinity;
  // Whole seconds, rounded up; the small allowance keeps an exact 600.0000000001 at 600.
  const wholeSec = Math.ceil(requiredSec - 1e-9);
  const clippedTo = wholeSec < instrument.minExposureSec ? 'min' : wholeSec > instrument.maxExposureSec ? 'max' : null;
  const exposureSec = clippedTo === 'min' ? instrument.minExposureSec : clippedTo === 'max' ? instrument.maxExposureSec : wholeSec;
  const budget = visitPrecision(instrument, star, exposureSec, airmass, options);
  const choice: ExposureChoice = { exposureSec, requiredSec, goal, goalMps, clippedTo, tooFaint: clippedTo === 'max', budget };
  if (clippedTo === 'max') choice.warning = exposureWarning(choice, instrument, targetSigmaMps);
  return choice;
}

function exposureWarning(choice: ExposureChoice, instrument: Instrument, targetSigmaMps: number | undefined): string {
  const max = `the maximum exposure of ${instrument.maxExposureSec} s`;
  const b = choice.budget;
  if (targetSigmaMps === undefined) {
    // The default goal is a preference (longer exposures buy little beyond it), not a requirement.
    const level = Number.isFinite(choice.requiredSec) ? `above jitter and floor (${choice.goalMps.toFixed(2)} m/s)` : 'with no jitter or floor to match';
    return `photon-limited: ${max} leaves photon noise at ${b.photonMps.toFixed(2)} m/s, ${level}`;
  }
  const reached = `${max} gives sigma per visit ${b.visitMps.toFixed(2)} m/s`;
  if (targetSigmaMps <= instrument.floorMps) {
    return `requested sigma ${targetSigmaMps} m/s is at or below the instrument floor of ${instrument.floorMps} m/s: no exposure reaches it; ${reached}`;
  }
  return `too faint: sigma per visit ${targetSigmaMps} m/s needs ${Math.ceil(choice.requiredSec)} s; ${reached}`;
}

/** A given exposure, in the same shape as a chosen one; warns when outside the instrument's limits. */
export function fixedExposure(instrument: Instrument, star: PrecisionStar, airmass: number, exposureSec: number, options: PrecisionOptions = {}): ExposureChoice {
  const budget = visitPrecision(instrument, star, exposureSec, airmass, options);
  const choice: ExposureChoice = { exposureSec, requiredSec: exposureSec, goal: 'fixed', goalMps: budget.visitMps, clippedTo: null, tooFaint: false, budget };
  if (exposureSec < instrument.minExposureSec || exposureSec > instrument.maxExposureSec) {
    choice.warning = `exposure ${exposureSec} s is outside ${instrument.id}'s limits of ${instrument.minExposureSec}-${instrument.maxExposureSec} s`;
  }
  return choice;
}

/** Telescope time for one visit (s): exposure + readout + acquisition (docs/design.md, "Visits"). */
export function visitCostSec(instrument: Instrument, exposureSec: number): number {
  return exposureSec + instrument.readoutSec + instrument.acquisitionSec;
}
