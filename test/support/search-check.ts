// The check of issue 13 part 3 for one plan: each search star's planned visits against random
// visits of the same star and count from its candidate slots (test/support/search-injection.ts).
import type { Campaign } from '../../src/plan/campaign.js';
import { planInputs } from '../../src/plan/plan-inputs.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { injectedCompleteness, margin, randomCompleteness, type SearchCase, type Visit } from './search-injection.js';

export interface SearchCheck {
  targetId: string;
  visits: number;
  /** Analytic completeness claimed by the plan. */
  claimed: number;
  planned: { detected: number; trials: number };
  /** Random visits over the whole window, and on the plan's own nights only (undefined when no random set of that count fits). */
  random?: ReturnType<typeof margin>;
  randomPlanNights?: ReturnType<typeof margin>;
}

/** Trials: planned 400 periods x 5; random 24 sets x 50 periods x 2 (about 0.006 to 0.016 standard error on the difference). */
export function searchChecks(campaign: Campaign, plan: Plan, minVisits: number, seed: number): SearchCheck[] {
  const inputs = planInputs(campaign, {});
  const { minSpacingHours, sameNightSpacingHours } = campaign.constraints;
  return plan.targets
    .filter((s) => s.kind === 'search' && s.visits >= minVisits)
    .map((s, k) => {
      const target = campaign.targets.find((t) => t.id === s.targetId)!;
      const search: SearchCase = { ...target.search!, starMassSun: target.massSun };
      const planned: Visit[] = plan.visits
        .filter((v) => v.starId === target.starId)
        .map((v) => ({ bjdTdb: v.midBjdTdb, sigmaMps: v.effectiveSigmaMps, night: v.localDate }));
      const candidates: Visit[] = inputs.candidates
        .filter((c) => c.slot.targetId === target.starId)
        .map((c) => inputs.detail(c))
        .map((d) => ({ bjdTdb: d.midBjdTdb, sigmaMps: d.effectiveSigmaMps, night: d.localDate }));
      const nights = new Set(planned.map((v) => v.night));
      const spacing = { minSpacingHours, onePerNight: minSpacingHours >= 12, perNight: target.visitsPerNight ?? 1, sameNightSpacingHours };
      const p = injectedCompleteness(planned, search, 400, 5, seed + 10 * k);
      const r = randomCompleteness(candidates, planned.length, spacing, search, 24, 50, 2, seed + 10 * k + 1);
      const rn = randomCompleteness(
        candidates.filter((c) => nights.has(c.night)),
        planned.length,
        spacing,
        search,
        24,
        50,
        2,
        seed + 10 * k + 2,
      );
      return {
        targetId: s.targetId,
        visits: planned.length,
        claimed: s.completeness ?? 0,
        planned: p,
        random: r && margin(p, r),
        randomPlanNights: rn && margin(p, rn),
      };
    });
}
