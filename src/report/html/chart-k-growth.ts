import type { TopLevelSpec } from 'vega-lite';
import type { PlannedVisit, Plan, TargetSummary } from '../../model.js';
import { planetSignalShape, type SignalShape } from '../../orbit/signal-shape.js';
import { EPHEMERIS_STATS, ephemerisInformation, updateEphemerisStats } from '../../schedule/objective-ephemeris.js';
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
 * K/σ_K after each visit in time order, recomputed from the visits: K √E[I] with E[I] the expected
 * least-squares information on K with a free offset, over each visit's Gaussian phase error
 * (the scheduler's objective, src/schedule/objective-ephemeris.ts, which cites its sources), with
 * the signal shape of the planet's orbit (src/orbit/signal-shape.ts; eccentric orbits too).
 */
export function kGrowthSeries(kMps: number, visits: PlannedVisit[], shape: SignalShape): KGrowthPoint[] {
  const stats = new Float64Array(EPHEMERIS_STATS);
  return visits.map((v, i) => {
    const { m, q } = shape.moments(v.phase ?? 0, v.phaseErr ?? 0);
    updateEphemerisStats(stats, 0, 1 / (v.sigmaEffMps * v.sigmaEffMps), m, q, 1);
    return { visit: i + 1, date: v.localDate, kOverSigmaK: kMps * Math.sqrt(ephemerisInformation(stats, 0)) };
  });
}

/** K/σ_K growing with each planned visit of one ephemeris target, against its goal. */
export function kGrowthFigure(plan: Plan, summary: TargetSummary & { kMps: number }): ChartFigure {
  const goal = summary.goal ?? plan.campaign.goals.significance;
  const target = plan.campaign.targets.find((t) => t.id === summary.targetId);
  const series = kGrowthSeries(summary.kMps, visitsOf(plan, summary.targetId), planetSignalShape(target?.planet));
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
      `It includes the free velocity offset and the phase uncertainty; after all ${series.length} visits: ${fmt(last?.kOverSigmaK, 1)}.`,
    spec,
    columns: [{ header: 'visit', align: 'right' }, { header: 'night' }, { header: 'K/sigma_K', align: 'right' }],
    rows: series.map((p) => [String(p.visit), p.date, fmt(p.kOverSigmaK, 2)]),
  };
}
