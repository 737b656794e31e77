// Warnings an observer must see: targets never observable, goals out of reach, ephemerides that
// will be too poor to place visits at quadrature, exposures the instrument cannot make.
import type { Plan, TargetSummary, Window } from '../model.js';
import { visitsNeeded } from '../rv/detect.js';
import type { TargetSetup } from './candidates.js';

/** Phase error (cycles) above which quadrature timing is lost: ±0.1 cycle blurs sin(2πφ) by 18% (exp(−2π²σ²)). */
export const POOR_PHASE_ERR_CYCLES = 0.1;

/**
 * For a planet with an ephemeris: how many visits at ideal quadratures, at the target's typical
 * σ_eff (airmass 1.2), would reach the goal: N = (n σ / K)² (docs/references.md [Visits-needed]).
 * More nights, or several visits a night (a shorter minSpacingHours), are the usual ways there.
 */
function visitsHint(summary: TargetSummary, setup: TargetSetup): string {
  if (summary.kind !== 'ephemeris' || summary.kMps === undefined || summary.goal === undefined) return '';
  const n = visitsNeeded(summary.kMps, setup.exposure.budget.effMps, summary.goal, 'quadrature');
  return `; about ${n} visits at quadratures would reach it`;
}

/** Fills each target's warnings in place and returns the plan-wide ones. */
export function planWarnings(plan: Plan, setups: TargetSetup[], windows: Window[]): string[] {
  const observable = new Set(windows.map((w) => w.targetId));
  for (const summary of plan.targets) {
    const setup = setups.find((s) => s.target.id === summary.targetId)!;
    const w = summary.warnings;
    if (setup.skipped) w.push(setup.skipped);
    const neverObservable = !observable.has(summary.targetId);
    if (neverObservable) w.push('never observable in the window under the constraints (altitude, airmass, Moon, dark time)');
    if (setup.exposure.warning) w.push(setup.exposure.warning);
    if (!neverObservable && summary.goal !== undefined && summary.kOverSigmaK !== undefined && summary.kOverSigmaK < summary.goal) {
      w.push(`goal K/sigma_K = ${summary.goal} not reached: ${summary.kOverSigmaK.toFixed(1)} with ${summary.visits} visits${visitsHint(summary, setup)}`);
    }
    if (summary.phaseErrAtEnd !== undefined && summary.phaseErrAtEnd > POOR_PHASE_ERR_CYCLES) {
      w.push(`ephemeris too poor by the window's end: phase error ±${summary.phaseErrAtEnd.toFixed(2)} cycles; refine P and Tc first`);
    }
  }
  const warnings: string[] = [];
  if (plan.nights.every((n) => !n.darkStart)) {
    warnings.push(`no night of the window has a dark span at ${plan.campaign.constraints.twilight} twilight (the Sun never gets low enough)`);
  }
  if (plan.visits.length === 0) warnings.push('no visit could be planned: check the window, the constraints and the targets');
  return warnings;
}
