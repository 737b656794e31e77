import type { Plan } from '../plan/plan-schema.js';
import { toCsv } from './csv.js';
import { phasesText } from './plan-rows.js';

export const PLAN_CSV_HEADER = [
  'localDate',
  'startLocal',
  'startUtc',
  'starId',
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

/** plan.csv: one row per visit, in time order; `phases` lists each planet's predicted phase as `id=phase±error`, separated by `; `. */
export function renderPlanCsv(plan: Plan): string {
  const visits = [...plan.visits].sort((a, b) => a.startUtc.localeCompare(b.startUtc));
  return toCsv(
    PLAN_CSV_HEADER,
    visits.map((v) => [
      v.localDate,
      v.startLocal,
      v.startUtc,
      v.starId,
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
    ]),
  );
}
