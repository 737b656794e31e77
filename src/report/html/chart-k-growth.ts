import type { TopLevelSpec } from 'vega-lite';
import type { Plan, TargetSummary } from '../../model.js';
import { starVisitInformation } from '../../plan/visit-information.js';
import { StarInformation } from '../../rv/information.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { MUTED, OKABE_ITO } from './palette.js';
import { visitsOf } from './target-visits.js';

export interface KGrowthPoint {
  visit: number;
  date: string;
  kOverSigmaK: number;
}

/**
 * K/σ_K of one planet after each of its star's visits in time order: K / √Var(K) from the star's
 * information model (src/rv/information.ts: free offset, the other planets, the ephemeris and
 * its prior, nightly and correlated noise), the model the planner used.
 */
export function kGrowthSeries(plan: Plan, summary: TargetSummary & { kMps: number }): KGrowthPoint[] {
  const visits = visitsOf(plan, summary.starId);
  const star = starVisitInformation(plan.campaign, plan.nights, summary.starId, visits);
  if (!star) return [];
  const planet = star.model.planets.findIndex((p) => p.input.id === summary.targetId);
  const info = new StarInformation(star.model);
  const variance = new Float64Array(star.model.planetCount);
  return star.visits.map((v, i) => {
    info.apply(v, 1);
    const sigmaK = Math.sqrt(info.variances(variance)[planet]!);
    return { visit: i + 1, date: visits[i]!.localDate, kOverSigmaK: sigmaK === Infinity ? 0 : summary.kMps / sigmaK };
  });
}

/** K/σ_K growing with each planned visit of one ephemeris target, against its goal. */
export function kGrowthFigure(plan: Plan, summary: TargetSummary & { kMps: number }): ChartFigure {
  const goal = summary.goal ?? plan.campaign.goals.significance;
  const series = kGrowthSeries(plan, summary);
  const yMax = Math.max(goal, ...series.map((p) => p.kOverSigmaK)) * 1.15;
  const x = { field: 'visit', type: 'quantitative' as const, title: 'Visits so far', scale: { domain: [0, Math.max(series.length, 1) + 0.5], nice: false }, axis: { tickMinStep: 1, format: 'd' } };
  const spec = {
    width: 300,
    height: 220,
    layer: [
      {
        data: { values: [{ goal }] },
        name: 'goal_line', mark: { type: 'rule', color: MUTED, strokeDash: [5, 3], strokeWidth: 1.5 },
        encoding: { y: { field: 'goal', type: 'quantitative' } },
      },
      {
        data: { values: [{ goal, label: `goal ${fmt(goal, 1)}` }] },
        mark: { type: 'text', align: 'left', dx: 4, dy: -7, color: MUTED, fontSize: 11 },
        encoding: { x: { datum: 0, type: 'quantitative' }, y: { field: 'goal', type: 'quantitative' }, text: { field: 'label' } },
      },
      {
        data: { values: series },
        layer: [
          { name: 'k_growth_line', mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 2 }, encoding: { x, y: { field: 'kOverSigmaK', type: 'quantitative' } } },
          {
            name: 'k_growth_points', mark: { type: 'point', shape: 'circle', filled: true, size: 45, color: OKABE_ITO.blue, opacity: 1 },
            encoding: {
              x,
              y: { field: 'kOverSigmaK', type: 'quantitative', title: 'Expected K/σ_K', scale: { domain: [0, yMax], nice: false } },
            },
          },
        ],
      },
    ],
  } as unknown as TopLevelSpec;
  const last = series[series.length - 1];
  return {
    id: `k-${summary.targetId}`,
    kind: 'k-growth',
    title: `${summary.targetId}: K/σ_K after each visit`,
    caption:
      `Expected significance of K after each planned visit, in time order, against the goal of ${fmt(goal, 1)} (dashed). ` +
      `It includes the free velocity offset, the ephemeris uncertainty, the star's other planets and its nightly noise; after all ${series.length} visits: ${fmt(last?.kOverSigmaK, 1)}.`,
    spec,
    columns: [{ header: 'visit', align: 'right' }, { header: 'night' }, { header: 'K/sigma_K', align: 'right' }],
    rows: series.map((p) => [String(p.visit), p.date, fmt(p.kOverSigmaK, 2)]),
  };
}
