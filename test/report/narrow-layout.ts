/// <reference lib="dom" />
// DOM types for the functions that run in the page (page.evaluate); src/ is still built without them (tsconfig.build.json).
// What a phone-width page looks like, read in the browser: the page's own width, every table or
// chart wider than the text column with the box that holds it, and the smallest chart text as drawn.
import type { Page } from 'playwright-core';

export interface WideBox {
  /** Caption of the table, or title of the chart. */
  name: string;
  /** The holding box scrolls sideways (overflow-x auto or scroll). */
  scrolls: boolean;
  /** The holding box's ::before text ('none' without one). */
  hint: string;
}

export interface NarrowLayout {
  /** document.documentElement.scrollWidth: more than the viewport means the page scrolls sideways. */
  pageWidthPx: number;
  wide: WideBox[];
  /** Smallest font size of any chart text times the chart's drawn scale (drawn width / viewBox width). */
  smallestChartTextPx: number;
}

/** Opens every data table first, so that the tables folded in a chart's details count too. */
export async function narrowLayout(page: Page): Promise<NarrowLayout> {
  return page.evaluate(() => {
    for (const details of document.querySelectorAll('details')) details.open = true;
    const main = document.querySelector('main')!;
    const style = getComputedStyle(main);
    const columnPx = main.clientWidth - Number.parseFloat(style.paddingLeft) - Number.parseFloat(style.paddingRight);
    const wide = [...document.querySelectorAll<HTMLElement | SVGSVGElement>('table, figure.chart svg')]
      .filter((el) => el.getBoundingClientRect().width > columnPx + 0.5)
      .map((el) => {
        const box = el.parentElement!;
        return {
          name: el instanceof HTMLTableElement ? (el.caption?.textContent ?? '') : (el.closest('figure')?.id ?? ''),
          scrolls: ['auto', 'scroll'].includes(getComputedStyle(box).overflowX),
          hint: getComputedStyle(box, '::before').content,
        };
      });
    const sizes = [...document.querySelectorAll<SVGTextElement>('figure.chart svg text')]
      .filter((text) => text.textContent?.trim())
      .map((text) => {
        const svg = text.ownerSVGElement!;
        return (Number.parseFloat(getComputedStyle(text).fontSize) * svg.getBoundingClientRect().width) / svg.viewBox.baseVal.width;
      });
    return { pageWidthPx: document.documentElement.scrollWidth, wide, smallestChartTextPx: sizes.reduce((a, b) => Math.min(a, b), Number.POSITIVE_INFINITY) };
  });
}
