import { describe, expect, it } from 'vitest';
import { legibleWidthPx } from '../../src/report/html/figure.js';
import { scrollTable } from '../../src/report/html/html.js';

const svg = (widthPx: number, fontsPx: number[]) =>
  `<svg class="marks" width="${widthPx}" height="300" viewBox="0 0 ${widthPx} 300">${fontsPx.map((f) => `<text font-size="${f}px">a</text>`).join('')}</svg>`;

describe('legibleWidthPx', () => {
  it('is the width at which the smallest text is drawn at 8 px (linear scaling)', () => {
    // 780 × 8 / 10 = 624: the 10 px text sets it, not the 14 px title.
    expect(legibleWidthPx(svg(780, [14, 10, 11]))).toBe(624);
    // 500 × 8 / 11 = 363.6…, rounded up so the text is never below 8 px.
    expect(legibleWidthPx(svg(500, [11]))).toBe(364);
  });

  it("never asks for more than the chart's own width (text already small: it is not enlarged)", () => {
    expect(legibleWidthPx(svg(400, [6]))).toBe(400);
  });
});

describe('scrollTable', () => {
  const columns = (n: number) => Array.from({ length: n }, (_, i) => ({ header: `c${i}` }));
  it('marks a table of more than 4 columns for the phone hint, and wraps every table in a scroll box', () => {
    expect(scrollTable(columns(5), [])).toMatch(/^<div class="table-wrap side-scroll"><table>/);
    expect(scrollTable(columns(4), [])).toMatch(/^<div class="table-wrap"><table>/);
  });
});
