import type { TopLevelSpec } from 'vega-lite';
import { altitudeForAirmassDeg } from '../../astro/airmass.js';
import type { Night } from '../../model.js';
import type { Plan, PlannedVisit } from '../../plan/plan-schema.js';
import { localNoon } from '../../sky/local-time.js';
import { altitudeDeg, preparePosition, siteClock } from '../../sky/target-position.js';
import { fmt } from '../table.js';
import { nightHeading, VISIT_COLUMNS, visitRow } from '../plan-rows.js';
import type { ChartFigure } from './figure.js';
import { INK, SKY_SHADES } from './palette.js';
import { SKY_STATES, skyBands } from './night-bands.js';
import { targetStyles } from './target-colours.js';

const HOUR_MS = 3_600_000;
const SAMPLE_MS = 5 * 60_000;
/** Airmass values marked on the right-hand axis. */
const AIRMASS_TICKS = [1.0, 1.1, 1.2, 1.5, 2, 3];

/** The span drawn for a night: sunset to sunrise (or the visits) with half an hour either side. */
function chartSpanMs(night: Night | undefined, visits: PlannedVisit[]): [number, number] {
  const starts = visits.map((v) => Date.parse(v.startUtc));
  const ends = visits.map((v) => Date.parse(v.startUtc) + v.durationSec * 1000);
  const from = Math.min(night?.sunset?.getTime() ?? Infinity, night?.darkStart?.getTime() ?? Infinity, ...starts);
  const to = Math.max(night?.sunrise?.getTime() ?? -Infinity, night?.darkEnd?.getTime() ?? -Infinity, ...ends);
  return [from - HOUR_MS / 2, to + HOUR_MS / 2];
}

/**
 * The right-hand airmass axis: ticks at the altitudes where the Kasten & Young airmass takes round
 * values (src/astro/airmass.ts), labelled with those values.
 */
function airmassAxis() {
  const ticks = AIRMASS_TICKS.map((x) => ({ altitudeDeg: altitudeForAirmassDeg(x), label: x.toFixed(1) }));
  const labelExpr = `${ticks.map((t) => `abs(datum.value - ${t.altitudeDeg}) < 1e-6 ? '${t.label}'`).join(' : ')} : ''`;
  return { orient: 'right', title: 'Airmass', values: ticks.map((t) => t.altitudeDeg), labelExpr, grid: false };
}

/**
 * One planned night: each observed target's altitude against local time, the sky's twilight bands
 * behind, the planned visit blocks under the curves, airmass on the right-hand axis.
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
  const ids = [...new Set(visits.map((v) => v.starId))];
  const styles = targetStyles(plan, ids);
  const siteNightClock = siteClock(site, new Date((fromMs + toMs) / 2));
  const curves = ids.flatMap((id) => {
    const target = plan.campaign.targets.find((t) => t.id === id);
    if (!target) return [];
    const p = preparePosition(target, siteNightClock);
    const out: { target: string; hour: number; altitudeDeg: number }[] = [];
    for (let t = fromMs; t <= toMs; t += SAMPLE_MS) out.push({ target: id, hour: hours(t), altitudeDeg: altitudeDeg(p, t) });
    return out;
  });
  const blocks = visits.map((v) => {
    const start = Date.parse(v.startUtc);
    const target = plan.campaign.targets.find((t) => t.starId === v.starId);
    const mid = start + (v.durationSec * 1000) / 2;
    const top = target ? altitudeDeg(preparePosition(target, siteNightClock), mid) : 90;
    return { target: v.starId, start: hours(start), end: hours(start + v.durationSec * 1000), bottom: 0, top: Math.max(0, top) };
  });
  const bands = night ? skyBands(night, fromMs, toMs).map((b) => ({ state: b.state, start: hours(b.startMs), end: hours(b.endMs) })) : [];
  const floorDeg = Math.max(site.minAltitudeDeg, altitudeForAirmassDeg(constraints.maxAirmass));
  const x = {
    field: 'hour',
    type: 'quantitative' as const,
    title: `Local time (${zone})`,
    scale: { domain: [hours(fromMs), hours(toMs)], nice: false },
    axis: { values: hourTicks(hours(fromMs), hours(toMs)), labelExpr: "format(datum.value % 24, '02d') + ':00'" },
  };
  const y = { type: 'quantitative' as const, scale: { domain: [0, 90], nice: false } };
  const targetScale = { domain: ids, range: ids.map((id) => styles.get(id)!.colour) };
  const dashScale = { domain: ids, range: ids.map((id) => styles.get(id)!.dash) };
  const spec = {
    width: 560,
    height: 240,
    layer: [
      {
        data: { values: bands },
        name: 'twilight_bands',
        mark: { type: 'rect' },
        encoding: {
          x: { ...x, field: 'start' },
          x2: { field: 'end' },
          fill: {
            field: 'state',
            type: 'nominal',
            title: 'Sky',
            scale: { domain: [...SKY_STATES], range: SKY_STATES.map(shadeOf) },
            legend: { orient: 'bottom', direction: 'horizontal', columns: 5, labelLimit: 220, symbolStrokeColor: '#8a96a8', symbolStrokeWidth: 0.5 },
          },
        },
      },
      {
        data: { values: [{ floorDeg }] },
        name: 'altitude_floor',
        mark: { type: 'rule', color: INK, strokeDash: [5, 3], strokeWidth: 1 },
        encoding: { y: { ...y, field: 'floorDeg', axis: null } },
      },
      {
        data: { values: blocks },
        name: 'visit_blocks',
        mark: { type: 'rect', opacity: 0.55 },
        encoding: {
          x: { ...x, field: 'start' },
          x2: { field: 'end' },
          y: { ...y, field: 'bottom', axis: null },
          y2: { field: 'top' },
          color: { field: 'target', type: 'nominal', title: 'Target', scale: targetScale },
        },
      },
      {
        data: { values: curves },
        name: 'altitude_lines',
        mark: { type: 'line', strokeWidth: 2, clip: true },
        encoding: {
          x,
          y: { ...y, field: 'altitudeDeg', title: 'Altitude (deg)' },
          color: { field: 'target', type: 'nominal', title: 'Target', scale: targetScale },
          strokeDash: { field: 'target', type: 'nominal', title: 'Target', scale: dashScale },
        },
      },
      {
        data: { values: [{ a: 0 }] },
        mark: { type: 'rule', opacity: 0 },
        encoding: { y: { ...y, field: 'a', axis: airmassAxis() } },
      },
    ],
    resolve: { scale: { y: 'independent' }, axis: { y: 'independent' } },
  } as unknown as TopLevelSpec;
  return {
    id: `night-${localDate}`,
    kind: 'night',
    title: `Night of ${localDate}`,
    caption:
      `${nightHeading(plan, localDate)}. Lines: altitude of each target observed this night; shaded blocks: the ${visits.length} planned visits ` +
      `(exposure plus overheads). Background: daylight, civil, nautical and astronomical twilight, and night. ` +
      `Dashed line: the lowest allowed altitude, ${fmt(floorDeg, 1)}° (airmass ${fmt(constraints.maxAirmass, 1)}).`,
    spec,
    columns: VISIT_COLUMNS,
    rows: visits.map((v) => visitRow(v, zone)),
  };
}

function shadeOf(state: string): string {
  return {
    day: SKY_SHADES.day,
    'civil twilight': SKY_SHADES.civil,
    'nautical twilight': SKY_SHADES.nautical,
    'astronomical twilight': SKY_SHADES.astronomical,
    night: SKY_SHADES.night,
  }[state]!;
}

/** Whole hours inside [from, to], every hour (or every second hour on long nights). */
function hourTicks(from: number, to: number): number[] {
  const step = to - from > 14 ? 2 : 1;
  const ticks: number[] = [];
  for (let h = Math.ceil(from / step) * step; h <= to; h += step) ticks.push(h);
  return ticks;
}
