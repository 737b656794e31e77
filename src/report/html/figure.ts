import type { TopLevelSpec } from 'vega-lite';
import type { Column } from '../table.js';
import { anchorId, htmlTable, htmlText } from './html.js';
import { renderSvg } from './vega-svg.js';

/** One chart of the report: its spec, the words around it, and the same data as a table. */
export interface ChartFigure {
  /** Unique within the page; becomes the figure's id. */
  id: string;
  /** Chart kind, a CSS class and a test hook: `calendar`, `night`, `rv-phase`, `k-growth`, `mass-limit`. */
  kind: string;
  title: string;
  caption: string;
  spec: TopLevelSpec;
  columns: Column[];
  rows: string[][];
}

/**
 * Renames the SVG's own ids (vega's clip paths) and the `url(#id)` references to them to
 * `<prefix>-clip<n>` in order of appearance: many SVGs inlined in one page never share an id, and
 * the names do not depend on how many charts vega drew before in this process (same bytes every run).
 */
export function scopeSvgIds(svg: string, prefix: string): string {
  const names = new Map<string, string>();
  for (const m of svg.matchAll(/\bid="([^"]+)"/g)) if (!names.has(m[1]!)) names.set(m[1]!, `${prefix}-clip${names.size + 1}`);
  return svg
    .replace(/\bid="([^"]+)"/g, (_, id: string) => `id="${names.get(id)}"`)
    .replace(/url\(#([^)]+)\)/g, (whole, id: string) => (names.has(id) ? `url(#${names.get(id)})` : whole));
}

/**
 * A `<figure>`: the inlined SVG, a caption, and the chart's data as a table inside `<details>`
 * for screen readers and for readers who want the numbers.
 */
export async function renderFigure(figure: ChartFigure): Promise<string> {
  const id = anchorId(figure.id);
  const svg = await renderSvg({ ...figure.spec, title: figure.title, description: `${figure.title}. ${figure.caption}` } as TopLevelSpec);
  return [
    `<figure class="chart chart-${figure.kind}" id="${id}" aria-labelledby="${id}-caption">`,
    `<div class="svg-box">${scopeSvgIds(svg, id)}</div>`,
    `<figcaption id="${id}-caption"><strong>${htmlText(figure.title)}.</strong> ${htmlText(figure.caption)}</figcaption>`,
    `<details><summary>Data table</summary>${htmlTable(figure.columns, figure.rows, figure.title)}</details>`,
    '</figure>',
  ].join('\n');
}
