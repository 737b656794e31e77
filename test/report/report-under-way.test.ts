import { beforeAll, describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/html/report-html.js';
import { MIRADOR_B_K, MIRADOR_RVS, TEYU_FIT, TEYU_RVS, underWayPlan } from './fixture-under-way.js';
import { fixturePlan, TARGETS } from './fixture.js';
import { figures, markCount, tableRows } from './svg-marks.js';

let page: string;
let demoLike: string;

beforeAll(async () => {
  page = await renderReportHtml(underWayPlan());
  demoLike = await renderReportHtml(fixturePlan());
});

const rvChart = (html: string, id: string) => figures(html, 'rv-phase').find((f) => f.id === id)!;

// The phase of an RV by hand: (t − Tc)/P mod 1, on Teyu-3's fitted ephemeris unless another is given.
const handPhase = (bjd: number, eph: { tcBjdTdb: number; periodDays: number } = TEYU_FIT) => {
  const x = (bjd - eph.tcBjdTdb) / eph.periodDays;
  return x - Math.floor(x);
};

describe('measured RVs on the folded curve', () => {
  it('draws one diamond and one error bar per RV of the star, and the K ± σ_K band', () => {
    const chart = rvChart(page, 'rv-teyu-3');
    expect(markCount(chart.html, 'measured_points')).toBe(TEYU_RVS.length);
    expect(markCount(chart.html, 'measured_error_bars')).toBe(TEYU_RVS.length);
    expect(markCount(chart.html, 'fit_band')).toBe(1);
    // Named in words: a key entry and the caption.
    expect(chart.html).toMatch(/<text[^>]*>measured RV<\/text>/);
    expect(chart.html).toContain('diamonds is an RV already measured');
    // The key's and band's extra SVG ids stay unique in the page.
    const ids = [...page.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
    expect(markCount(rvChart(page, 'rv-mirador-7').html, 'measured_points')).toBe(MIRADOR_RVS.length);
  });

  it("removes the star's other planet: Mirador-7's RVs (b + c + offset) fall on b's curve", () => {
    const eph = TARGETS.find((t) => t.id === 'Mirador-7')!.ephemeris!;
    const chart = rvChart(page, 'rv-mirador-7');
    expect(chart.html).toContain('and the signal of Mirador-7 c;');
    const rows = tableRows(chart.html).filter((r) => r[0]!.startsWith('measured'));
    expect(rows).toHaveLength(MIRADOR_RVS.length);
    MIRADOR_RVS.forEach(([bjd], i) => {
      const phase = handPhase(bjd, eph);
      expect(rows[i]![2]).toBe(phase.toFixed(3));
      expect(Number(rows[i]![4])).toBeCloseTo(-MIRADOR_B_K * Math.sin(2 * Math.PI * phase), 2);
    });
  });

  it('places each RV at its phase, offset and error derived by hand', () => {
    // The data were made exactly as γ + K s(φ), so with γ removed each point lies on the curve: K·(−sin 2πφ).
    const rows = tableRows(rvChart(page, 'rv-teyu-3').html).filter((r) => r[0]!.startsWith('measured'));
    expect(rows).toHaveLength(TEYU_RVS.length);
    TEYU_RVS.forEach(([bjd, date, , rvErr], i) => {
      const phase = handPhase(bjd);
      expect(rows[i]![1]).toBe(date);
      expect(rows[i]![2]).toBe(phase.toFixed(3));
      expect(Number(rows[i]![4])).toBeCloseTo(-TEYU_FIT.kMps * Math.sin(2 * Math.PI * phase), 2);
      // The bar: √(σ_RV² + jitter²), the fixture star's jitter 1.5 m/s.
      expect(Number(rows[i]![5])).toBeCloseTo(Math.hypot(rvErr, 1.5), 2);
    });
  });

  it('draws the points at x = phase × plot width (380 px, phase axis 0 to 1)', () => {
    const html = rvChart(page, 'rv-teyu-3').html;
    const start = html.indexOf('measured_points_marks');
    const group = html.slice(start, html.indexOf('</g>', start));
    const xs = [...group.matchAll(/translate\(([-\d.]+),/g)].map((m) => Number(m[1]));
    expect(xs.sort((a, b) => a - b)).toEqual(
      TEYU_RVS.map(([bjd]) => handPhase(bjd) * 380)
        .sort((a, b) => a - b)
        .map((x) => expect.closeTo(x, 0)),
    );
  });

  it('a plan without observed visits draws no measured layer, band or "done so far"', () => {
    for (const f of figures(demoLike, 'rv-phase')) {
      expect(markCount(f.html, 'measured_points')).toBe(0);
      expect(markCount(f.html, 'fit_band')).toBe(0);
    }
    expect(demoLike).not.toContain('done so far');
    expect(demoLike).not.toContain('class="rv-update"');
  });
});

describe('K/σ_K growth and the text once RVs exist', () => {
  it('starts at one point for the visits made, labelled "done so far", below every later point', () => {
    const chart = figures(page, 'k-growth').find((f) => f.id === 'k-teyu-3')!;
    expect(markCount(chart.html, 'k_done_point')).toBe(1);
    expect(chart.html).toMatch(/<text[^>]*>done so far \(4 visits\)<\/text>/);
    const rows = tableRows(chart.html);
    expect(rows[0]![1]).toBe('done so far');
    // Information only adds: K/σ_K never falls as visits are added (a property of least squares).
    const values = rows.map((r) => Number(r[2]));
    for (let i = 1; i < values.length; i++) expect(values[i]!).toBeGreaterThanOrEqual(values[i - 1]! - 0.005);
    // The planned visits ahead are still one point each.
    expect(markCount(chart.html, 'k_growth_points')).toBe(rows.length - 1);
  });

  it('states what the fit changed and the offered candidate, with errors', () => {
    const text = [...page.matchAll(/<p class="rv-update">([\s\S]*?)<\/p>/g)].map((m) => m[1]!);
    expect(text).toHaveLength(2);
    // The transit nearest the window's middle (2027-04-15T12:00Z = JD 2461511.0), by hand: ten
    // periods on, fitted 2461480.3131 + 10 × 3.2176, catalogue 2461480.3121 + 10 × 3.2174: +0.0030 d
    // = +4.3 min; errors √(0.0015² + (10 × 0.0003)²) = 4.8 min now and √(0.002² + (10 × 0.0004)²)
    // = 6.4 min before, so the shift is 4.3 / 6.4 = 0.67σ of the catalogue.
    expect(text[0]).toContain(
      'Teyu-3 (4 RVs): K 5.90 -&gt; 6.10 ± 1.20 m/s; transit near the window&#39;s middle +4 min (+0.7σ of the catalogue), now ± 5 min (was ± 6)',
    );
    expect(text[0]).toContain('P 3.217400 -&gt; 3.217600 ± 3.0e-4 d');
    expect(text[1]).toContain('Alba: candidate signal in the RVs so far, P = 5.430 d, K = 2.80 m/s');
  });
});
