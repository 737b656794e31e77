// Warnings an observer must see: targets never observable, goals out of reach, ephemerides that
// must be recovered before quadratures can be aimed at, transits too uncertain to avoid,
// exposures the instrument cannot make.
import type { Plan, TargetSummary } from './plan-schema.js';
import { nearestEpoch, type TransitRule, transitHalfWidthDays } from '../orbit/ephemeris.js';
import { visitsNeeded } from '../rv/detect.js';
import { starCaps, type TargetSetup } from './candidates.js';
import { droppedOf, dropSummary, missingWindowsText, noVisitCause, type SkyFacts } from './visit-causes.js';

/**
 * Phase error (cycles) above which the linearised information model stops being trustworthy:
 * ±0.25 cycle puts a predicted quadrature anywhere near a conjunction, so the phase must be found
 * again (a search in a narrow period range) before visits can be aimed (Crest's choice).
 */
export const LOST_PHASE_ERR_CYCLES = 0.25;
/** The phase error a recovery aims at (cycles). */
const RECOVERED_PHASE_ERR_CYCLES = 0.05;

/**
 * For a planet with an ephemeris: how many visits at ideal quadratures, at the target's typical
 * σ_eff (airmass 1.2), would reach the goal: N = (n σ / K)² (docs/references.md [Visits-needed]).
 * More nights, or several visits a night (a shorter minSpacingHours), are the usual ways there.
 */
function visitsHint(summary: TargetSummary, setup: TargetSetup): string {
  if (summary.kind !== 'ephemeris' || summary.kMps === undefined || summary.goalSignificance === undefined) return '';
  const n = visitsNeeded(summary.kMps, setup.exposure.budget.effectiveSigmaMps, summary.goalSignificance, 'quadrature');
  return `; about ${n} visits at quadratures would reach it`;
}

/**
 * Visits spread in phase that bring the phase error down to RECOVERED_PHASE_ERR_CYCLES: the
 * Fisher information on the phase δ of K sin(2πφ + δ) from N visits spread in phase is
 * N K² / (2σ²), so σ_δ = 2π σ_φ needs N = 2σ² / (K 2π σ_φ)² (docs/references.md [Kay1993]).
 */
export function recoveryVisits(kMps: number, effectiveSigmaMps: number): number {
  return Math.max(3, Math.ceil((2 * effectiveSigmaMps * effectiveSigmaMps) / (kMps * 2 * Math.PI * RECOVERED_PHASE_ERR_CYCLES) ** 2));
}

/** Which cap the star's visits reached (its own column or the campaign's default), or ''. */
function capText(plan: Plan, summary: TargetSummary, setup: TargetSetup): string {
  const { maxVisits, maxHours } = starCaps(plan.campaign, setup.target);
  if (maxVisits !== undefined && summary.visits >= maxVisits) return `at its cap of ${maxVisits} visits (maxVisits)`;
  const blockHours = setup.durationSec / 3600;
  if (maxHours !== undefined && summary.hours + blockHours > maxHours + 1e-9)
    return `at its cap of ${maxHours} h (maxHours): another visit would not fit in it`;
  return '';
}

/** Fills each target's warnings in place and returns the plan-wide ones. */
export function planWarnings(plan: Plan, setups: TargetSetup[], sky: SkyFacts, rule: TransitRule): string[] {
  const observable = sky.windowDates;
  // JD (UTC) of the window's last dark end: within minutes of its BJD_TDB, enough to pick the transit epoch.
  const allDates = plan.nights.map((n) => n.localDate);
  const windowEndJd = Math.max(...plan.nights.map((n) => (n.darkEnd ? n.darkEnd.getTime() / 86_400_000 + 2_440_587.5 : -Infinity)));
  for (const summary of plan.targets) {
    const setup = setups.find((s) => s.target.id === summary.targetId)!;
    const w = summary.warnings;
    if (setup.skipped) w.push(setup.skipped);
    const neverObservable = !observable.has(summary.starId);
    // A star never observable gets that one warning, with its cause; what its visits would cost is moot.
    if (neverObservable) w.push(`never observable in the window: ${dropSummary(droppedOf(sky, summary.starId), allDates, 'window')}`);
    else if (setup.exposure.warning) w.push(setup.exposure.warning);
    const shortfall = () =>
      summary.visits === 0 && !summary.priorVisits
        ? `no visit: ${noVisitCause(plan, summary.starId, sky)}`
        : `${summary.visits} visit${summary.visits === 1 ? '' : 's'}${missingWindowsText(plan, summary.starId, sky)}`;
    if (!neverObservable && summary.goalSignificance !== undefined && summary.kOverSigmaK !== undefined && summary.kOverSigmaK < summary.goalSignificance) {
      w.push(`goal K/sigma_K = ${summary.goalSignificance} not reached: ${summary.kOverSigmaK.toFixed(1)} with ${shortfall()}${visitsHint(summary, setup)}`);
    }
    if (!neverObservable && summary.goalCompleteness !== undefined && summary.completeness !== undefined && summary.completeness < summary.goalCompleteness) {
      w.push(`goal completeness = ${summary.goalCompleteness} not reached: ${summary.completeness.toFixed(2)} with ${shortfall()}`);
    }
    if (summary.phaseErrAtEnd !== undefined && summary.phaseErrAtEnd > LOST_PHASE_ERR_CYCLES && summary.kMps !== undefined) {
      const n = recoveryVisits(summary.kMps, setup.exposure.budget.effectiveSigmaMps);
      w.push(
        `phase must be recovered first: phase error ±${summary.phaseErrAtEnd.toFixed(2)} cycles by the window's end, ` +
          `beyond what the plan's linearised model can trust; about ${n} visits spread in phase bring it to ±${RECOVERED_PHASE_ERR_CYCLES} cycles`,
      );
    }
    const cap = capText(plan, summary, setup);
    if (cap) w.push(cap);
    const eph = setup.target.ephemeris;
    if (eph?.transitDurationHours !== undefined && Number.isFinite(windowEndJd) && transitHalfWidthDays(eph, nearestEpoch(eph, windowEndJd), rule) === 0) {
      w.push(
        "transit time too uncertain to avoid by the window's end " +
          `(keeping out of it would remove more than ${Math.round(rule.maxOrbitFraction * 100)}% of the orbit): visits may fall in transit`,
      );
    }
  }
  const warnings: string[] = [];
  if (plan.nights.every((n) => !n.darkStart)) {
    warnings.push(`no night of the window has a dark span at ${plan.campaign.constraints.twilight} twilight (the Sun never gets low enough)`);
  }
  if (plan.visits.length === 0) warnings.push('no visit could be planned: check the window, the constraints and the targets');
  return warnings;
}
