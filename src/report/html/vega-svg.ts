import type { TopLevelSpec } from 'vega-lite';
import { CHART_CONFIG } from './theme.js';
import { svgSymbols } from './typography.js';

/**
 * Renders a vega-lite spec to an SVG string in Node: compile to vega, run a headless View
 * (renderer 'none'), then `toSVG()`, its σ_X drawn with subscripts (typography.ts). No canvas, no network: data must be inline values.
 * vega and vega-lite are loaded on first use, so commands that draw no chart start faster.
 * Vega numbers clip paths and gradients with counters that live as long as the process; they
 * are reset before each chart, so a chart's bytes do not depend on the charts drawn before it
 * (a library caller drawing twice, `crest map --merge` against one run).
 */
export async function renderSvg(spec: TopLevelSpec): Promise<string> {
  const [{ parse, View, resetSVGDefIds }, { compile }] = await Promise.all([import('vega'), import('vega-lite')]);
  resetSVGDefIds();
  const vegaSpec = compile(spec, { config: CHART_CONFIG }).spec;
  const view = new View(parse(vegaSpec), { renderer: 'none' });
  try {
    return svgSymbols(await view.toSVG());
  } finally {
    view.finalize();
  }
}
