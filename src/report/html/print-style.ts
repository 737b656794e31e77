import { MUTED } from './palette.js';
import { FONT_STACK } from './theme.js';

/** Left and right page margins in print; top and bottom are fixed in the sheet. */
export const PRINT_SIDE_MARGIN_MM = 12;

/**
 * Print, on A4 or US Letter alike: one margin set that fits both (the narrower width of A4, the
 * shorter height of Letter), page numbers "n / N" in the bottom margin box (CSS Paged Media 3,
 * @page margin boxes), the proposal summary alone on page 1, a heading kept with what follows,
 * each planet's heading and charts in one unbroken block, night charts two a row, and the
 * blind-search blocks side by side. The charts' data tables stay folded unless opened.
 */
export const PRINT_CSS = `
@page {
  size: auto;
  margin: 12mm ${PRINT_SIDE_MARGIN_MM}mm 14mm;
  @bottom-center { content: counter(page) " / " counter(pages); font: 8pt ${FONT_STACK}; color: ${MUTED}; }
}
@media print {
  body { background: #ffffff; font-size: 9pt; line-height: 1.35; }
  main { max-width: none; padding: 0; }
  h1 { font-size: 15pt; }
  h2 { font-size: 12pt; margin: 10px 0 4px; padding-top: 4px; }
  h3 { font-size: 10pt; margin: 6px 0 2px; }
  h2, h3 { break-after: avoid; page-break-after: avoid; }
  header.report-head { padding-bottom: 6px; margin-bottom: 8px; }
  .caution { margin: 8px 0; padding: 4px 10px; }
  .proposal-text { padding: 6px 10px; margin: 6px 0 0; }
  .first-page { break-after: page; page-break-after: always; font-size: 8.5pt; line-height: 1.3; }
  .first-page table td, .first-page table th { line-height: 1.2; }
  table { font-size: 8pt; margin: 4px 0 6px; }
  th, td { padding: 1px 5px 1px 0; }
  .num { padding-left: 4px; }
  .table-wrap { overflow: visible; }
  .table-note { font-size: 7.5pt; margin: 2px 0; }
  table, figure, .caution, .proposal-text, .planet-block, .search-block { break-inside: avoid; page-break-inside: avoid; }
  figure.chart { margin: 4px 0 8px; }
  figcaption { font-size: 7.5pt; line-height: 1.3; max-width: none; }
  details { display: block; margin: 0; }
  details > summary { display: none; }
  details:not([open]) > * { display: none; }
  .svg-box svg { max-width: 100%; max-height: 80mm; width: auto; height: auto; }
  .chart-grid, .search-blocks { display: grid; grid-template-columns: 1fr 1fr; gap: 0 6mm; align-items: start; }
  .chart-grid .svg-box svg, .search-block .svg-box svg { width: 100%; }
  .pair { flex-wrap: nowrap; gap: 0 6mm; }
  .pair > figure { flex: 0 1 auto; }
  .pair .svg-box svg { height: 46mm; width: auto; }
  .pair figcaption { width: 0; min-width: 100%; }
  footer { margin-top: 12px; }
}
`;
