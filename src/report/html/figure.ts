import type { TopLevelSpec } from 'vega-lite';
import { extent } from '../../extent.js';
import type { Column } from '../table.js';
import { anchorId, htmlText, scrollTable } from './html.js';
import { MIN_CHART_TEXT_PX, PHONE_CONTENT_PX } from './narrow-style.js';
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
 * The width (px) at which an SVG's smallest text is drawn at MIN_CHART_TEXT_PX: its own width
 * times MIN_CHART_TEXT_PX / smallest font-size, never more than its own width (scaling is linear).
 */
export function legibleWidthPx(svg: string): number {
  const widthPx = Number(/<svg[^>]*\bwidth="([\d.]+)"/.exec(svg)?.[1] ?? 0);
  const smallestFontPx = extent([...svg.matchAll(/font-size="([\d.]+)px"/g)].map((m) => Number(m[1]))).min;
  return Math.ceil(Math.min(widthPx, (widthPx * MIN_CHART_TEXT_PX) / smallestFontPx));
}

/** The chart's box: on a phone the SVG shrinks to its legible width, then scrolls (narrow-style.ts). */
function svgBox(svg: string): string {
  const legiblePx = legibleWidthPx(svg);
  const hint = legiblePx > PHONE_CONTENT_PX ? ' side-scroll' : '';
  return `<div class="svg-box${hint}" style="--legible-width: ${legiblePx}px">${svg}</div>`;
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
    svgBox(scopeSvgIds(svg, id)),
    `<figcaption id="${id}-caption"><strong>${htmlText(figure.title)}.</strong> ${htmlText(figure.caption)}</figcaption>`,
    `<details><summary>Data table</summary>${scrollTable(figure.columns, figure.rows, figure.title)}</details>`,
    '</figure>',
  ].join('\n');
}
