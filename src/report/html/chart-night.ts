import type { TopLevelSpec } from 'vega-lite';
import { altitudeForAirmassDeg, kastenYoungAirmass } from '../../astro/airmass.js';
import { observerOf } from '../../astro/bodies.js';
import type { Night } from '../../model.js';
import type { Plan, PlannedVisit } from '../../plan/plan-schema.js';
import { localNoon } from '../../sky/local-time.js';
import { altitudeDeg, preparePosition, siteClock } from '../../sky/target-position.js';
import { nightHeading, VISIT_COLUMNS, visitRow } from '../plan-rows.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { moonAltitudes, sunSteps } from './night-bands.js';
import { clockTicks } from './night-clock.js';
import { placeLabels } from './night-labels.js';
import { BELOW_LIMIT_PALE, INK, MUTED, SUN_ALTITUDE_STOPS } from './palette.js';
import { targetColours } from './target-colours.js';

const HOUR_MS = 3_600_000;
const SAMPLE_MS = 5 * 60_000;
const WIDTH_PX = 640;
const HEIGHT_PX = 270;
/** Label font and the width of one of its characters, estimated for the placement. */
const LABEL_FONT_PX = 10;
const LABEL_CHAR_PX = 6.3;
/** Altitude ticks, each labelled with its Kasten & Young airmass (src/astro/airmass.ts). */
const ALTITUDE_TICKS_DEG = [0, 15, 30, 45, 60, 75, 90];
const CLOCK_ROWS = ['Local', 'UTC', 'LST'];
/** Half the width of a ruler label (HH:MM) and of the Moon's label, in px. */
const CLOCK_MARGIN_PX = 16;
const MOON_LABEL_HALF_PX = 40;

/** A label's alignment that keeps it inside the chart near either edge. */
const edgeAlign = (xPx: number) => (xPx < MOON_LABEL_HALF_PX ? 'left' : xPx > WIDTH_PX - MOON_LABEL_HALF_PX ? 'right' : 'center');

/** The span drawn for a night: sunset to sunrise (or the visits) with half an hour either side. */
function chartSpanMs(night: Night | undefined, visits: PlannedVisit[]): [number, number] {
  let from = Math.min(night?.sunset?.getTime() ?? Infinity, night?.darkStart?.getTime() ?? Infinity);
  let to = Math.max(night?.sunrise?.getTime() ?? -Infinity, night?.darkEnd?.getTime() ?? -Infinity);
  for (const v of visits) {
    from = Math.min(from, Date.parse(v.startUtc));
    to = Math.max(to, Date.parse(v.startUtc) + v.durationSec * 1000);
  }
  return [from - HOUR_MS / 2, to + HOUR_MS / 2];
}

/** Altitude axis labels: the altitude and, above the horizon, the airmass there ("30°  X=1.99"). */
function altitudeLabelExpr(): string {
  const label = (a: number) => (a <= 0 ? `${a}°` : `${a}°  X=${fmt(kastenYoungAirmass(a), 2)}`);
  return `${ALTITUDE_TICKS_DEG.map((a) => `datum.value === ${a} ? '${label(a)}'`).join(' : ')} : ''`;
}

/** Whole local hours inside [from, to] (hours from the evening's noon), every second hour on long nights. */
function hourTicks(from: number, to: number): number[] {
  const step = to - from > 14 ? 2 : 1;
  const ticks: number[] = [];
  for (let h = Math.ceil(from / step) * step; h <= to; h += step) ticks.push(h);
  return ticks;
}

/**
 * One planned night, in three rows sharing the time axis: a strip shaded by the Sun's altitude; the
 * altitude track of each star planned that night with its visits as thick segments on the track,
 * each labelled with the star's name, the Moon's track and the altitudes below the airmass limit;
 * and a time ruler with local time, UTC and local sidereal time.
 */
export function nightFigure(plan: Plan, localDate: string, visits: PlannedVisit[]): ChartFigure {
  const { site, constraints } = plan.campaign;
  const zone = site.timeZone;
  const night = plan.nights.find((n) => n.localDate === localDate);
  const [fromMs, toMs] = chartSpanMs(night, visits);
  // Local clock hours from the evening's local noon (12 = noon, 24 = midnight): a DST change
  // during the night shifts the labels after it by the change, which is rare and stated.
  const noonMs = localNoon(localDate, zone).getTime();
  const hours = (ms: number) => 12 + (ms - noonMs) / HOUR_MS;
  const pxOfHour = (h: number) => ((h - hours(fromMs)) / (hours(toMs) - hours(fromMs))) * WIDTH_PX;
  const pxOfAlt = (a: number) => HEIGHT_PX * (1 - a / 90);
  const observer = observerOf(site);
  const clock = siteClock(site, new Date((fromMs + toMs) / 2));
  const starIds = [...new Set(visits.map((v) => v.starId))];
  const colours = targetColours(plan, starIds);
  const positions = new Map(
    starIds.flatMap((id) => {
      const target = plan.campaign.targets.find((t) => t.starId === id);
      return target ? [[id, preparePosition(target, clock)] as const] : [];
    }),
  );
  const altAt = (id: string, ms: number) => {
    const p = positions.get(id);
    return p ? altitudeDeg(p, ms) : 0;
  };
  const samples: number[] = [];
  for (let t = fromMs; t <= toMs; t += SAMPLE_MS) samples.push(t);
  const aboveOrNull = (a: number) => (a >= 0 ? a : null);
  const tracks = starIds.flatMap((id) => samples.map((t) => ({ star: id, hour: hours(t), altitudeDeg: aboveOrNull(altAt(id, t)) })));
  const segments = visits.flatMap((v, i) => {
    const start = Date.parse(v.startUtc);
    const end = start + v.durationSec * 1000;
    const steps = Math.max(2, Math.ceil((end - start) / 60_000));
    return Array.from({ length: steps + 1 }, (_, k) => {
      const t = start + ((end - start) * k) / steps;
      return { visit: i, star: v.starId, hour: hours(t), altitudeDeg: Math.max(0, altAt(v.starId, t)) };
    });
  });
  const anchors = visits.map((v) => {
    const mid = Date.parse(v.startUtc) + (v.durationSec * 1000) / 2;
    return { hour: hours(mid), altitudeDeg: Math.max(0, altAt(v.starId, mid)), text: v.starId };
  });
  const placed = placeLabels(
    anchors.map((a) => ({ xPx: pxOfHour(a.hour), yPx: pxOfAlt(a.altitudeDeg), text: a.text })),
    LABEL_CHAR_PX,
    LABEL_FONT_PX + 2,
    WIDTH_PX,
    HEIGHT_PX,
  );
  const pxToHour = (x: number) => hours(fromMs) + (x / WIDTH_PX) * (hours(toMs) - hours(fromMs));
  const pxToAlt = (y: number) => 90 * (1 - y / HEIGHT_PX);
  const labels = anchors.map((a, i) => ({
    star: a.text,
    hour: a.hour,
    altitudeDeg: a.altitudeDeg,
    labelHour: pxToHour(placed[i]!.xPx),
    labelAltDeg: pxToAlt(placed[i]!.yPx),
  }));
  const moon = moonAltitudes(observer, samples);
  const moonTrack = samples.map((t, i) => ({ hour: hours(t), altitudeDeg: moon[i] }));
  const moonPct = Math.round((night?.moon.illumination ?? 0) * 100);
  const highest = moonTrack.reduce<{ hour: number; altitudeDeg: number } | undefined>(
    (best, m) => (m.altitudeDeg !== null && (!best || m.altitudeDeg > best.altitudeDeg) ? { hour: m.hour, altitudeDeg: m.altitudeDeg } : best),
    undefined,
  );
  const sky = sunSteps(observer, fromMs, toMs, SAMPLE_MS).map((s) => ({ start: hours(s.startMs), end: hours(s.endMs), sunAltitudeDeg: s.sunAltitudeDeg }));
  const ticks = hourTicks(hours(fromMs), hours(toMs));
  // The ruler leaves out a tick too near either end for its label to fit.
  const rulerTicks = ticks.filter((h) => pxOfHour(h) >= CLOCK_MARGIN_PX && pxOfHour(h) <= WIDTH_PX - CLOCK_MARGIN_PX);
  const clocks = clockTicks(
    site,
    rulerTicks.map((h) => noonMs + (h - 12) * HOUR_MS),
  ).flatMap((c, i) => [
    { hour: rulerTicks[i], row: 'Local', text: c.local },
    { hour: rulerTicks[i], row: 'UTC', text: c.utc },
    { hour: rulerTicks[i], row: 'LST', text: c.lst },
  ]);
  const floorDeg = Math.max(site.minAltitudeDeg, altitudeForAirmassDeg(constraints.maxAirmass));

  const scaleX = { domain: [hours(fromMs), hours(toMs)], nice: false, zero: false };
  const x = { field: 'hour', type: 'quantitative' as const, scale: scaleX };
  const gridX = { ...x, axis: { values: ticks, labels: false, ticks: true, title: null, grid: true, domain: false } };
  const y = { field: 'altitudeDeg', type: 'quantitative' as const, scale: { domain: [0, 90], nice: false } };
  const colour = { field: 'star', type: 'nominal' as const, scale: { domain: starIds, range: starIds.map((id) => colours.get(id)!) }, legend: null };
  const spec = {
    vconcat: [
      {
        width: WIDTH_PX,
        height: 12,
        data: { values: sky },
        name: 'sky_strip',
        mark: { type: 'rect' },
        encoding: {
          x: { ...x, field: 'start', axis: null },
          x2: { field: 'end' },
          fill: {
            field: 'sunAltitudeDeg',
            type: 'quantitative',
            title: 'Sun altitude',
            scale: { domain: [...SUN_ALTITUDE_STOPS.altitudesDeg], range: [...SUN_ALTITUDE_STOPS.colours], clamp: true },
            legend: {
              orient: 'right',
              direction: 'vertical',
              gradientLength: 80,
              values: [...SUN_ALTITUDE_STOPS.altitudesDeg],
              labelExpr: "datum.value + '°'",
            },
          },
        },
      },
      {
        width: WIDTH_PX,
        height: HEIGHT_PX,
        layer: [
          {
            data: { values: [{ bottom: 0, top: floorDeg, start: hours(fromMs), end: hours(toMs) }] },
            name: 'below_limit',
            mark: { type: 'rect', color: BELOW_LIMIT_PALE },
            encoding: {
              x: { ...gridX, field: 'start' },
              x2: { field: 'end' },
              y: { ...y, field: 'bottom', axis: { values: ALTITUDE_TICKS_DEG, labelExpr: altitudeLabelExpr(), title: 'Altitude, airmass X', grid: true } },
              y2: { field: 'top' },
            },
          },
          {
            data: {
              values: [{ hour: hours(fromMs), altitudeDeg: floorDeg / 2, text: `below ${fmt(floorDeg, 0)}°: airmass over ${fmt(constraints.maxAirmass, 1)}` }],
            },
            name: 'below_limit_label',
            mark: { type: 'text', align: 'left', dx: 4, fontSize: 9, color: MUTED },
            encoding: { x, y, text: { field: 'text' } },
          },
          {
            data: { values: moonTrack },
            name: 'moon_track',
            mark: { type: 'line', color: MUTED, strokeWidth: 1.5, strokeDash: [1, 3], strokeCap: 'round', invalid: 'break-paths-filter-domains' },
            encoding: { x, y },
          },
          ...(highest
            ? [
                {
                  data: { values: [{ ...highest, text: `Moon ${moonPct}% lit` }] },
                  name: 'moon_label',
                  mark: { type: 'text', dy: -8, fontSize: 10, fontStyle: 'italic', color: MUTED, align: edgeAlign(pxOfHour(highest.hour)) },
                  encoding: { x, y, text: { field: 'text' } },
                },
              ]
            : []),
          {
            data: { values: tracks },
            name: 'altitude_lines',
            mark: { type: 'line', strokeWidth: 1.4, opacity: 0.85, invalid: 'break-paths-filter-domains' },
            encoding: { x, y, color: colour },
          },
          {
            data: { values: segments },
            name: 'visit_segments',
            mark: { type: 'line', strokeWidth: 7, strokeCap: 'butt' },
            encoding: { x, y, color: colour, detail: { field: 'visit', type: 'nominal' } },
          },
          {
            data: { values: labels },
            name: 'label_leaders',
            mark: { type: 'rule', color: MUTED, strokeWidth: 0.6 },
            encoding: { x: { ...x, field: 'hour' }, y, x2: { field: 'labelHour' }, y2: { field: 'labelAltDeg' } },
          },
          {
            data: { values: labels },
            name: 'visit_labels',
            mark: { type: 'text', fontSize: LABEL_FONT_PX, fontWeight: 600, color: INK, baseline: 'middle' },
            encoding: { x: { ...x, field: 'labelHour' }, y: { ...y, field: 'labelAltDeg' }, text: { field: 'star' } },
          },
        ],
      },
      {
        width: WIDTH_PX,
        height: 42,
        view: { stroke: null },
        data: { values: clocks },
        name: 'clock_labels',
        mark: { type: 'text', fontSize: 10, color: INK },
        encoding: {
          x: { ...x, axis: { title: `Local time (${zone}), UTC and local sidereal time`, labels: false, ticks: false, domain: false, grid: false } },
          y: { field: 'row', type: 'nominal', scale: { domain: CLOCK_ROWS }, axis: { title: null, domain: false, ticks: false } },
          text: { field: 'text' },
        },
      },
    ],
    spacing: 4,
  } as unknown as TopLevelSpec;
  const moonText = highest ? `dotted grey: the Moon (${moonPct}% lit)` : `the Moon (${moonPct}% lit) stays below the horizon`;
  return {
    id: `night-${localDate}`,
    kind: 'night',
    title: `Night of ${localDate}`,
    caption:
      `${nightHeading(plan, localDate)}. Thin lines: the altitude of each of the ${starIds.length} stars planned this night; thick ` +
      `labelled segments on them: the ${visits.length} planned visits (exposure plus overheads); ${moonText}. ` +
      `Top strip: the Sun's altitude, from day (pale) through twilight to night (deep blue). ` +
      `Shaded at the bottom: altitudes below ${fmt(floorDeg, 1)}° (airmass over ${fmt(constraints.maxAirmass, 1)}); ` +
      'each altitude tick gives its airmass X.',
    spec,
    columns: VISIT_COLUMNS,
    rows: visits.map((v) => visitRow(v, zone)),
  };
}
