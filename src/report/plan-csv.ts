import type { Plan } from '../model.js';
import { toCsv } from './csv.js';

export const PLAN_CSV_HEADER = [
  'localDate', 'startLocal', 'startUtc', 'targetId', 'exposureSec', 'durationSec', 'airmass',
  'moonSeparationDeg', 'midBjdTdb', 'phase', 'phaseErr', 'sigmaMps', 'sigmaEffMps', 'snrPerPixel',
];

/** plan.csv: one row per visit, in time order. */
export function renderPlanCsv(plan: Plan): string {
  const visits = [...plan.visits].sort((a, b) => a.startUtc.localeCompare(b.startUtc));
  return toCsv(
    PLAN_CSV_HEADER,
    visits.map((v) => [
      v.localDate, v.startLocal, v.startUtc, v.targetId, v.exposureSec.toFixed(0), v.durationSec.toFixed(0),
      v.airmass.toFixed(4), v.moonSeparationDeg.toFixed(2), v.midBjdTdb.toFixed(6),
      v.phase?.toFixed(5), v.phaseErr?.toFixed(5), v.sigmaMps.toFixed(4), v.sigmaEffMps.toFixed(4), v.snrPerPixel.toFixed(1),
    ]),
  );
}
