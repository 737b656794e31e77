import type { TopLevelSpec } from 'vega-lite';
import type { SweepRow } from '../../plan/plan-schema.js';
import { sweepColumns, sweepRows } from '../sweep-rows.js';
import { percent } from '../table.js';
import type { ChartFigure } from './figure.js';
import { MUTED, OKABE_ITO, RULE } from './palette.js';

/**
 * How many nights: above, P(all goals) (thick) and each goal's probability (thin) against the
 * night count; below, each count's dark hours split into used and idle.
 */
export function nightsSweepFigure(sweep: SweepRow[], goalProbability: number): ChartFigure {
  const counts = sweep.map((r) => r.nights);
  const x = {
    field: 'nights',
    type: 'quantitative' as const,
    title: 'Nights asked for',
    scale: { domain: [counts[0]! - 0.5, counts[counts.length - 1]! + 0.5], nice: false },
    axis: { tickMinStep: 1, format: 'd' },
  };
  const goals = sweep.flatMap((r) => r.goals.map((g) => ({ nights: r.nights, targetId: g.targetId, p: g.goalProbability })));
  const all = sweep.map((r) => ({ nights: r.nights, p: r.allGoalsProbability }));
  const hours = sweep.flatMap((r) => [
    { nights: r.nights, use: 'used by visits', hours: r.darkHours - r.idleHours },
    { nights: r.nights, use: 'idle', hours: r.idleHours },
  ]);
  const y = { field: 'p', type: 'quantitative' as const, title: 'Probability of reaching the goal', scale: { domain: [0, 1] }, axis: { format: '%' } };
  const spec = {
    vconcat: [
      {
        width: 520,
        height: 220,
        layer: [
          {
            data: { values: goals },
            name: 'sweep_goal_lines',
            mark: { type: 'line', color: RULE, strokeWidth: 1.2, point: { filled: true, size: 18, color: MUTED } },
            encoding: { x, y, detail: { field: 'targetId' }, tooltip: [{ field: 'targetId' }, { field: 'p', format: '.0%' }] },
          },
          {
            data: { values: all },
            name: 'sweep_all_line',
            mark: { type: 'line', color: OKABE_ITO.blue, strokeWidth: 3, point: { filled: true, size: 50, color: OKABE_ITO.blue } },
            encoding: { x, y },
          },
        ],
      },
      {
        width: 520,
        height: 120,
        data: { values: hours },
        name: 'sweep_hours_bars',
        mark: { type: 'bar', size: 14 },
        encoding: {
          x,
          y: { field: 'hours', type: 'quantitative', stack: 'zero', title: 'Dark hours' },
          color: {
            field: 'use',
            type: 'nominal',
            title: null,
            scale: { domain: ['used by visits', 'idle'], range: [OKABE_ITO.bluishGreen, '#e6e8eb'] },
            legend: { orient: 'bottom' },
          },
          order: { field: 'use', sort: 'descending' },
        },
      },
    ],
  } as unknown as TopLevelSpec;
  const best = sweep.find((r) => r.allGoalsProbability >= goalProbability);
  return {
    id: 'nights-sweep',
    kind: 'nights-sweep',
    title: 'How many nights',
    caption:
      `The campaign planned in full for ${counts[0]} to ${counts[counts.length - 1]} nights. Above: the probability, with the site's weather, ` +
      'that every planet and search reaches its goal in the same season (thick blue line) and that each one does (thin grey lines). ' +
      `Below: the dark hours of the chosen nights, used by visits (green) or idle (grey). ` +
      (best
        ? `${best.nights} nights are the fewest that reach every goal together with the campaign's probability of ${percent(goalProbability)} ` +
          `(${percent(best.allGoalsProbability)}).`
        : `No count of the range reaches every goal together with the campaign's probability of ${percent(goalProbability)}.`),
    spec,
    columns: sweepColumns(sweep),
    rows: sweepRows(sweep, goalProbability),
  };
}
