import type { TopLevelSpec } from 'vega-lite';
import { levelRows, type LevelMass } from '../../rv/injection-map.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { logTicks } from './log-ticks.js';
import { INK, MUTED } from './palette.js';
import { MSINI_EARTH } from './typography.js';

/** One detection-probability map of a target (what `crest map` computes), ready to draw. */
export interface DetectionMapData {
  targetId: string;
  /** Words under the title: how the map was made (visits, trials, threshold). */
  method: string;
  periodsDays: number[];
  msinisEarth: number[];
  /** One or two panels sharing the axes, e.g. the analytic and the simulated known-phase map. */
  panels: { label: string; detection: number[][] }[];
  /** The mass the search aims at, or the planet's, drawn as a dashed rule. */
  markMsiniEarth?: number;
}

/** Cell edges of a log axis: geometric midpoints between grid values, the ends mirrored. */
function logEdges(values: number[]): number[] {
  if (values.length === 1) return [values[0]! / 1.1, values[0]! * 1.1];
  const mids = values.slice(1).map((v, i) => Math.sqrt(v * values[i]!));
  return [values[0]! ** 2 / mids[0]!, ...mids, values.at(-1)! ** 2 / mids.at(-1)!];
}

const PANEL_HEIGHT_PX = 240;
/** The least gap between two mass labels (px): a label's height and a little. */
const MIN_TICK_GAP_PX = 16;
/** The least gap between two period labels (px): a label's width and a little. */
const MIN_PERIOD_GAP_PX = 28;

const massText = (m: LevelMass) => (m.where === 'inside' ? fmt(m.msiniEarth, 1) : m.where);

function panelSpec(data: DetectionMapData, panel: DetectionMapData['panels'][number], width: number) {
  const pEdges = logEdges(data.periodsDays);
  const mEdges = logEdges(data.msinisEarth);
  const cells = data.periodsDays.flatMap((_, i) =>
    data.msinisEarth.map((_, j) => ({ p0: pEdges[i]!, p1: pEdges[i + 1]!, m0: mEdges[j]!, m1: mEdges[j + 1]!, probability: panel.detection[i]![j]! })),
  );
  const contour = levelRows(data.periodsDays, data.msinisEarth, panel.detection).flatMap((row) =>
    row.levels.map(({ level, mass }) => ({
      periodDays: row.periodDays,
      level: `${Math.round(level * 100)}%`,
      msiniEarth: mass.where === 'inside' ? mass.msiniEarth : null,
    })),
  );
  const periodTicks = logTicks(pEdges[0]!, pEdges.at(-1)!, width, MIN_PERIOD_GAP_PX);
  const x = {
    type: 'quantitative' as const,
    title: 'Orbital period (days)',
    scale: { type: 'log', domain: [pEdges[0], pEdges.at(-1)], nice: false },
    axis: { values: periodTicks, format: '~g', labelOverlap: false },
  };
  const massTicks = logTicks(mEdges[0]!, mEdges.at(-1)!, PANEL_HEIGHT_PX, MIN_TICK_GAP_PX);
  const y = {
    type: 'quantitative' as const,
    title: MSINI_EARTH,
    scale: { type: 'log', domain: [mEdges[0], mEdges.at(-1)], nice: false },
    axis: { values: massTicks, format: '~g', labelOverlap: false },
  };
  const layers: unknown[] = [
    {
      data: { values: cells },
      name: 'map_cells',
      mark: { type: 'rect' },
      encoding: {
        x: { ...x, field: 'p0' },
        x2: { field: 'p1' },
        y: { ...y, field: 'm0' },
        y2: { field: 'm1' },
        color: { field: 'probability', type: 'quantitative', title: 'P(detect)', scale: { scheme: 'blues', domain: [0, 1] }, legend: { format: '.0%' } },
      },
    },
    {
      data: { values: contour },
      name: 'map_contours',
      mark: { type: 'line', color: INK, strokeWidth: 2, invalid: 'break-paths-filter-domains' },
      encoding: {
        x: { ...x, field: 'periodDays' },
        y: { ...y, field: 'msiniEarth' },
        strokeDash: {
          field: 'level',
          type: 'nominal',
          title: 'detected',
          scale: {
            domain: ['50%', '90%'],
            range: [
              [1, 0],
              [6, 3],
            ],
          },
        },
      },
    },
  ];
  if (data.markMsiniEarth !== undefined) {
    layers.push({
      data: { values: [{ msiniEarth: data.markMsiniEarth }] },
      name: 'map_mark',
      mark: { type: 'rule', color: MUTED, strokeDash: [2, 2] },
      encoding: { y: { ...y, field: 'msiniEarth' } },
    });
  }
  return { title: { text: panel.label, fontSize: 12, fontWeight: 500 }, width, height: PANEL_HEIGHT_PX, layer: layers };
}

/**
 * A heatmap of detection probability against period and m sin i (both log), with the 50% (solid)
 * and 90% (dashed) detection contours: per period, the mass where the probability first reaches the
 * level, interpolated in log mass (src/rv/injection-map.ts). Contours break where a level lies off
 * the grid.
 */
export function detectionMapFigure(data: DetectionMapData): ChartFigure {
  const width = data.panels.length > 1 ? 300 : 420;
  const panels = data.panels.map((panel) => panelSpec(data, panel, width));
  const spec = (panels.length === 1
    ? panels[0]
    : { hconcat: panels, resolve: { scale: { color: 'shared', strokeDash: 'shared' } } }) as unknown as TopLevelSpec;
  const first = data.panels[0]!;
  const rows = levelRows(data.periodsDays, data.msinisEarth, first.detection);
  const markText = data.markMsiniEarth !== undefined ? ` Dotted rule: ${fmt(data.markMsiniEarth, 1)} M⊕.` : '';
  return {
    id: `detection-map-${data.targetId}`,
    kind: 'detection-map',
    title: `${data.targetId}: detection probability against period and m sin i`,
    caption: `${data.method} Solid line: 50% detected; dashed: 90%.${markText}`,
    spec,
    columns: [
      { header: 'period (d)', align: 'right' },
      { header: `50% mass (M⊕, ${first.label})`, align: 'right' },
      { header: '90% mass (M⊕)', align: 'right' },
    ],
    rows: rows.map((r) => [fmt(r.periodDays, 2), massText(r.levels[0]!.mass), massText(r.levels[1]!.mass)]),
  };
}
