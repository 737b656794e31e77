// Where a planned visit points: the star's ICRS place with its proper motion carried to the visit's
// epoch (src/astro/position.ts), as sexagesimal text for plan.csv and plan.ics.
import { extent } from '../extent.js';
import { properMotionJ2000 } from '../astro/position.js';
import { julianYearsSinceJ2000 } from '../astro/time-scales.js';
import type { Plan, PlannedVisit } from '../plan/plan-schema.js';
import { decText, raText } from './sexagesimal-text.js';

export interface StarPlaceText {
  raIcrs: string;
  decIcrs: string;
}

export function starPlaceAtVisit(plan: Plan, visit: PlannedVisit): StarPlaceText {
  const star = plan.campaign.targets.find((t) => t.starId === visit.starId);
  if (!star) throw new Error(`plan has a visit of ${visit.starId}, a star its campaign does not list`);
  const place = properMotionJ2000(star, 2000 + julianYearsSinceJ2000(new Date(visit.startUtc)));
  return { raIcrs: raText(place.raDeg), decIcrs: decText(place.decDeg) };
}

/** The star's weight in the schedule: the largest priority of its rows. */
export function starPriority(plan: Plan, starId: string): number {
  return extent(plan.targets.filter((t) => t.starId === starId).map((t) => t.priority)).max;
}
