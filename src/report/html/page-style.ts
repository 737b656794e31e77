import { ACCENT_PALE, CAUTION_PALE, INK, MUTED, OKABE_ITO, RULE } from './palette.js';
import { FONT_STACK } from './theme.js';

/**
 * The page's own style on a screen: one readable column, system fonts only (nothing is fetched),
 * tables with light rules. Print and phone widths add their own rules (print-style.ts,
 * narrow-style.ts), placed after this sheet.
 */
export const PAGE_CSS = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #f6f7f8; color: ${INK}; font: 15px/1.5 ${FONT_STACK}; }
main { max-width: 980px; margin: 0 auto; padding: 24px 28px 48px; background: #ffffff; }
header.report-head { border-bottom: 3px solid ${OKABE_ITO.blue}; padding-bottom: 10px; margin-bottom: 18px; }
h1 { font-size: 26px; margin: 0 0 4px; letter-spacing: -0.01em; }
h2 { font-size: 19px; margin: 30px 0 10px; padding-top: 8px; border-top: 1px solid ${RULE}; }
h3 { font-size: 16px; margin: 20px 0 6px; }
.facts { display: grid; grid-template-columns: max-content 1fr; gap: 2px 14px; margin: 8px 0 0; color: ${MUTED}; }
.facts dt { font-weight: 600; color: ${INK}; }
.facts dd { margin: 0; }
.caution { border-left: 5px solid ${OKABE_ITO.orange}; background: ${CAUTION_PALE}; padding: 8px 12px; margin: 14px 0; }
.proposal-text { background: ${ACCENT_PALE}; border-left: 5px solid ${OKABE_ITO.blue}; padding: 10px 14px; }
.table-note { color: ${MUTED}; font-size: 0.9em; margin-top: 4px; }
table { border-collapse: collapse; margin: 8px 0 14px; font-size: 13.5px; font-variant-numeric: tabular-nums; }
caption { text-align: left; font-weight: 600; padding: 4px 0; }
th, td { padding: 3px 10px 3px 0; border-bottom: 1px solid ${RULE}; text-align: left; vertical-align: top; }
th { border-bottom: 2px solid ${MUTED}; font-weight: 600; }
.num { text-align: right; padding-left: 10px; }
td:first-child { white-space: nowrap; }
.table-wrap { overflow-x: auto; }
figure.chart { margin: 14px 0 22px; }
.svg-box svg { max-width: 100%; height: auto; display: block; }
figcaption { font-size: 13.5px; color: ${MUTED}; max-width: 70ch; margin-top: 4px; }
figcaption strong { color: ${INK}; }
details { margin-top: 4px; font-size: 13px; }
summary { cursor: pointer; color: ${OKABE_ITO.blue}; }
.pair { display: flex; flex-wrap: wrap; gap: 0 24px; align-items: flex-start; }
.pair > figure { flex: 1 1 380px; min-width: 0; }
.warnings li { margin: 2px 0; }
footer { margin-top: 36px; font-size: 12.5px; color: ${MUTED}; border-top: 1px solid ${RULE}; padding-top: 8px; }
`;
