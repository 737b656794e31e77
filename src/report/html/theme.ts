import type { Config } from 'vega-lite';
import { CATEGORY_COLOURS, INK, MUTED, RULE } from './palette.js';

/** A system font stack: nothing is fetched, every platform has one of these. */
export const FONT_STACK = "system-ui, 'Segoe UI', 'Helvetica Neue', Arial, 'Liberation Sans', sans-serif";

/** The vega-lite configuration shared by every chart of the report: our own plain style. */
export const CHART_CONFIG: Config = {
  font: FONT_STACK,
  background: '#ffffff',
  padding: 8,
  view: { stroke: RULE },
  range: { category: [...CATEGORY_COLOURS] },
  title: { anchor: 'start', fontSize: 14, fontWeight: 600, color: INK, offset: 10, subtitleColor: MUTED, subtitleFontSize: 11 },
  axis: {
    labelColor: INK,
    titleColor: INK,
    labelFontSize: 11,
    titleFontSize: 12,
    titleFontWeight: 500,
    gridColor: '#e6e8eb',
    domainColor: MUTED,
    tickColor: MUTED,
  },
  legend: { labelColor: INK, titleColor: INK, labelFontSize: 11, titleFontSize: 11, titleFontWeight: 500, orient: 'right' },
};
