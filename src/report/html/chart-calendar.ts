import type { TopLevelSpec } from 'vega-lite';
import type { Plan } from '../../plan/plan-schema.js';
import { OKABE_ITO, ACCENT_PALE, CAUTION_PALE, MUTED } from './palette.js';
import { calendarTicks } from './calendar-ticks.js';
import type { ChartFigure } from './figure.js';

const DAY_MS = 86_400_000;
/** A night's evening date as a point on a UTC day axis (the axis shows dates, not instants). */
const dayMs = (localDate: string) => Date.parse(`${localDate}T00:00:00Z`);

/** Every evening from the window's start to its end, plus any night the plan holds outside it. */
function calendarDates(plan: Plan): string[] {
  const dates = new Set<string>(plan.nights.map((n) => n.localDate));
  for (let t = dayMs(plan.campaign.window.start); t <= dayMs(plan.campaign.window.end); t += DAY_MS) {
    dates.add(new Date(t).toISOString().slice(0, 10));
  }
  for (const v of plan.visits) dates.add(v.localDate);
  return [...dates].sort();
}

/**
 * The campaign calendar: nights across, targets down, one symbol per planned visit, planned and
 * backup nights as differently filled columns, the Moon's illuminated fraction along the top.
 */
export function calendarFigure(plan: Plan): ChartFigure {
  const dates = calendarDates(plan);
  const targetIds = [...new Set(plan.campaign.targets.map((t) => t.starId))];
  const backupRank = new Map(plan.backups.map((b) => [b.localDate, b.rank]));
  const column = (d: string, status: string) => ({ night: dayMs(d), nightEnd: dayMs(d) + DAY_MS, status });
  const planned = plan.plannedDates.map((d) => column(d, 'planned night'));
  const backups = plan.backups.map((b) => column(b.localDate, 'backup night'));
  const visits = plan.visits.map((v) => ({ night: dayMs(v.localDate) + DAY_MS / 2, target: v.starId, date: v.localDate }));
  const moon = plan.nights.map((n) => ({ night: dayMs(n.localDate), nightEnd: dayMs(n.localDate) + DAY_MS, moonPct: n.moon.illumination * 100 }));
  const domain = [dayMs(dates[0]!), dayMs(dates[dates.length - 1]!) + DAY_MS];
  const width = Math.min(900, Math.max(480, dates.length * 9));
  // Quantitative ms on a UTC day axis: week or month ticks, labelled with utcFormat and the year.
  const ticks = calendarTicks(domain[0]!, domain[1]!, width);
  const x = { field: 'night', type: 'quantitative' as const, scale: { domain, nice: false, zero: false } };
  /** Planned and backup nights: columns filled and outlined differently (backups dashed), one shared legend. */
  const nightColumns = (name: string, values: object[], stroke: string, strokeDash: number[]) => ({
    data: { values },
    name,
    mark: { type: 'rect', stroke, strokeDash, strokeWidth: 1 },
    encoding: {
      x,
      x2: { field: 'nightEnd' },
      color: {
        field: 'status',
        type: 'nominal',
        title: null,
        scale: { domain: ['planned night', 'backup night'], range: [ACCENT_PALE, CAUTION_PALE] },
        legend: { orient: 'bottom', direction: 'horizontal', symbolType: 'square', symbolStrokeColor: MUTED, symbolStrokeWidth: 1 },
      },
    },
  });

  const spec = {
    vconcat: [
      {
        width,
        height: 46,
        data: { values: moon },
        name: 'moon_bars',
        mark: { type: 'rect', color: MUTED, opacity: 0.55 },
        encoding: {
          x: { ...x, axis: null },
          x2: { field: 'nightEnd' },
          y: { field: 'moonPct', type: 'quantitative', title: 'Moon (%)', scale: { domain: [0, 100] }, axis: { values: [0, 50, 100], titleFontSize: 10 } },
        },
      },
      {
        width,
        height: Math.max(60, targetIds.length * 22),
        layer: [
          nightColumns('planned_nights', planned, OKABE_ITO.blue, [1, 0]),
          nightColumns('backup_nights', backups, OKABE_ITO.orange, [3, 2]),
          {
            data: { values: visits },
            name: 'calendar_visits',
            mark: { type: 'point', shape: 'circle', filled: true, size: 60, color: OKABE_ITO.blue, opacity: 1 },
            encoding: {
              x: {
                ...x,
                title: 'Night (local date of the evening)',
                axis: { values: ticks.values, labelExpr: `utcFormat(datum.value, '${ticks.format}')`, labelAngle: 0, labelOverlap: false },
              },
              y: { field: 'target', type: 'nominal', title: 'Target', scale: { domain: targetIds }, axis: { grid: true } },
            },
          },
        ],
      },
    ],
    spacing: 6,
  } as unknown as TopLevelSpec;

  const visitsOn = (d: string) => plan.visits.filter((v) => v.localDate === d).map((v) => v.starId);
  const moonOf = (d: string) => plan.nights.find((n) => n.localDate === d)?.moon.illumination;
  const plannedSet = new Set(plan.plannedDates);
  const listed = dates.filter((d) => plannedSet.has(d) || backupRank.has(d));
  return {
    id: 'calendar',
    kind: 'calendar',
    title: 'Campaign calendar',
    caption:
      `Each dot is one planned visit (${plan.visits.length} in all). Blue columns are the ${plan.plannedDates.length} planned nights; ` +
      `dashed orange columns the ${plan.backups.length} backup nights, to use if a planned night is lost. ` +
      'The grey bars on top show the fraction of the Moon that is lit.',
    spec,
    columns: [{ header: 'night' }, { header: 'status' }, { header: 'Moon lit (%)', align: 'right' }, { header: 'visits' }],
    rows: listed.map((d) => {
      const illum = moonOf(d);
      return [
        d,
        plannedSet.has(d) ? 'planned' : `backup ${backupRank.get(d)}`,
        illum === undefined ? '-' : String(Math.round(illum * 100)),
        visitsOn(d).join(', ') || '-',
      ];
    }),
  };
}
