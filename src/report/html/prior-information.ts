import type { Plan } from '../../model.js';
import type { StarModel } from '../../rv/information-model.js';
import { informationVisits, type InformationVisit } from '../../rv/information.js';
import { nightMiddleJd } from '../../plan/visit-information.js';
import { keepOffsetAndK } from '../../schedule/prior.js';

/** A visit of the star made before the plan's visits ahead: observed, or kept from the plan before. */
interface PriorInput {
  bjd: number;
  sigmaMps: number;
  localDate: string;
  phaseInPrior: boolean;
}

/**
 * A star's visits already made as the planner counts them (src/plan/replan.ts priorVisits,
 * src/schedule/prior.ts compilePrior): the kept visits, then the observed ones, each weighing
 * 1/σ_white². A visit on a plan night shares that night's key and middle; visits of any other
 * date share a key of their own, placed at the mean of their times. An RV of a fitted star keeps
 * only its offset and K columns: its phase information is already in the fitted ephemeris.
 */
export function priorInformationVisits(plan: Plan, starId: string, model: StarModel): InformationVisit[] {
  const fitted = plan.targets.some((t) => t.starId === starId && t.fit);
  const inputs: PriorInput[] = [
    ...plan.visits.filter((v) => v.starId === starId && v.kept).map((v) => ({ bjd: v.midBjdTdb, sigmaMps: v.sigmaWhiteMps, localDate: v.localDate, phaseInPrior: false })),
    ...(plan.observed ?? []).filter((v) => v.starId === starId).map((v) => ({ bjd: v.midBjdTdb, sigmaMps: v.sigmaWhiteMps, localDate: v.localDate, phaseInPrior: fitted && v.rvMps !== undefined })),
  ];
  const nightPos = new Map(plan.nights.map((n, i) => [n.localDate, i]));
  const otherDates = [...new Set(inputs.map((v) => v.localDate).filter((d) => !nightPos.has(d)))];
  const meanBjd = (date: string) => {
    const same = inputs.filter((v) => v.localDate === date);
    return same.reduce((sum, v) => sum + v.bjd, 0) / same.length;
  };
  const visits = informationVisits(
    model,
    inputs.map((v) => {
      const at = nightPos.get(v.localDate);
      return at !== undefined
        ? { bjd: v.bjd, sigmaMps: v.sigmaMps, night: at, nightBjd: nightMiddleJd(plan.nights[at]) }
        : { bjd: v.bjd, sigmaMps: v.sigmaMps, night: plan.nights.length + otherDates.indexOf(v.localDate), nightBjd: meanBjd(v.localDate) };
    }),
  );
  visits.forEach((v, i) => {
    if (inputs[i]!.phaseInPrior) keepOffsetAndK(v.rows, model);
  });
  return visits;
}
