// The visits of a plan as the information model sees them: each visit's design rows, white
// noise and night, for the star's model. Shared by the report's charts and the commands that
// read a plan, so they judge the visits exactly as the planner did.
import type { Night } from '../model.js';
import type { Campaign } from './campaign.js';
import type { PlannedVisit } from './plan-schema.js';
import type { StarModel } from '../rv/information-model.js';
import { informationVisits, type InformationVisit } from '../rv/information.js';
import { starModel, starsOf } from './star-model.js';

/** The night's middle as a JD (where nightly activity is evaluated), as the planner takes it. */
export function nightMiddleJd(night: Night | undefined): number {
  if (!night?.darkStart || !night.darkEnd) return 0;
  return (night.darkStart.getTime() + night.darkEnd.getTime()) / 2 / 86_400_000 + 2_440_587.5;
}

/** A star's model and its visits (in the order given) as information visits; undefined for a star without planets. */
export function starVisitInformation(
  campaign: Campaign,
  nights: Night[],
  starId: string,
  visits: PlannedVisit[],
): { model: StarModel; visits: InformationVisit[] } | undefined {
  const rows = starsOf(campaign.targets).get(starId);
  const model = rows && starModel(rows, campaign);
  if (!model) return undefined;
  const nightPos = new Map(nights.map((n, i) => [n.localDate, i]));
  return {
    model,
    visits: informationVisits(
      model,
      visits.map((v) => ({
        bjdTdb: v.midBjdTdb,
        whiteSigmaMps: v.whiteSigmaMps,
        night: nightPos.get(v.localDate) ?? -1,
        nightBjdTdb: nightMiddleJd(nights[nightPos.get(v.localDate)!]),
      })),
    ),
  };
}
