// Visibility windows: when each target is observable in each night, by closed form and root finding.
import { altitudeForAirmassDeg } from '../astro/airmass.js';
import { DAY_MS, SIDEREAL_PER_SOLAR } from '../astro/constants.js';
import { pressureHpaAtElevation } from '../astro/pressure.js';
import { trueAltitudeDeg } from '../astro/refraction.js';
import type { Constraints, Night, Site, Target, Window } from '../model.js';
import { maskAltitudeDeg } from './horizon-mask.js';
import { intersectSpans, spansWhereNonNegative, subtractSpans, type Span } from './intervals.js';
import { moonSeparationDeg, moonTrack, requiredMoonSeparationDeg, type MoonTrack } from './moon-track.js';
import { airmassAt, altitudeDeg, azimuthDeg, hourAngleDeg, preparePosition, siteClock, type PreparedPosition } from './target-position.js';

const DEG = Math.PI / 180;
/** Hour angle advances 360 x 1.00273790935 deg per day. */
const HA_DEG_PER_MS = (360 * SIDEREAL_PER_SOLAR) / DAY_MS;
/** Sampling steps of the root finders and their tolerance (see DEVELOPERS.md, "Sky engine"). */
const MASK_STEP_MS = 5 * 60_000;
const MOON_STEP_MS = 20 * 60_000;
const EDGE_TOLERANCE_MS = 1000;

/** Why a target has no window in a night, as a kind the plan's warnings can count over nights. */
export type DropCause = 'no dark time' | 'never rises' | 'too low' | 'daylight' | 'hour-angle limits' | 'horizon mask' | 'Moon' | 'short window';

export interface DroppedWindow {
  targetId: string;
  localDate: string;
  cause: DropCause;
  reason: string;
}

type Dropped = Pick<DroppedWindow, 'cause' | 'reason'>;

/** Geometric altitude (deg) below which a star's centre is never seen: refraction at the horizon lifts it by 34′ (Meeus 1998, ch. 16). */
const HORIZON_TRUE_DEG = -34 / 60;

/**
 * A star that never reaches the floor: it never rises, or it culminates below the floor. The
 * culmination altitude is 90° − |φ − δ| (geometric; Meeus 1998, ch. 13).
 */
function belowFloor(p: PreparedPosition, limits: Limits): Dropped {
  const culminationDeg = 90 - Math.abs(p.clock.latitudeDeg - p.decDeg);
  if (culminationDeg < HORIZON_TRUE_DEG)
    return { cause: 'never rises', reason: `never rises at this site (culminates ${Math.abs(culminationDeg).toFixed(1)} deg below the horizon)` };
  return { cause: 'too low', reason: `culminates at ${culminationDeg.toFixed(1)} deg, never above ${limits.floorText}` };
}

/** What stays fixed for a whole call: the altitude floor from the site and the airmass limit. */
interface Limits {
  floorApparentDeg: number;
  floorTrueDeg: number;
  floorText: string;
}

function limitsOf(site: Site, constraints: Constraints): Limits {
  const airmassFloorDeg = altitudeForAirmassDeg(constraints.maxAirmass);
  const floorApparentDeg = Math.max(site.minAltitudeDeg, airmassFloorDeg);
  const floorText = `${floorApparentDeg.toFixed(1)} deg (site minimum ${site.minAltitudeDeg} deg, airmass ${constraints.maxAirmass})`;
  return { floorApparentDeg, floorTrueDeg: trueAltitudeDeg(floorApparentDeg, pressureHpaAtElevation(site.elevationM)), floorText };
}

/**
 * The times in `dark` when the hour angle lies in [loDeg, hiDeg] (-180 <= lo < hi <= 180):
 * the hour angle grows linearly with time, so each turn gives one interval.
 */
function hourAngleSpans(p: PreparedPosition, loDeg: number, hiDeg: number, dark: Span): Span[] {
  if (hiDeg - loDeg >= 360) return [dark];
  const [start, end] = dark;
  const haStartDeg = hourAngleDeg(p, start);
  const out: Span[] = [];
  for (let k = Math.floor((haStartDeg - hiDeg) / 360); ; k++) {
    const a = start + (loDeg + 360 * k - haStartDeg) / HA_DEG_PER_MS;
    const b = start + (hiDeg + 360 * k - haStartDeg) / HA_DEG_PER_MS;
    if (a >= end) break;
    if (b > start) out.push([Math.max(a, start), Math.min(b, end)]);
  }
  return out;
}

/**
 * Hour-angle half-width (deg) above a geometric altitude: cos H0 = (sin h - sin phi sin delta) /
 * (cos phi cos delta) (Meeus 1998, eq. 15.1); null when the star never gets that high, 180 when
 * it never sets below it.
 */
function halfArcDeg(p: PreparedPosition, altitudeDeg: number): number | null {
  const c = p.clock;
  const cosH0 = (Math.sin(altitudeDeg * DEG) - c.sinLat * p.sinDec) / (c.cosLat * p.cosDec);
  if (cosH0 > 1) return null;
  if (cosH0 < -1 || !Number.isFinite(cosH0)) return 180;
  return Math.acos(cosH0) / DEG;
}

/** Highest point of a window: the transit if inside, else the end nearer to it in hour angle. */
function bestTimeMs(p: PreparedPosition, [start, end]: Span): number {
  const haStart = hourAngleDeg(p, start);
  const haEndUnwrapped = haStart + (end - start) * HA_DEG_PER_MS;
  const transitTurn = Math.ceil(haStart / 360);
  if (360 * transitTurn <= haEndUnwrapped) return start + (360 * transitTurn - haStart) / HA_DEG_PER_MS;
  return Math.cos(haStart * DEG) >= Math.cos(haEndUnwrapped * DEG) ? start : end;
}

interface NightContext {
  night: Night;
  dark: Span;
  moon: MoonTrack;
  moonLimitDeg: number;
  clock: ReturnType<typeof siteClock>;
}

/** Windows of one target in one night, or the reason there are none. */
function targetNight(site: Site, target: Target, ctx: NightContext, limits: Limits, constraints: Constraints): { windows: Window[] } | Dropped {
  const p = preparePosition(target, ctx.clock);
  const halfDeg = halfArcDeg(p, limits.floorTrueDeg);
  if (halfDeg === null) return belowFloor(p, limits);
  const ha = site.hourAngleLimitsHours;
  const loDeg = Math.max(-halfDeg, ha ? ha.east * 15 : -180);
  const hiDeg = Math.min(halfDeg, ha ? ha.west * 15 : 180);
  if (loDeg >= hiDeg) return { cause: 'hour-angle limits', reason: 'outside the hour-angle limits whenever it is high enough' };
  let spans = hourAngleSpans(p, loDeg, hiDeg, ctx.dark);
  if (spans.length === 0)
    return {
      cause: 'daylight',
      reason: `above ${limits.floorText}${ha ? ' inside the hour-angle limits' : ''} only outside the dark span (daylight or twilight)`,
    };
  const mask = site.horizon;
  if (mask) {
    const clear = (t: number) => altitudeDeg(p, t) - maskAltitudeDeg(mask, azimuthDeg(p, t));
    spans = spans.flatMap((s) => spansWhereNonNegative(clear, s, MASK_STEP_MS, EDGE_TOLERANCE_MS));
    if (spans.length === 0) return { cause: 'horizon mask', reason: 'behind the horizon mask whenever it is otherwise observable' };
  }
  if (ctx.moonLimitDeg > 0) {
    const tooClose = (t: number) => ctx.moonLimitDeg - moonSeparationDeg(ctx.moon, p.vector, t);
    const closeSpans = intersectSpans(spans, ctx.moon.upSpans).flatMap((s) => spansWhereNonNegative(tooClose, s, MOON_STEP_MS, EDGE_TOLERANCE_MS));
    spans = subtractSpans(spans, closeSpans);
    if (spans.length === 0) return { cause: 'Moon', reason: `within ${ctx.moonLimitDeg.toFixed(1)} deg of the Moon whenever it is otherwise observable` };
  }
  const minMs = constraints.minWindowMinutes * 60_000;
  const kept = spans.filter(([s, e]) => e - s >= minMs);
  if (kept.length === 0) {
    const longestMin = Math.max(...spans.map(([s, e]) => e - s)) / 60_000;
    return { cause: 'short window', reason: `longest window ${longestMin.toFixed(0)} min is shorter than the minimum ${constraints.minWindowMinutes} min` };
  }
  return {
    windows: kept.map((span) => {
      const best = bestTimeMs(p, span);
      return {
        targetId: target.id,
        localDate: ctx.night.localDate,
        start: new Date(span[0]),
        end: new Date(span[1]),
        bestTime: new Date(best),
        minAirmass: airmassAt(p, best),
        moonSeparationDeg: moonSeparationDeg(ctx.moon, p.vector, best),
      };
    }),
  };
}

/**
 * Visibility windows for every target in every night. A window lies inside the night's dark span
 * and has the target above the site's minimum altitude, below the airmass limit (Kasten & Young,
 * apparent altitude), above the horizon mask, inside the hour-angle limits and, while the Moon is
 * up, farther from it than requiredMoonSeparationDeg. A night can give a target several windows
 * (the Moon or the mask can split one; a 24-hour dark span can hold two transits): all pieces of
 * at least constraints.minWindowMinutes are returned, in time order. A target-night with none is
 * listed in `dropped` with the reason.
 */
export function computeWindows(site: Site, targets: Target[], nights: Night[], constraints: Constraints): { windows: Window[]; dropped: DroppedWindow[] } {
  const limits = limitsOf(site, constraints);
  const windows: Window[] = [];
  const dropped: DroppedWindow[] = [];
  for (const night of nights) {
    if (!night.darkStart || !night.darkEnd) {
      const reason = `no dark span${night.note ? `: ${night.note}` : ''}`;
      for (const t of targets) dropped.push({ targetId: t.id, localDate: night.localDate, cause: 'no dark time', reason });
      continue;
    }
    const dark: Span = [night.darkStart.getTime(), night.darkEnd.getTime()];
    const clock = siteClock(site, new Date((dark[0] + dark[1]) / 2));
    const ctx: NightContext = {
      night,
      dark,
      moon: moonTrack(night, clock),
      moonLimitDeg: requiredMoonSeparationDeg(constraints.moonSeparationDeg, night.moon.illumination),
      clock,
    };
    for (const target of targets) {
      const result = targetNight(site, target, ctx, limits, constraints);
      if ('reason' in result) dropped.push({ targetId: target.id, localDate: night.localDate, ...result });
      else windows.push(...result.windows);
    }
  }
  return { windows, dropped };
}
