import type { Plan } from '../../plan/plan-schema.js';
import { scheduleNights } from '../../plan/candidates.js';
import { priorVisits } from '../../plan/replan.js';
import type { StarModel } from '../../rv/information-model.js';
import { informationVisits, type InformationVisit } from '../../rv/information.js';
import { keepOffsetAndK } from '../../schedule/prior.js';

/**
 * A star's visits already made as the planner counts them: the plan's kept and observed visits
 * through the planner's own rule (src/plan/replan.ts priorVisits: weights 1/σ_white², an RV of a
 * fitted star keeping only its offset and K columns), keyed by night as src/schedule/prior.ts
 * does: a visit on a plan night shares that night's key and middle; visits of any other date
 * share a key of their own, placed at the mean of their nights' middles.
 */
export function priorInformationVisits(plan: Plan, starId: string, model: StarModel): InformationVisit[] {
  const history = { kept: plan.visits.filter((v) => v.kept), observed: plan.observed ?? [] };
  const fitted = new Set(plan.targets.filter((t) => t.fit).map((t) => t.starId));
  const nights = scheduleNights(plan.campaign, plan.nights);
  const prior = priorVisits(history, fitted, nights).filter((v) => v.targetId === starId);
  const nightPos = new Map(nights.map((n, i) => [n.localDate, i]));
  const otherDates = [...new Set(prior.map((v) => v.localDate).filter((d) => !nightPos.has(d)))];
  const meanMiddle = (date: string) => {
    const same = prior.filter((v) => v.localDate === date);
    return same.reduce((sum, v) => sum + (v.nightMidBjdTdb ?? v.midBjdTdb), 0) / same.length;
  };
  const visits = informationVisits(
    model,
    prior.map((v) => {
      const at = nightPos.get(v.localDate);
      return at !== undefined
        ? { bjdTdb: v.midBjdTdb, whiteSigmaMps: v.whiteSigmaMps, night: at, nightBjdTdb: nights[at]!.midBjdTdb ?? 0 }
        : { bjdTdb: v.midBjdTdb, whiteSigmaMps: v.whiteSigmaMps, night: nights.length + otherDates.indexOf(v.localDate), nightBjdTdb: meanMiddle(v.localDate) };
    }),
  );
  visits.forEach((v, i) => {
    if (prior[i]!.phaseInPrior) keepOffsetAndK(v.rows, model);
  });
  return visits;
}
