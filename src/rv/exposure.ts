// Exposure choice and the cost of one visit.

import type { Instrument } from './instrument.js';
import { visitsExact, type PhaseLayout } from './detect.js';
import { oscillationMinExposureSec } from './oscillations.js';
import { photonNoise, quadratureSum, visitPrecision, type PrecisionBudget, type PrecisionOptions, type PrecisionStar } from './precision.js';
import { dwarfLoggFromTeff } from './star-defaults.js';

/** The star for the exposure choice: the precision star and, for the p-mode minimum, its log g. */
export type ExposureStar = PrecisionStar & { logg?: number };

export interface ExposureOptions extends PrecisionOptions {
  /** The planet's K (m/s): with it the exposure minimises the hours to K/σ_K = goalSignificance. */
  kMps?: number;
  goalSignificance?: number;
  /** Phase layout for the visits count (default random). */
  layout?: PhaseLayout;
  /** The most visits the campaign can give the target (e.g. one a night): exposures needing more are passed over. */
  maxVisits?: number;
}

export interface ExposureChoice {
  /** The chosen exposure (s): whole seconds, inside the limits. */
  exposureSec: number;
  /** The exposure the goal asks for before rounding and clipping (s); Infinity when unreachable. */
  requiredSec: number;
  /**
   * 'fewest-hours': the exposure that minimises visits × (exposure + overheads) for the planet's K;
   * 'target-sigma': σ_visit (photon + floor) at or below the requested value;
   * 'photon-at-noise-floor': photon noise at or below √(jitter² + floor²), beyond which a longer
   * exposure buys little because the other terms dominate;
   * 'fixed': the exposure was given, not chosen.
   */
  goal: 'fewest-hours' | 'target-sigma' | 'photon-at-noise-floor' | 'fixed';
  /** The σ the goal is about (m/s): the requested σ_visit, √(jitter² + floor²), or the σ_visit reached. */
  goalMps: number;
  clippedTo: 'min' | 'max' | null;
  /** The shortest exposure allowed and why: the instrument's minimum or the star's p modes. */
  minimumSec: number;
  minimumReason: 'instrument' | 'oscillations';
  /** True when the goal needs more than the maximum exposure (or cannot be reached at all); see `warning`. */
  tooFaint: boolean;
  warning?: string;
  budget: PrecisionBudget;
}

/**
 * The shortest exposure for this star: the instrument's minimum, or 1/ν_max for a star with
 * solar-like oscillations when longer ([Chaplin2019]; src/rv/oscillations.ts), never above the maximum.
 */
export function minimumExposure(instrument: Instrument, star: ExposureStar): { sec: number; reason: 'instrument' | 'oscillations' } {
  const pModes = oscillationMinExposureSec(star.teffK, star.logg ?? dwarfLoggFromTeff(star.teffK));
  if (pModes !== undefined && Math.ceil(pModes) > instrument.minExposureSec) {
    return { sec: Math.min(Math.ceil(pModes), instrument.maxExposureSec), reason: 'oscillations' };
  }
  return { sec: instrument.minExposureSec, reason: 'instrument' };
}

/** The exposure (s) at which a falling σ(t) reaches `goalMps` (bisection in log t; σ falls with t). */
function exposureForSigma(sigmaAt: (t: number) => number, goalMps: number): number {
  if (goalMps <= 0) return Infinity;
  let lo = 1e-3;
  let hi = 1e7;
  if (sigmaAt(hi) > goalMps) return Infinity;
  for (let i = 0; i < 80; i++) {
    const mid = Math.sqrt(lo * hi);
    if (sigmaAt(mid) > goalMps) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** Whole seconds between the limits; the small allowance keeps an exact 600.0000000001 at 600. */
function clip(requiredSec: number, minSec: number, maxSec: number) {
  const wholeSec = Math.ceil(requiredSec - 1e-9);
  const clippedTo = wholeSec < minSec ? ('min' as const) : wholeSec > maxSec ? ('max' as const) : null;
  return { exposureSec: clippedTo === 'min' ? minSec : clippedTo === 'max' ? maxSec : wholeSec, clippedTo };
}

/** Points of the search for the fewest hours: whole seconds, log-spaced over the limits. */
const HOURS_GRID_POINTS = 400;

/**
 * The exposure that minimises the telescope time to K/σ_K = n: visits(t) · (t + readout +
 * acquisition), with visits(t) from visitsExact (white σ(t) = √(photon(t)² + jitter²), the floor
 * as a fixed term). A search over log-spaced whole seconds between the limits; with `maxVisits`,
 * only exposures needing at most that many visits count, and when none does, the one needing the
 * fewest. Undefined when no exposure reaches the goal (K at or below the floor).
 */
function fewestHoursSec(instrument: Instrument, star: ExposureStar, airmass: number, minSec: number, options: ExposureOptions): number | undefined {
  const { kMps, goalSignificance = 5, layout = 'random', maxVisits = Infinity } = options;
  const overhead = instrument.readoutSec + instrument.acquisitionSec;
  let best: { sec: number; cost: number } | undefined;
  let fewest: { sec: number; visits: number } | undefined;
  const ratio = instrument.maxExposureSec / minSec;
  for (let i = 0; i < HOURS_GRID_POINTS; i++) {
    const sec = Math.round(minSec * ratio ** (i / (HOURS_GRID_POINTS - 1)));
    const white = quadratureSum(photonNoise(instrument, star, sec, airmass, options).photonSigmaMps, star.jitterMps);
    const visits = visitsExact(kMps!, white, goalSignificance, layout, instrument.floorMps);
    const cost = visits * (sec + overhead);
    if (Number.isFinite(cost) && visits <= maxVisits && (!best || cost < best.cost)) best = { sec, cost };
    if (Number.isFinite(visits) && (!fewest || visits < fewest.visits)) fewest = { sec, visits };
  }
  return best?.sec ?? fewest?.sec;
}

/**
 * The exposure for a star (see ExposureChoice.goal). With `targetVisitSigmaMps` the photon part must
 * reach √(σ_request² − σ_floor²) (σ_visit² = σ_photon² + σ_floor², common practice); with the
 * planet's K, the fewest hours; otherwise photon noise down to √(jitter² + floor²).
 */
export function chooseExposureSec(
  instrument: Instrument,
  star: ExposureStar,
  airmass: number,
  targetVisitSigmaMps?: number,
  options: ExposureOptions = {},
): ExposureChoice {
  const minimum = minimumExposure(instrument, star);
  const photonAt = (t: number) => photonNoise(instrument, star, t, airmass, options).photonSigmaMps;
  const hoursSec =
    targetVisitSigmaMps === undefined && options.kMps !== undefined ? fewestHoursSec(instrument, star, airmass, minimum.sec, options) : undefined;
  let goal: ExposureChoice['goal'];
  let goalMps: number;
  let requiredSec: number;
  if (targetVisitSigmaMps !== undefined) {
    goal = 'target-sigma';
    goalMps = targetVisitSigmaMps;
    requiredSec =
      targetVisitSigmaMps > instrument.floorMps ? exposureForSigma(photonAt, Math.sqrt(targetVisitSigmaMps ** 2 - instrument.floorMps ** 2)) : Infinity;
  } else if (hoursSec !== undefined) {
    goal = 'fewest-hours';
    requiredSec = hoursSec;
    goalMps = visitPrecision(instrument, star, hoursSec, airmass, options).visitSigmaMps;
  } else {
    goal = 'photon-at-noise-floor';
    goalMps = quadratureSum(star.jitterMps, instrument.floorMps);
    requiredSec = exposureForSigma(photonAt, goalMps);
  }
  const { exposureSec, clippedTo } = clip(requiredSec, minimum.sec, instrument.maxExposureSec);
  const budget = visitPrecision(instrument, star, exposureSec, airmass, options);
  const choice: ExposureChoice = {
    exposureSec,
    requiredSec,
    goal,
    goalMps,
    clippedTo,
    minimumSec: minimum.sec,
    minimumReason: minimum.reason,
    tooFaint: clippedTo === 'max' && goal !== 'fewest-hours',
    budget,
  };
  if (choice.tooFaint) choice.warning = exposureWarning(choice, instrument, targetVisitSigmaMps);
  return choice;
}

function exposureWarning(choice: ExposureChoice, instrument: Instrument, targetVisitSigmaMps: number | undefined): string {
  const max = `the maximum exposure of ${instrument.maxExposureSec} s`;
  const b = choice.budget;
  if (targetVisitSigmaMps === undefined) {
    // The default goal is a preference (longer exposures buy little beyond it), not a requirement.
    const level = Number.isFinite(choice.requiredSec) ? `above jitter and floor (${choice.goalMps.toFixed(2)} m/s)` : 'with no jitter or floor to match';
    return `photon-limited: ${max} leaves photon noise at ${b.photonSigmaMps.toFixed(2)} m/s, ${level}`;
  }
  const reached = `${max} gives sigma per visit ${b.visitSigmaMps.toFixed(2)} m/s`;
  if (targetVisitSigmaMps <= instrument.floorMps) {
    return `requested sigma ${targetVisitSigmaMps} m/s is at or below the instrument floor of ${instrument.floorMps} m/s: no exposure reaches it; ${reached}`;
  }
  return `too faint: sigma per visit ${targetVisitSigmaMps} m/s needs ${Math.ceil(choice.requiredSec)} s; ${reached}`;
}

/** A given exposure, in the same shape as a chosen one; warns when outside the limits or shorter than the p modes. */
export function fixedExposure(
  instrument: Instrument,
  star: ExposureStar,
  airmass: number,
  exposureSec: number,
  options: PrecisionOptions = {},
): ExposureChoice {
  const budget = visitPrecision(instrument, star, exposureSec, airmass, options);
  const minimum = minimumExposure(instrument, star);
  const choice: ExposureChoice = {
    exposureSec,
    requiredSec: exposureSec,
    goal: 'fixed',
    goalMps: budget.visitSigmaMps,
    clippedTo: null,
    minimumSec: minimum.sec,
    minimumReason: minimum.reason,
    tooFaint: false,
    budget,
  };
  if (exposureSec < instrument.minExposureSec || exposureSec > instrument.maxExposureSec) {
    choice.warning = `exposure ${exposureSec} s is outside ${instrument.id}'s limits of ${instrument.minExposureSec}-${instrument.maxExposureSec} s`;
  } else if (minimum.reason === 'oscillations' && exposureSec < minimum.sec) {
    choice.warning = `exposure ${exposureSec} s is shorter than this star's p-mode period (${minimum.sec} s): oscillations will not average out`;
  }
  return choice;
}

/** Telescope time for one visit (s): exposure + readout + acquisition (docs/design.md, "Visits"). */
export function visitCostSec(instrument: Instrument, exposureSec: number): number {
  return exposureSec + instrument.readoutSec + instrument.acquisitionSec;
}
