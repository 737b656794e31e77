// The night charts of the demo plan (13 targets, up to 12 stars a night: past the eight
// colour-blind-safe colours), drawn to SVG in Node and read back from the marks.
import { beforeAll, describe, expect, it } from 'vitest';
import { observerOf } from '../../src/astro/bodies.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { nightFigure } from '../../src/report/html/chart-night.js';
import { moonAltitudes } from '../../src/report/html/night-bands.js';
import { renderSvg } from '../../src/report/html/vega-svg.js';
import { visitsByNight } from '../../src/report/plan-rows.js';
import { demoPlan } from '../support/demo-plan.js';
import { attributeOf, markElements, textOf } from './svg-marks.js';

interface DrawnNight {
  date: string;
  starIds: string[];
  svg: string;
  visitStars: string[];
}

let plan: Plan;
const nights: DrawnNight[] = [];

beforeAll(async () => {
  plan = demoPlan();
  for (const [date, visits] of visitsByNight(plan)) {
    if (!visits.length) continue;
    const svg = await renderSvg(nightFigure(plan, date, visits).spec);
    nights.push({ date, starIds: [...new Set(visits.map((v) => v.starId))], svg, visitStars: visits.map((v) => v.starId) });
  }
});

const sorted = (xs: string[]) => [...xs].sort();
/** The star of a drawn item, from the data vega writes into its aria-label (`...; star: SELVA-12`). */
const starOf = (element: string) => attributeOf(element, 'aria-label')!.match(/star: ([^;]+)/)![1]!;

describe('night charts of the demo plan', () => {
  it('draw every planned night, some with more than eight stars', () => {
    expect(nights.length).toBe(plan.plannedDates.length);
    expect(Math.max(...nights.map((n) => n.starIds.length))).toBeGreaterThan(8);
  });

  it("carry one visit segment per visit and, beside each, a label with its star's name", () => {
    for (const n of nights) {
      expect(markElements(n.svg, 'visit_segments')).toHaveLength(n.visitStars.length);
      const labels = markElements(n.svg, 'visit_labels').map(textOf);
      expect(sorted(labels)).toEqual(sorted(n.visitStars));
      // Each segment's colour is its own star's track colour.
      const trackColour = new Map(markElements(n.svg, 'altitude_lines').map((e) => [starOf(e), attributeOf(e, 'stroke')]));
      for (const e of markElements(n.svg, 'visit_segments')) {
        const star = starOf(e);
        expect(attributeOf(e, 'stroke')).toBe(trackColour.get(star));
      }
    }
  });

  it('draw only the stars planned that night, no colour repeated among them', () => {
    for (const n of nights) {
      const tracks = markElements(n.svg, 'altitude_lines');
      const stars = tracks.map((e) => starOf(e));
      expect(sorted(stars)).toEqual(sorted(n.starIds));
      const colours = tracks.map((e) => attributeOf(e, 'stroke')!.toLowerCase());
      expect(new Set(colours).size).toBe(n.starIds.length);
    }
  });

  it("draw the Moon's track, labelled with its lit fraction, on every night it is up during the drawn span", () => {
    const observer = observerOf(plan.campaign.site);
    let up = 0;
    for (const n of nights) {
      const night = plan.nights.find((x) => x.localDate === n.date)!;
      // Independently of the chart's samples: the Moon's altitude every 10 minutes over the dark span.
      const instants: number[] = [];
      for (let t = night.darkStart!.getTime(); t <= night.darkEnd!.getTime(); t += 600_000) instants.push(t);
      const isUp = moonAltitudes(observer, instants).some((a) => a !== null && a > 1);
      if (!isUp) continue;
      up++;
      expect(markElements(n.svg, 'moon_track').length).toBeGreaterThan(0);
      const [label] = markElements(n.svg, 'moon_label').map(textOf);
      expect(label).toBe(`Moon ${Math.round(night.moon.illumination * 100)}% lit`);
    }
    expect(up).toBeGreaterThan(0);
  });

  it('give local time, UTC and local sidereal time at the same ticks', () => {
    for (const n of nights) {
      const texts = markElements(n.svg, 'clock_labels').map(textOf);
      expect(texts.length % 3).toBe(0);
      expect(texts.length).toBeGreaterThanOrEqual(3 * 6);
      for (const t of texts) expect(t).toMatch(/^\d\d:\d\d$/);
    }
  });
});
