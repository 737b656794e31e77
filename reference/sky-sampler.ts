// The slow reference for visibility windows (tests and bench only): astronomy-engine's Horizon every minute.
import { Body, DefineStar, Equator, Horizon, MakeTime, SiderealTime } from 'astronomy-engine';
import { kastenYoungAirmass } from '../src/astro/airmass.js';
import { observerOf } from '../src/astro/bodies.js';
import { properMotionJ2000 } from '../src/astro/position.js';
import { pressureHpaAtElevation } from '../src/astro/pressure.js';
import { apparentAltitudeDeg } from '../src/astro/refraction.js';
import { julianYearsSinceJ2000 } from '../src/astro/time-scales.js';
import { angleBetweenDeg, type Vec3 } from '../src/astro/vectors.js';
import type { Constraints, Night, Site, Target, Window } from '../src/model.js';
import { maskAltitudeDeg } from '../src/sky/horizon-mask.js';
import { requiredMoonSeparationDeg } from '../src/sky/moon-track.js';
import { MOON_UP_ALTITUDE_DEG } from '../src/sky/nights.js';

export interface ReferenceWindow {
  targetId: string;
  localDate: string;
  /** First and last whole-minute sample (from the dark start) at which every limit holds. */
  start: Date;
  end: Date;
}

const STEP_MS = 60_000;

/**
 * Windows of each target in one night by brute force: at every minute of the dark span, the star
 * (astronomy-engine DefineStar with proper motion carried to that minute; Equator of date with
 * aberration; Horizon without refraction, then refraction at the site's pressure), the Moon (topocentric Equator and Horizon) and the
 * sidereal time are computed afresh, and each limit is tested; runs of passing minutes are the
 * windows. No window-length filter. Independent of the fast engine except for the shared
 * definitions (airmass formula, refraction, mask interpolation, Moon rule).
 */
export function referenceWindows(site: Site, targets: Target[], night: Night, constraints: Constraints): ReferenceWindow[] {
  if (!night.darkStart || !night.darkEnd) return [];
  const observer = observerOf(site);
  const pressureHpa = pressureHpaAtElevation(site.elevationM);
  const times: Date[] = [];
  for (let t = night.darkStart.getTime(); t <= night.darkEnd.getTime(); t += STEP_MS) times.push(new Date(t));
  const moonLimitDeg = requiredMoonSeparationDeg(constraints.moonSeparationDeg, night.moon.illumination);
  const moon = times.map((date) => {
    const eq = Equator(Body.Moon, MakeTime(date), observer, true, true);
    const up = Horizon(MakeTime(date), observer, eq.ra, eq.dec).altitude > MOON_UP_ALTITUDE_DEG;
    const r = Math.hypot(eq.vec.x, eq.vec.y, eq.vec.z);
    return { up, vector: [eq.vec.x / r, eq.vec.y / r, eq.vec.z / r] as Vec3 };
  });
  const out: ReferenceWindow[] = [];
  for (const target of targets) {
    let runStart: Date | null = null;
    let last: Date | null = null;
    times.forEach((date, i) => {
      const time = MakeTime(date);
      const j2000 = properMotionJ2000(target, 2000 + julianYearsSinceJ2000(date));
      DefineStar(Body.Star1, j2000.raDeg / 15, j2000.decDeg, 1000);
      const eq = Equator(Body.Star1, time, observer, true, true);
      const geometric = Horizon(time, observer, eq.ra, eq.dec);
      const hor = { altitude: apparentAltitudeDeg(geometric.altitude, pressureHpa), azimuth: geometric.azimuth };
      const haHours = ((((SiderealTime(time) + site.longitudeDeg / 15 - eq.ra) % 24) + 36) % 24) - 12;
      const r = Math.hypot(eq.vec.x, eq.vec.y, eq.vec.z);
      const vector: Vec3 = [eq.vec.x / r, eq.vec.y / r, eq.vec.z / r];
      const ok =
        hor.altitude >= site.minAltitudeDeg &&
        kastenYoungAirmass(hor.altitude) <= constraints.maxAirmass &&
        (!site.horizon || hor.altitude >= maskAltitudeDeg(site.horizon, hor.azimuth)) &&
        (!site.hourAngleLimitsHours || (haHours >= site.hourAngleLimitsHours.east && haHours <= site.hourAngleLimitsHours.west)) &&
        (!(moonLimitDeg > 0) || !moon[i]!.up || angleBetweenDeg(vector, moon[i]!.vector) >= moonLimitDeg);
      if (ok) {
        runStart ??= date;
        last = date;
      } else if (runStart) {
        out.push({ targetId: target.id, localDate: night.localDate, start: runStart, end: last! });
        runStart = null;
      }
    });
    if (runStart) out.push({ targetId: target.id, localDate: night.localDate, start: runStart, end: last! });
  }
  return out;
}

/** How far fast windows are from the reference: worst edge difference, and pieces only one side found. */
export interface WindowComparison {
  matched: number;
  maxEdgeErrorMin: number;
  /** Pieces found by one side only, each counted as an edge error equal to its length. */
  unmatched: { side: 'fast' | 'reference'; targetId: string; localDate: string; minutes: number }[];
}

/**
 * Pairs fast windows with reference windows of the same target and night that overlap (or lie
 * within `slackMin` of each other) and reports the largest edge difference in minutes.
 */
export function compareWithReference(fast: Window[], reference: ReferenceWindow[], slackMin = 2.5): WindowComparison {
  const key = (w: { targetId: string; localDate: string }) => `${w.localDate} ${w.targetId}`;
  const byKey = new Map<string, { fast: Window[]; reference: ReferenceWindow[] }>();
  const group = (k: string) => byKey.get(k) ?? byKey.set(k, { fast: [], reference: [] }).get(k)!;
  for (const w of fast) group(key(w)).fast.push(w);
  for (const w of reference) group(key(w)).reference.push(w);
  const slackMs = slackMin * 60_000;
  const result: WindowComparison = { matched: 0, maxEdgeErrorMin: 0, unmatched: [] };
  const minutes = (w: { start: Date; end: Date }) => (w.end.getTime() - w.start.getTime()) / 60_000;
  for (const { fast: f, reference: r } of byKey.values()) {
    const used = new Set<Window>();
    for (const ref of r) {
      const partner = f.find((w) => !used.has(w) && w.start.getTime() <= ref.end.getTime() + slackMs && w.end.getTime() >= ref.start.getTime() - slackMs);
      if (!partner) {
        result.unmatched.push({ side: 'reference', targetId: ref.targetId, localDate: ref.localDate, minutes: minutes(ref) });
        result.maxEdgeErrorMin = Math.max(result.maxEdgeErrorMin, minutes(ref) + 1);
        continue;
      }
      used.add(partner);
      result.matched++;
      const errMin = Math.max(Math.abs(partner.start.getTime() - ref.start.getTime()), Math.abs(partner.end.getTime() - ref.end.getTime())) / 60_000;
      result.maxEdgeErrorMin = Math.max(result.maxEdgeErrorMin, errMin);
    }
    for (const w of f.filter((x) => !used.has(x))) {
      result.unmatched.push({ side: 'fast', targetId: w.targetId, localDate: w.localDate, minutes: minutes(w) });
      result.maxEdgeErrorMin = Math.max(result.maxEdgeErrorMin, minutes(w));
    }
  }
  return result;
}
