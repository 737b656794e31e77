import type { TopLevelSpec } from 'vega-lite';
import type { SearchSpec, Target } from '../../model.js';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { massLimitTable, MIN_VISITS, type MassLimitRow } from '../../rv/detect.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { MUTED, OKABE_ITO } from './palette.js';
import { equivalentSigmaMps, visitsOf } from './target-visits.js';

const GRID_POINTS = 60;

/** Periods spaced evenly in log P from min to max inclusive (a smooth curve on a log axis). */
function logGridDays(minDays: number, maxDays: number): number[] {
  const ratio = Math.log(maxDays / minDays);
  return Array.from({ length: GRID_POINTS }, (_, i) => minDays * Math.exp((ratio * i) / (GRID_POINTS - 1)));
}

export interface MassLimit {
  effectiveSigmaMps: number;
  visits: number;
  goalSignificance: number;
  rows: MassLimitRow[];
}

/**
 * The smallest m sin i this plan can detect at each period, for one blind-search target: the
 * random-phase rule σ_K² = σ_white²/((N − 1)/2) + (σ_floor/n)² and K_min = n σ_K turned into a mass
 * by the exact inverse of K, from src/rv/detect.ts (massLimitTable). σ is the visits' equivalent
 * per-visit σ with jitter, the floor taken out of it and given apart.
 * Undefined with fewer visits than a fit needs.
 */
export function searchMassLimit(plan: Plan, summary: TargetSummary, target: Target, periodsDays: number[]): MassLimit | undefined {
  const visits = visitsOf(plan, summary.starId);
  const effectiveSigmaMps = equivalentSigmaMps(visits);
  if (effectiveSigmaMps === undefined || visits.length < MIN_VISITS) return undefined;
  const goalSignificance = summary.goalSignificance ?? plan.campaign.goals.significance;
  // The floor does not average down: it is taken out of the per-visit σ and given apart (src/rv/detect.ts).
  const floorMps = Math.min(plan.campaign.instrument.floorMps, effectiveSigmaMps);
  const whiteSigmaMps = Math.sqrt(effectiveSigmaMps ** 2 - floorMps ** 2);
  const rows = massLimitTable({ starMassSun: target.massSun, whiteSigmaMps, floorMps, visits: visits.length, goalSignificance, periodsDays });
  return { effectiveSigmaMps, visits: visits.length, goalSignificance, rows };
}

/** The minimum detectable m sin i against period (log axis) with the search's target mass; undefined without enough visits. */
export function massLimitFigure(plan: Plan, summary: TargetSummary, target: Target & { search: SearchSpec }): ChartFigure | undefined {
  const { periodMinDays, periodMaxDays, msiniEarth } = target.search;
  const limit = searchMassLimit(plan, summary, target, logGridDays(periodMinDays, periodMaxDays));
  if (!limit) return undefined;
  const { rows, goalSignificance, effectiveSigmaMps } = limit;
  const yMax = Math.max(msiniEarth, ...rows.map((r) => r.massMinRandomEarth)) * 1.15;
  const curve = rows.map((r) => ({ periodDays: r.periodDays, msiniEarth: r.massMinRandomEarth, top: yMax }));
  const x = {
    field: 'periodDays',
    type: 'quantitative' as const,
    title: 'Orbital period (days)',
    scale: { type: 'log', domain: [periodMinDays, periodMaxDays], nice: false },
  };
  const spec = {
    width: 380,
    height: 220,
    layer: [
      {
        data: { values: curve },
        name: 'detectable_area',
        mark: { type: 'area', color: OKABE_ITO.bluishGreen, opacity: 0.12 },
        encoding: { x, y: { field: 'msiniEarth', type: 'quantitative' }, y2: { field: 'top' } },
      },
      {
        data: { values: curve },
        name: 'mass_limit_line',
        mark: { type: 'line', color: OKABE_ITO.bluishGreen, strokeWidth: 2 },
        encoding: { x, y: { field: 'msiniEarth', type: 'quantitative', title: 'Smallest m sin i (M⊕)', scale: { domain: [0, yMax], nice: false } } },
      },
      {
        data: { values: [{ msiniEarth, periodDays: periodMinDays, label: `target mass ${fmt(msiniEarth, 1)} M⊕` }] },
        layer: [
          {
            name: 'goal_mass',
            mark: { type: 'rule', color: MUTED, strokeDash: [5, 3], strokeWidth: 1.5 },
            encoding: { y: { field: 'msiniEarth', type: 'quantitative' } },
          },
          {
            mark: { type: 'text', align: 'left', dx: 4, dy: -7, color: MUTED, fontSize: 11 },
            encoding: { x, y: { field: 'msiniEarth', type: 'quantitative' }, text: { field: 'label' } },
          },
        ],
      },
    ],
  } as unknown as TopLevelSpec;
  const shown = rows.filter((_, i) => i % 6 === 0 || i === rows.length - 1);
  return {
    id: `mass-${summary.targetId}`,
    kind: 'mass-limit',
    title: `${summary.targetId}: detectable planet mass against period`,
    caption:
      `Planets above the line (shaded) reach K/σ_K ≥ ${fmt(goalSignificance, 1)} with the ${limit.visits} planned visits ` +
      `(equivalent σ = ${fmt(effectiveSigmaMps, 2)} m/s per visit, star ${fmt(target.massSun, 2)} M☉, circular orbits). ` +
      'An analytic limit: it uses the random-phase rule σ_K ≈ σ√(2/N) and the exact inverse of K; the dashed line is the mass the search aims at. ' +
      '`crest map` simulates the search itself (injection–recovery).',
    spec,
    columns: [
      { header: 'period (d)', align: 'right' },
      { header: 'K min (m/s)', align: 'right' },
      { header: 'm sin i min (M⊕)', align: 'right' },
    ],
    rows: shown.map((r) => [fmt(r.periodDays, 2), fmt(r.kMinRandomMps, 2), fmt(r.massMinRandomEarth, 2)]),
  };
}
