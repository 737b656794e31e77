import type { TopLevelSpec } from 'vega-lite';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { starVisitInformation } from '../../plan/visit-information.js';
import { StarInformation } from '../../rv/information.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { INK, MUTED, OKABE_ITO } from './palette.js';
import { priorInformationVisits } from './prior-information.js';
import { visitsOf } from './target-visits.js';

export interface KGrowthPoint {
  /** 0 for the visits already made (all of them together), then 1, 2, ... for each visit ahead. */
  visit: number;
  date: string;
  kOverSigmaK: number;
}

/**
 * K/σ_K of one planet after each of its star's visits in time order: K / √Var(K) from the star's
 * information model (src/rv/information.ts: free offset, the other planets, the ephemeris and
 * its prior, nightly and correlated noise), the model the planner used. When visits were already
 * made (observed or kept), the series starts with one point for all of them together
 * (prior-information.ts), and counts only the visits ahead after it.
 */
export function kGrowthSeries(plan: Plan, summary: TargetSummary & { kMps: number }): KGrowthPoint[] {
  const ahead = visitsOf(plan, summary.starId).filter((v) => !v.kept);
  const star = starVisitInformation(plan.campaign, plan.nights, summary.starId, ahead);
  if (!star) return [];
  const planet = star.model.planets.findIndex((p) => p.input.id === summary.targetId);
  const info = new StarInformation(star.model);
  const variance = new Float64Array(star.model.planetCount);
  const kOverSigmaK = () => {
    const sigmaK = Math.sqrt(info.variances(variance)[planet]!);
    return sigmaK === Infinity ? 0 : summary.kMps / sigmaK;
  };
  const prior = priorInformationVisits(plan, summary.starId, star.model);
  for (const v of prior) info.apply(v, 1);
  const done = prior.length ? [{ visit: 0, date: 'done so far', kOverSigmaK: kOverSigmaK() }] : [];
  return [
    ...done,
    ...star.visits.map((v, i) => {
      info.apply(v, 1);
      return { visit: i + 1, date: ahead[i]!.localDate, kOverSigmaK: kOverSigmaK() };
    }),
  ];
}

/** K/σ_K growing with each planned visit of one ephemeris target, against its goal. */
export function kGrowthFigure(plan: Plan, summary: TargetSummary & { kMps: number }): ChartFigure {
  const goal = summary.goalSignificance ?? plan.campaign.goals.significance;
  const series = kGrowthSeries(plan, summary);
  const done = series.find((p) => p.visit === 0);
  const ahead = series.filter((p) => p.visit > 0);
  const priorVisits = summary.priorVisits ?? 0;
  const yMax = Math.max(goal, ...series.map((p) => p.kOverSigmaK)) * 1.15;
  const x = {
    field: 'visit',
    type: 'quantitative' as const,
    title: done ? 'Visits ahead (0: the visits done so far)' : 'Visits so far',
    scale: { domain: [0, Math.max(ahead.length, 1) + 0.5], nice: false },
    axis: { tickMinStep: 1, format: 'd' },
  };
  const spec = {
    width: 300,
    height: 220,
    layer: [
      {
        data: { values: [{ goal }] },
        name: 'goal_line',
        mark: { type: 'rule', color: MUTED, strokeDash: [5, 3], strokeWidth: 1.5 },
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
          {
            name: 'k_growth_line',
            mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 2 },
            encoding: { x, y: { field: 'kOverSigmaK', type: 'quantitative' } },
          },
          ...(done
            ? [
                {
                  name: 'k_done_segment',
                  transform: [{ filter: 'datum.visit <= 1' }],
                  mark: { type: 'line', color: INK, strokeWidth: 3 },
                  encoding: { x, y: { field: 'kOverSigmaK', type: 'quantitative' } },
                },
              ]
            : []),
          {
            name: 'k_growth_points',
            transform: [{ filter: 'datum.visit > 0' }],
            mark: { type: 'point', shape: 'circle', filled: true, size: 45, color: OKABE_ITO.blue, opacity: 1 },
            encoding: {
              x,
              y: { field: 'kOverSigmaK', type: 'quantitative', title: 'Expected K/σ_K', scale: { domain: [0, yMax], nice: false } },
            },
          },
        ],
      },
      ...(done
        ? [
            {
              data: { values: [{ ...done, label: `done so far (${priorVisits} visits)` }] },
              layer: [
                {
                  name: 'k_done_point',
                  mark: { type: 'point', shape: 'square', filled: true, size: 80, color: INK, opacity: 1 },
                  encoding: { x, y: { field: 'kOverSigmaK', type: 'quantitative' } },
                },
                {
                  name: 'k_done_label',
                  mark: { type: 'text', align: 'left', dx: 8, dy: 12, color: INK, fontSize: 11 },
                  encoding: { x, y: { field: 'kOverSigmaK', type: 'quantitative' }, text: { field: 'label' } },
                },
              ],
            },
          ]
        : []),
    ],
  } as unknown as TopLevelSpec;
  const last = series[series.length - 1];
  return {
    id: `k-${summary.targetId}`,
    kind: 'k-growth',
    title: `${summary.targetId}: K/σ_K after each visit`,
    caption:
      `Expected significance of K after each planned visit, in time order, against the goal of ${fmt(goal, 1)} (dashed). ` +
      "It includes the free velocity offset, the ephemeris uncertainty, the star's other planets and its nightly noise; " +
      `after all ${ahead.length} visits${done ? ' ahead' : ''}: ${fmt(last?.kOverSigmaK, 1)}.` +
      (done
        ? ` The square at 0, labelled "done so far", is what the ${priorVisits} visits already made give (${fmt(done.kOverSigmaK, 1)}); ` +
          'the thick segment joins it to the first visit ahead.'
        : ''),
    spec,
    columns: [{ header: 'visit', align: 'right' }, { header: 'night' }, { header: 'K/σ_K', align: 'right' }],
    rows: series.map((p) => [p.visit === 0 ? `0 (${priorVisits} made)` : String(p.visit), p.date, fmt(p.kOverSigmaK, 2)]),
  };
}
