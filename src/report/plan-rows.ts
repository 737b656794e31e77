import { DateTime } from 'luxon';
import type { Plan, PlannedVisit, TargetSummary } from '../plan/plan-schema.js';
import { darkMiddleMs } from '../plan/half-nights.js';
import { clockTime } from '../sky/local-time.js';
import { fmt, percent, type Column } from './table.js';

/** Clock time of an instant (ISO text or Date) in a zone, e.g. `23:41`; a dash for null. */
export function clock(instant: string | Date | null, zone: string): string {
  return clockTime(typeof instant === 'string' ? new Date(instant) : instant, zone);
}

/**
 * Each planet's predicted phase at a visit: `0.252±0.004` for one planet, `b 0.252±0.004; c 0.710±0.020` for several;
 * with digits other than 3 (plan.csv) `id=phase±error; ...`.
 */
export function phasesText(visit: PlannedVisit, digits = 3): string {
  if (visit.phases.length === 0) return digits === 3 ? '-' : '';
  const one = (p: { phase: number; phaseErr: number }) => `${p.phase.toFixed(digits)}±${p.phaseErr.toFixed(digits)}`;
  if (digits !== 3) return visit.phases.map((p) => `${p.targetId}=${one(p)}`).join('; ');
  // A planet named after its star (`SELVA-102 b`) is shown by its letter alone.
  const name = (id: string) => (id.startsWith(`${visit.starId} `) ? id.slice(visit.starId.length + 1) : id);
  return visit.phases.length === 1 ? one(visit.phases[0]!) : visit.phases.map((p) => `${name(p.targetId)} ${one(p)}`).join('; ');
}

export const VISIT_COLUMNS: Column[] = [
  { header: 'local' },
  { header: 'UTC' },
  { header: 'star' },
  { header: 'exp (s)', align: 'right' },
  { header: 'airmass', align: 'right' },
  { header: 'phase', align: 'right' },
  { header: 'sigma (m/s)', align: 'right' },
  { header: 'S/N', align: 'right' },
];

export function visitRow(visit: PlannedVisit, zone: string): string[] {
  return [
    clock(visit.startUtc, zone),
    clock(visit.startUtc, 'UTC'),
    visit.kept ? `${visit.starId} (kept)` : visit.spare ? `${visit.starId} (spare)` : visit.starId,
    fmt(visit.exposureSec, 0),
    fmt(visit.airmass, 2),
    phasesText(visit),
    fmt(visit.effectiveSigmaMps, 2),
    fmt(visit.snrPerPixel, 0),
  ];
}

/** One heading line per planned night: date, dark span in local time, Moon. */
export function nightHeading(plan: Plan, localDate: string): string {
  const zone = plan.campaign.site.timeZone;
  const night = plan.nights.find((n) => n.localDate === localDate);
  const weekday = DateTime.fromISO(localDate).toFormat('ccc');
  if (!night) return `${localDate} ${weekday}`;
  if (!night.darkStart || !night.darkEnd) return `${localDate} ${weekday}  no dark span${night.note ? ` (${night.note})` : ''}`;
  const moon = `Moon ${percent(night.moon.illumination)}${night.moon.upDuringDark ? ' (up)' : ' (down)'}`;
  const plannedHours = plan.visits.filter((v) => v.localDate === localDate).reduce((sum, v) => sum + v.durationSec, 0) / 3600;
  const half = plan.plannedHalves?.find((h) => h.localDate === localDate)?.half;
  const middle = new Date(darkMiddleMs(night));
  const [from, to, hours] =
    half === 'first'
      ? [night.darkStart, middle, night.darkHours / 2]
      : half === 'second'
        ? [middle, night.darkEnd, night.darkHours / 2]
        : [night.darkStart, night.darkEnd, night.darkHours];
  const span = `${half ? `${half} half, ` : ''}dark ${clock(from, zone)}-${clock(to, zone)} local`;
  const dark = `${span} (${fmt(hours, 1)} h, ${fmt(plannedHours, 1)} h planned)`;
  return `${localDate} ${weekday}  ${dark}, ${moon}`;
}

const TARGET_COLUMNS: Column[] = [
  { header: 'target' },
  { header: 'kind' },
  { header: 'K (m/s)', align: 'right' },
  { header: 'visits', align: 'right' },
  { header: 'needed', align: 'right' },
  { header: 'sigma_K (m/s)', align: 'right' },
  { header: 'K/sigma_K', align: 'right' },
  { header: 'goal', align: 'right' },
  { header: 'P(goal)', align: 'right' },
  { header: 'efficiency', align: 'right' },
  { header: 'hours', align: 'right' },
];

/** A search's expected detection completeness at its search mass (src/schedule/objective-search.ts). */
const COMPLETENESS_COLUMN: Column = { header: 'completeness', align: 'right' };

/** Columns for what was done before the plan: visits made or kept, and the K/sigma_K (a search: completeness) they give. */
const DONE_COLUMNS: Column[] = [
  { header: 'done', align: 'right' },
  { header: 'K/sigma_K done', align: 'right' },
];

/** A plan made with visits already done (observed or kept) shows them beside the visits ahead. */
const showsDone = (plan: Plan) => plan.replan !== undefined || plan.observed !== undefined;

const hasSearch = (plan: Plan) => plan.targets.some((t) => t.kind === 'search');

/** The target table's columns: `visits` counts the visits ahead; `done` those already made or kept; `completeness` when a search is planned. */
export function targetColumns(plan: Plan): Column[] {
  // The completeness column follows K/sigma_K, as in targetRows.
  const at = TARGET_COLUMNS.findIndex((c) => c.header === 'K/sigma_K') + 1;
  const columns = hasSearch(plan) ? [...TARGET_COLUMNS.slice(0, at), COMPLETENESS_COLUMN, ...TARGET_COLUMNS.slice(at)] : TARGET_COLUMNS;
  return showsDone(plan) ? [...columns.slice(0, 3), ...DONE_COLUMNS, ...columns.slice(3)] : columns;
}

export function targetRows(plan: Plan): string[][] {
  const search = hasSearch(plan);
  return plan.targets.map((t) => {
    const row = [
      t.targetId,
      t.kind,
      fmt(t.kMps, 2),
      String(t.visits),
      neededText(t),
      fmt(t.sigmaKMps, 2),
      fmt(t.kOverSigmaK, 1),
      ...(search ? [fmt(t.completeness, 2)] : []),
      t.goalCompleteness !== undefined ? fmt(t.goalCompleteness, 2) : fmt(t.goalSignificance, 1),
      percent(t.goalProbability),
      fmt(t.informationEfficiency, 2),
      fmt(t.hours, 1),
    ];
    if (!showsDone(plan)) return row;
    const done = t.priorCompleteness !== undefined ? fmt(t.priorCompleteness, 2) : fmt(t.priorKOverSigmaK, 1);
    return [...row.slice(0, 3), String(t.priorVisits ?? 0), done, ...row.slice(3)];
  });
}

/** What a search row's K and completeness mean (see quotedK in src/plan/build-plan.ts); undefined without search rows. */
function searchKNote(plan: Plan): string | undefined {
  const rows = plan.targets.filter((t) => t.kind === 'search' && t.kPeriodDays !== undefined);
  if (!rows.length) return undefined;
  const periods = rows.map((t) => `${t.targetId} ${fmt(t.kPeriodDays, 1)} d`).join(', ');
  return (
    `Search rows: K of the search mass at the logarithmic middle of the period range (${periods}), the geometric mean of K over the range; ` +
    'completeness is the expected fraction of planets of the search mass (period log-uniform over the range, circular, random phase) ' +
    'that a periodogram of the planned visits detects at 1% false-alarm probability (analytic, clear weather); ' +
    'its goal is in the goal column; search rows have no sigma_K.'
  );
}

/** Visits grouped by night, nights in date order, visits in time order. */
export function visitsByNight(plan: Plan): [string, PlannedVisit[]][] {
  const groups = new Map<string, PlannedVisit[]>();
  for (const date of [...plan.plannedDates].sort()) groups.set(date, []);
  for (const visit of plan.visits) {
    if (!groups.has(visit.localDate)) groups.set(visit.localDate, []);
    groups.get(visit.localDate)!.push(visit);
  }
  for (const visits of groups.values()) visits.sort((a, b) => a.startUtc.localeCompare(b.startUtc));
  return [...groups.entries()].sort((a, b) => a[0].localeCompare(b[0]));
}

/** A target's visits needed for its goal at the campaign's probability: `11`, `>14` when all its planned visits fall short, `-` without a goal. */
export function neededText(t: TargetSummary): string {
  if (!t.request) return '-';
  return t.request.reachable ? String(t.request.neededVisits) : `>${t.request.neededVisits}`;
}

/** The time request from need in one line; undefined for plans without it. */
export function requestLine(plan: Plan): string | undefined {
  const r = plan.totals.request;
  if (!r) return undefined;
  const n = r.halfNights.length;
  const half = n ? ` (${n === 1 ? 'one could be a half night' : `${n} of them could be half nights`})` : '';
  const dark = plan.totals.darkHours !== undefined ? `; ${fmt(r.spareHours, 1)} of their ${fmt(plan.totals.darkHours, 1)} dark hours are spare` : '';
  return (
    `Request from need (each goal with ${percent(r.probability)} probability under the weather): ` +
    `${r.visits} of the ${plan.visits.filter((v) => !v.kept).length} visits, ${fmt(r.hours, 1)} h on ${nightCount(r.nights)} nights${half}${dark}`
  );
}

/** The notes under a target table: what `needed` counts, and what a search row's K means. */
export function targetNotes(plan: Plan): string[] {
  const r = plan.totals.request;
  const needed = r
    ? `needed: the fewest planned visits of the star that reach the goal with ${percent(r.probability)} probability under the weather; ` +
      '">N": all N planned visits fall short.'
    : undefined;
  const margin = plan.totals.weatherMargin;
  const weather =
    r && margin !== undefined && margin > 0
      ? `The planner values up to ${percent(margin)} above each goal: the margin that ${percent(r.probability)} odds under the site's weather ask for.`
      : undefined;
  return [needed, weather, searchKNote(plan)].filter((note): note is string => note !== undefined);
}

/** A count of nights: whole, or to the half night. */
export const nightCount = (nights: number) => fmt(nights, Number.isInteger(nights) ? 0 : 1);

/** "14 nights", or with half nights planned "10 nights (20 dates, 20 of them half nights)". */
export function nightsText(plan: Plan): string {
  const halves = plan.plannedHalves?.length ?? 0;
  const nights = `${nightCount(plan.totals.nights)} nights`;
  return halves ? `${nights} (${plan.plannedDates.length} dates, ${halves} of them half nights)` : nights;
}

export function totalsLine(plan: Plan): string {
  const t = plan.totals;
  const hours = `${fmt(t.exposureHours, 1)} h exposure + ${fmt(t.overheadHours, 1)} h overheads = ${fmt(t.totalHours, 1)} h`;
  return `${t.visits} visits on ${nightsText(plan)}: ${hours}`;
}

export const ADVISORY =
  "This plan is advisory. The observatory's own safety rules (Sun avoidance, wind, humidity, dome and telescope limits) always take precedence.";

/** What the plan started from, when it was re-planned or given visits already made; undefined otherwise. */
export function historyLine(plan: Plan): string | undefined {
  if (!showsDone(plan)) return undefined;
  const kept = plan.visits.filter((v) => v.kept).length;
  const parts = [
    plan.replan ? `Re-planned from ${plan.replan.nowUtc}: ${kept} earlier visit${kept === 1 ? '' : 's'} kept as planned` : undefined,
    plan.observed
      ? `${plan.observed.length} visit${plan.observed.length === 1 ? '' : 's'} already made (${plan.campaign.observed?.file ?? 'observed file'})`
      : undefined,
    plan.campaign.lostDates.length ? `lost nights ${plan.campaign.lostDates.join(', ')}` : undefined,
  ];
  return `${parts.filter((p) => p !== undefined).join('; ')}.`;
}

export const OBSERVED_COLUMNS: Column[] = [
  { header: 'night' },
  { header: 'UTC' },
  { header: 'target' },
  { header: 'instrument' },
  { header: 'RV (m/s)', align: 'right' },
  { header: 'error (m/s)', align: 'right' },
];

export function observedRows(plan: Plan): string[][] {
  return (plan.observed ?? []).map((v) => [v.localDate, v.midUtc.slice(11, 16), v.targetId, v.instrument, fmt(v.rvMps, 2), fmt(v.rvErrorMps, 2)]);
}

/** Signed difference in units of the fitted error, e.g. `+1.8σ`. */
function inSigma(change: number, sigma: number): string {
  return sigma > 0 ? `${change >= 0 ? '+' : ''}${(change / sigma).toFixed(1)}σ` : '';
}

/** A BJD_TDB of an instant given as ms since 1970 (to the day: what a transit epoch needs). */
const bjdOfMs = (ms: number) => ms / 86_400_000 + 2_440_587.5;

/** The transit nearest `bjd` and its 1σ error: Tc + nP, σ² = σ_Tc² + n² σ_P² (linear propagation, common practice). */
function transitNear(e: { tcBjdTdb: number; tcErrDays: number; periodDays: number; periodErrDays: number }, bjd: number): { at: number; errDays: number } {
  const n = Math.round((bjd - e.tcBjdTdb) / e.periodDays);
  return { at: e.tcBjdTdb + n * e.periodDays, errDays: Math.hypot(e.tcErrDays, n * e.periodErrDays) };
}

/**
 * One line per fitted planet and per search peak: what the RVs so far changed, with 1σ errors.
 * The ephemeris is compared where it matters, at the transit nearest the window's middle.
 */
export function rvUpdateLines(plan: Plan): string[] {
  return plan.targets.flatMap((t) => targetRvUpdateLines(plan, t));
}

/** The lines of rvUpdateLines for one target: its fit, its search peak, or nothing. */
export function targetRvUpdateLines(plan: Plan, t: TargetSummary): string[] {
  const { start, end } = plan.campaign.window;
  const middle = bjdOfMs((Date.parse(start) + Date.parse(end)) / 2);
  const out: string[] = [];
  const f = t.fit;
  if (f) {
    const fitted = transitNear(f, middle);
    const catalogue = transitNear(f.catalogue, fitted.at);
    const shiftMin = (fitted.at - catalogue.at) * 1440;
    out.push(
      `${t.targetId} (${f.points} RVs): K ${fmt(f.catalogue.kMps, 2)} -> ${fmt(f.kMps, 2)} ± ${fmt(f.kErrMps, 2)} m/s; ` +
        `transit near the window's middle ${shiftMin >= 0 ? '+' : ''}${fmt(shiftMin, 0)} min ` +
        `(${inSigma(shiftMin, catalogue.errDays * 1440)} of the catalogue), ` +
        `now ± ${fmt(fitted.errDays * 1440, 0)} min (was ± ${fmt(catalogue.errDays * 1440, 0)}); ` +
        `P ${f.catalogue.periodDays.toFixed(6)} -> ${f.periodDays.toFixed(6)} ± ${f.periodErrDays.toExponential(1)} d`,
    );
  }
  const p = t.peak;
  if (p) {
    out.push(
      p.significant
        ? `${t.targetId}: candidate signal in the RVs so far, P = ${fmt(p.periodDays, 3)} d, K = ${fmt(p.kMps, 2)} m/s, ` +
            `false-alarm probability ${p.fap.toExponential(1)}: offered, not adopted (add it as a planet row to plan for it)`
        : `${t.targetId}: no significant peak in the RVs so far (best P = ${fmt(p.periodDays, 3)} d, false-alarm probability ${fmt(p.fap, 2)})`,
    );
  }
  return out;
}
