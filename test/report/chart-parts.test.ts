// The parts the charts are built from: colours, ticks, label placement, clocks and symbols.
import { describe, expect, it } from 'vitest';
import { calendarTicks } from '../../src/report/html/calendar-ticks.js';
import { calendarFigure } from '../../src/report/html/chart-calendar.js';
import { detectionMapFigure } from '../../src/report/html/chart-detection-map.js';
import { oklabToLinearSrgb } from '../../src/report/html/generated-colours.js';
import { logTicks } from '../../src/report/html/log-ticks.js';
import { clockTicks } from '../../src/report/html/night-clock.js';
import { type PlacedLabel, placeLabels } from '../../src/report/html/night-labels.js';
import { CATEGORY_COLOURS, distinctColours } from '../../src/report/html/palette.js';
import { htmlSymbols, svgSymbols } from '../../src/report/html/typography.js';
import { renderSvg } from '../../src/report/html/vega-svg.js';
import { fixturePlan } from './fixture.js';
import { axisLabels } from './svg-marks.js';

const DAY_MS = 86_400_000;

describe('colours', () => {
  it('start with the eight Okabe–Ito colours and never repeat', () => {
    for (const n of [1, 8, 9, 13, 40, 150]) {
      const colours = distinctColours(n);
      expect(colours).toHaveLength(n);
      expect(new Set(colours.map((c) => c.toLowerCase())).size).toBe(n);
      expect(colours.slice(0, 8)).toEqual(CATEGORY_COLOURS.slice(0, n));
      for (const c of colours) expect(c).toMatch(/^#[0-9a-fA-F]{6}$/);
    }
  });

  it('convert OKLab white and black exactly (Ottosson 2020: L = 1, a = b = 0 is sRGB white)', () => {
    for (const c of oklabToLinearSrgb(1, 0, 0)) expect(c).toBeCloseTo(1, 6);
    expect(oklabToLinearSrgb(0, 0, 0)).toEqual([0, 0, 0]);
  });
});

describe('calendar ticks', () => {
  it('are Mondays labelled with day, month and year on a short window', () => {
    // 2027-03-03 is a Wednesday (from memory; checked by getUTCDay below).
    const from = Date.UTC(2027, 2, 3);
    const ticks = calendarTicks(from, from + 20 * DAY_MS, 480);
    expect(ticks.format).toContain('%Y');
    expect(ticks.values.map((t) => new Date(t).toISOString().slice(0, 10))).toEqual(['2027-03-08', '2027-03-15', '2027-03-22']);
  });

  it('are month starts with the year on a long window, far enough apart to be read', () => {
    const from = Date.UTC(2026, 10, 20);
    const ticks = calendarTicks(from, from + 400 * DAY_MS, 900);
    expect(ticks.format).toBe('%b %Y');
    for (const t of ticks.values) expect(new Date(t).getUTCDate()).toBe(1);
    const gaps = ticks.values.slice(1).map((t, i) => ((t - ticks.values[i]!) / (400 * DAY_MS)) * 900);
    expect(Math.min(...gaps)).toBeGreaterThanOrEqual(80 * (28 / 31));
  });

  it('label the drawn calendar with the year on every date', async () => {
    const svg = await renderSvg(calendarFigure(fixturePlan()).spec);
    const dates = axisLabels(svg).filter((t) => /\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b/.test(t));
    expect(dates.length).toBeGreaterThanOrEqual(2);
    for (const d of dates) expect(d).toMatch(/\b20\d\d$/);
  });
});

describe('mass ticks of a detection map', () => {
  it('are round values inside the domain, each one labelled on the drawn axis', async () => {
    expect(logTicks(4.3, 93, 240, 16)).toEqual([5, 10, 20, 30, 50]);
    expect(logTicks(0.5, 5000, 120, 16)).toEqual([1, 10, 100, 1000]);
    const masses = [5, 6.8, 9.26, 12.6, 17.1, 23.3, 31.7, 43.2, 58.8, 80];
    const periods = [2, 5, 12, 30, 60];
    const figure = detectionMapFigure({
      targetId: 'invented',
      method: 'Invented probabilities.',
      periodsDays: periods,
      msinisEarth: masses,
      panels: [{ label: 'analytic', detection: periods.map(() => masses.map((_, j) => j / (masses.length - 1))) }],
    });
    const labels = axisLabels(await renderSvg(figure.spec));
    for (const v of ['5', '10', '20', '30', '50']) expect(labels).toContain(v);
  });
});

/** Whether two label boxes share any area. */
const overlap = (a: PlacedLabel, b: PlacedLabel) =>
  Math.abs(a.xPx - b.xPx) < (a.widthPx + b.widthPx) / 2 && Math.abs(a.yPx - b.yPx) < (a.heightPx + b.heightPx) / 2;

describe('visit labels', () => {
  it('do not overlap when there is room above and below', () => {
    // Twelve labels crowded along a line, 8 px apart: each must move to its own place.
    const anchors = Array.from({ length: 12 }, (_, i) => ({ xPx: 100 + 8 * i, yPx: 150 - 2 * i, text: `STAR-${i}` }));
    const placed = placeLabels(anchors, 6.3, 12, 640, 300);
    for (let i = 0; i < placed.length; i++) for (let j = 0; j < i; j++) expect(overlap(placed[i]!, placed[j]!)).toBe(false);
    for (const p of placed) {
      expect(p.xPx - p.widthPx / 2).toBeGreaterThanOrEqual(0);
      expect(p.yPx - p.heightPx / 2).toBeGreaterThanOrEqual(0);
    }
  });
});

describe('the time ruler', () => {
  it('gives the local sidereal time of the IAU 1982 GMST formula to within the equation of the equinoxes', () => {
    // GMST (deg) = 280.46061837 + 360.98564736629 d + 0.000387933 T² − T³/38710000, d days from
    // J2000.0 UT, T = d / 36525 (Meeus, Astronomical Algorithms, 2nd ed., eq. 12.4); GAST − GMST
    // is under 1.2 s. UTC stands in for UT1 (under 0.9 s apart).
    const site = { latitudeDeg: -30.2, longitudeDeg: -70.8, elevationM: 2400, timeZone: 'America/Santiago' };
    const instants = [Date.UTC(2027, 2, 4, 3, 0), Date.UTC(2027, 2, 4, 7, 0)];
    const ticks = clockTicks(site, instants);
    for (const [i, t] of instants.entries()) {
      const d = (t - Date.UTC(2000, 0, 1, 12)) / DAY_MS;
      const big = d / 36525;
      const gmstDeg = 280.46061837 + 360.98564736629 * d + 0.000387933 * big ** 2 - big ** 3 / 38_710_000;
      const lstMin = ((((gmstDeg + site.longitudeDeg) % 360) + 360) % 360) * 4;
      const [h, m] = ticks[i]!.lst.split(':').map(Number);
      const diff = Math.abs(h! * 60 + m! - lstMin);
      expect(Math.min(diff, 1440 - diff)).toBeLessThanOrEqual(0.6);
      expect(ticks[i]!.utc).toBe(new Date(t).toISOString().slice(11, 16));
    }
    // America/Santiago is UTC−3 in early March 2027 (summer time; tz database, from memory).
    expect(ticks[0]!.local).toBe('00:00');
  });
});

describe('symbols', () => {
  it('draw σ_X with a subscript in SVG text and HTML, never an underscore', () => {
    const svg = svgSymbols('<svg><text aria-label="K/σ_K" x="1">Expected K/σ_K and sigma_K</text></svg>');
    expect(svg).toContain('aria-label="K/sigma K"');
    expect(svg.replace(/<[^>]*>/g, '')).toBe('Expected K/σK and σK');
    expect(htmlSymbols('K/sigma_K, σ_RV')).toBe('K/σ<sub>K</sub>, σ<sub>RV</sub>');
  });
});
