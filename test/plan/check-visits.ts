// Properties every plan must have, checked against the slow one-minute reference sampler rather
// than the windows the plan was built from: each visit block (acquisition + exposure + readout)
// inside a reference window of its target and inside the night's dark span; no two blocks of a
// night overlapping; spacing between visits of one target and its visits a night; the time model's budget.
//
// Tolerance: the reference's one-minute grid plus the fast engine's measured 1.06 min give 2 min in
// time; and the reference runs with every angular limit relaxed by ANGLE_SLACK_DEG, for edges where
// a limit is met at a grazing angle (the Moon distance near its minimum, a star near culmination at
// the altitude floor), where a few arcseconds of unmodelled aberration move the edge by minutes.
import { DateTime } from 'luxon';
import { altitudeForAirmassDeg, kastenYoungAirmass } from '../../src/astro/airmass.js';
import type { Constraints, Site, Window } from '../../src/model.js';
import type { Plan, PlannedVisit } from '../../src/plan/plan-schema.js';
import { referenceWindows } from '../../reference/sky-sampler.js';
import { computeWindows } from '../../src/sky/visibility.js';

/** The reference's tolerance: its one-minute grid (up to 1 min) plus the fast engine's measured 1.06 min (DEVELOPERS.md, sky engine). */
export const REFERENCE_TOLERANCE_MIN = 2;
const TOL_MS = REFERENCE_TOLERANCE_MIN * 60_000;
/** About 3.5 times the largest unmodelled effect, annual aberration (20.5 arcsec; DEVELOPERS.md, sky engine). */
export const ANGLE_SLACK_DEG = 0.02;

/** Site and constraints with the altitude floor, the airmass limit, the mask and the Moon distance all eased by the slack. */
function relaxed(site: Site, constraints: Constraints): { site: Site; constraints: Constraints } {
  return {
    site: {
      ...site,
      minAltitudeDeg: site.minAltitudeDeg - ANGLE_SLACK_DEG,
      horizon: site.horizon?.map((p) => ({ ...p, altitudeDeg: p.altitudeDeg - ANGLE_SLACK_DEG })),
    },
    constraints: {
      ...constraints,
      maxAirmass: kastenYoungAirmass(altitudeForAirmassDeg(constraints.maxAirmass) - ANGLE_SLACK_DEG),
      // The Moon rule scales the limit by 0.5 to 1, so twice the slack here is one to two slacks on the sky.
      moonSeparationDeg: Math.max(0, constraints.moonSeparationDeg - 2 * ANGLE_SLACK_DEG),
    },
  };
}

export interface VisitCheck {
  violations: string[];
  visits: number;
  /** Largest amount (minutes) by which a visit block reaches outside its (relaxed) reference window. */
  maxOutsideReferenceMin: number;
  /** Largest edge difference (minutes) between a fast window holding a visit and its reference window (limits as given). */
  maxWindowEdgeErrorMin: number;
}

interface Span {
  startMs: number;
  endMs: number;
}

const startMs = (v: PlannedVisit) => Date.parse(v.startUtc);
const endMs = (v: PlannedVisit) => startMs(v) + v.durationSec * 1000;

/** Reference pieces of one target in one night, joined across gaps no longer than the tolerance (one-minute flickers at a limit). */
function joined(pieces: Span[]): Span[] {
  const out: Span[] = [];
  for (const p of [...pieces].sort((a, b) => a.startMs - b.startMs)) {
    const last = out[out.length - 1];
    if (last && p.startMs - last.endMs <= TOL_MS) last.endMs = Math.max(last.endMs, p.endMs);
    else out.push({ ...p });
  }
  return out;
}

function groupBy<T>(items: T[], key: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) groups.set(key(item), [...(groups.get(key(item)) ?? []), item]);
  return groups;
}

export function checkVisits(plan: Plan): VisitCheck {
  const { site, constraints, instrument, time } = plan.campaign;
  const violations: string[] = [];
  const check: VisitCheck = { violations, visits: plan.visits.length, maxOutsideReferenceMin: 0, maxWindowEdgeErrorMin: 0 };
  const nightOf = new Map(plan.nights.map((n) => [n.localDate, n]));
  const byNight = groupBy(plan.visits, (v) => v.localDate);

  for (const [localDate, visits] of byNight) {
    const night = nightOf.get(localDate);
    if (!night?.darkStart || !night.darkEnd) {
      violations.push(`${localDate}: visits on a night without a dark span`);
      continue;
    }
    // One sky target per star (its first row carries the star fields), named by the star.
    const stars = new Map(plan.campaign.targets.map((t) => [t.starId, t] as const).reverse());
    const targets = [...stars.values()].filter((t) => visits.some((v) => v.starId === t.starId)).map((t) => ({ ...t, id: t.starId }));
    const spans = (windows: { targetId: string; start: Date; end: Date }[], id: string) =>
      joined(windows.filter((w) => w.targetId === id).map((w) => ({ startMs: w.start.getTime(), endMs: w.end.getTime() })));
    const eased = relaxed(site, constraints);
    const easedPieces = referenceWindows(eased.site, targets, night, eased.constraints);
    const exactPieces = referenceWindows(site, targets, night, constraints);
    const reference = new Map(targets.map((t) => [t.id, spans(easedPieces, t.id)]));
    const exact = new Map(targets.map((t) => [t.id, spans(exactPieces, t.id)]));
    const fast = groupBy(computeWindows(site, targets, [night], constraints).windows, (w) => w.targetId);
    for (const v of visits) {
      const label = `${v.starId} ${v.startUtc}`;
      if (v.durationSec !== v.exposureSec + instrument.acquisitionSec + instrument.readoutSec)
        violations.push(`${label}: block is not acquisition + exposure + readout`);
      if (
        DateTime.fromISO(v.startLocal).toMillis() !== startMs(v) ||
        DateTime.fromISO(v.startLocal, { setZone: true }).offset !== DateTime.fromMillis(startMs(v), { zone: site.timeZone }).offset
      ) {
        violations.push(`${label}: local start ${v.startLocal} is not the same instant in ${site.timeZone}`);
      }
      if (startMs(v) < night.darkStart.getTime() || endMs(v) > night.darkEnd.getTime()) violations.push(`${label}: outside the dark span`);
      check.maxOutsideReferenceMin = Math.max(check.maxOutsideReferenceMin, outsideReferenceMin(v, reference.get(v.starId) ?? [], violations));
      check.maxWindowEdgeErrorMin = Math.max(check.maxWindowEdgeErrorMin, windowEdgeErrorMin(v, fast.get(v.starId) ?? [], exact.get(v.starId) ?? []));
    }
    const ordered = [...visits].sort((a, b) => startMs(a) - startMs(b));
    for (let i = 1; i < ordered.length; i++) {
      if (startMs(ordered[i]!) < endMs(ordered[i - 1]!)) violations.push(`${localDate}: ${ordered[i - 1]!.starId} and ${ordered[i]!.starId} overlap`);
    }
  }

  // Spacing of every pair of one star's visits: sameNightSpacingHours on one evening when visits go
  // by nights (minSpacingHours >= 12), minSpacingHours otherwise; and at most visitsPerNight an evening.
  const byNights = constraints.minSpacingHours >= 12;
  for (const [starId, visits] of groupBy(plan.visits, (v) => v.starId)) {
    for (const [i, a] of visits.entries()) {
      for (const b of visits.slice(i + 1)) {
        const hours = byNights && a.localDate === b.localDate ? constraints.sameNightSpacingHours : constraints.minSpacingHours;
        if (Math.abs(startMs(a) - startMs(b)) < hours * 3_600_000) violations.push(`${starId}: visits ${a.startUtc} and ${b.startUtc} closer than ${hours} h`);
      }
    }
    const cap = plan.campaign.targets.find((t) => t.starId === starId)?.visitsPerNight ?? 1;
    if (byNights)
      for (const [date, evening] of groupBy(visits, (v) => v.localDate))
        if (evening.length > cap) violations.push(`${starId}: ${evening.length} visits on ${date}, at most ${cap}`);
  }

  const dates = new Set(plan.visits.map((v) => v.localDate));
  if (time.mode === 'choose-nights' && dates.size > time.nights) violations.push(`visits on ${dates.size} nights, more than ${time.nights}`);
  if (time.mode === 'given-nights') for (const d of dates) if (!time.dates.includes(d)) violations.push(`visit on ${d}, not a given night`);
  const hours = plan.visits.reduce((sum, v) => sum + v.durationSec, 0) / 3600;
  if (time.mode === 'hours' && hours > time.hours + 1e-9) violations.push(`${hours} h of visits, more than ${time.hours}`);
  return check;
}

/** Minutes by which the visit block reaches outside the joined reference window that holds its start; a violation beyond the tolerance. */
function outsideReferenceMin(v: PlannedVisit, windows: Span[], violations: string[]): number {
  const home = windows.find((w) => startMs(v) >= w.startMs - TOL_MS && startMs(v) <= w.endMs + TOL_MS);
  if (!home) {
    violations.push(`${v.starId} ${v.startUtc}: no reference window at its start`);
    return Infinity;
  }
  const outsideMin = Math.max(0, home.startMs - startMs(v), endMs(v) - home.endMs) / 60_000;
  if (outsideMin > REFERENCE_TOLERANCE_MIN) violations.push(`${v.starId} ${v.startUtc}: ${outsideMin.toFixed(2)} min outside the reference window`);
  return outsideMin;
}

/** Edge difference (minutes) between the fast window holding the visit and the reference piece overlapping it most. */
function windowEdgeErrorMin(v: PlannedVisit, fast: Window[], pieces: Span[]): number {
  const w = fast.find((x) => x.start.getTime() <= startMs(v) && endMs(v) <= x.end.getTime());
  if (!w) return Infinity;
  const overlap = (p: Span) => Math.min(p.endMs, w.end.getTime()) - Math.max(p.startMs, w.start.getTime());
  const best = [...pieces].sort((a, b) => overlap(b) - overlap(a))[0];
  if (!best) return Infinity;
  return Math.max(Math.abs(best.startMs - w.start.getTime()), Math.abs(best.endMs - w.end.getTime())) / 60_000;
}
