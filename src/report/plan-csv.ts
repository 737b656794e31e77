import { DateTime } from 'luxon';
import type { Plan } from '../plan/plan-schema.js';
import { toCsv } from './csv.js';
import { nightInterval } from './night-interval.js';
import { phasesText } from './plan-rows.js';
import { starPlaceAtVisit, starPriority } from './star-place.js';

export const PLAN_CSV_HEADER = [
  'night',
  'startLocal',
  'endLocal',
  'startUtc',
  'endUtc',
  'starId',
  'priority',
  'raIcrs',
  'decIcrs',
  'exposureSec',
  'durationSec',
  'airmass',
  'moonSeparationDeg',
  'midBjdTdb',
  'phases',
  'visitSigmaMps',
  'effectiveSigmaMps',
  'whiteSigmaMps',
  'snrPerPixel',
];

/**
 * plan.csv: one row per visit, in time order. `night` names the night by the dates it spans
 * (night-interval.ts); the block ends `durationSec` after it starts; raIcrs/decIcrs are the star's
 * ICRS place at the visit's epoch; `priority` the star's weight; `phases` lists each planet's
 * predicted phase as `id=phase±error`, separated by `; `.
 */
export function renderPlanCsv(plan: Plan): string {
  const visits = [...plan.visits].sort((a, b) => a.startUtc.localeCompare(b.startUtc));
  return toCsv(
    PLAN_CSV_HEADER,
    visits.map((v) => {
      const end = DateTime.fromISO(v.startUtc, { zone: plan.campaign.site.timeZone }).plus({ seconds: v.durationSec });
      const place = starPlaceAtVisit(plan, v);
      return [
        nightInterval(v.localDate),
        v.startLocal,
        end.toISO({ suppressMilliseconds: true })!,
        v.startUtc,
        end.toUTC().toISO({ suppressMilliseconds: true })!,
        v.starId,
        String(starPriority(plan, v.starId)),
        place.raIcrs,
        place.decIcrs,
        v.exposureSec.toFixed(0),
        v.durationSec.toFixed(0),
        v.airmass.toFixed(4),
        v.moonSeparationDeg.toFixed(2),
        v.midBjdTdb.toFixed(6),
        phasesText(v, 5),
        v.visitSigmaMps.toFixed(4),
        v.effectiveSigmaMps.toFixed(4),
        v.whiteSigmaMps.toFixed(4),
        v.snrPerPixel.toFixed(1),
      ];
    }),
  );
}
