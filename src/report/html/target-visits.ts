import type { Target } from '../../model.js';
import type { Plan, PlannedVisit } from '../../plan/plan-schema.js';

/** A star's planned visits in time order. */
export function visitsOf(plan: Plan, starId: string): PlannedVisit[] {
  return plan.visits.filter((v) => v.starId === starId).sort((a, b) => a.startUtc.localeCompare(b.startUtc));
}

/** The campaign's target with this id (every summary and visit names one). */
export function targetOf(plan: Plan, targetId: string): Target | undefined {
  return plan.campaign.targets.find((t) => t.id === targetId);
}

/**
 * The per-visit σ that N visits of unequal σ_i are worth together: σ = √(N / Σ 1/σ_i²), so that
 * σ²/N equals the variance of the inverse-variance weighted mean (common practice).
 */
export function equivalentSigmaMps(visits: PlannedVisit[]): number | undefined {
  if (!visits.length) return undefined;
  const weight = visits.reduce((sum, v) => sum + 1 / (v.effectiveSigmaMps * v.effectiveSigmaMps), 0);
  return Math.sqrt(visits.length / weight);
}
