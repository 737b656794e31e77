// The Moon across one dark span, computed once per night and shared by every target.
import { GeoMoon, MakeTime } from 'astronomy-engine';
import { AU_M } from '../astro/constants.js';
import { rotateToDate } from '../astro/position.js';
import { angleBetweenDeg, type Vec3 } from '../astro/vectors.js';
import type { Night } from '../model.js';
import { spansWhereNonNegative, type Span } from './intervals.js';
import { MOON_UP_ALTITUDE_DEG } from './nights.js';
import { localSiderealDeg, type SiteClock } from './target-position.js';

const DEG = Math.PI / 180;
/** Longest spacing of the tabulated geocentric Moon; quadratic interpolation then errs below 0.001 deg. */
const MAX_NODE_STEP_MS = 5 * 3_600_000;
/** Sampling step when finding Moon rise and set inside the dark span (altitude changes < 4 deg in it). */
const UP_STEP_MS = 15 * 60_000;

export interface MoonTrack {
  clock: SiteClock;
  startMs: number;
  stepMs: number;
  /** Geocentric Moon, true equator of date, AU: at least three nodes spread evenly over the dark span. */
  nodes: Vec3[];
  /** When the Moon is up (topocentric centre above MOON_UP_ALTITUDE_DEG) inside the dark span. */
  upSpans: Span[];
  illumination: number;
}

/** WGS84 ellipsoid (NIMA TR8350.2): equatorial radius (m) and flattening. */
const WGS84_A_M = 6_378_137;
const WGS84_F = 1 / 298.257223563;

/**
 * The observer's geocentric position (AU, true equator of date) at an instant: geodetic to
 * geocentric with the WGS84 ellipsoid (Explanatory Supplement 1992, sec. 4.22; common practice),
 * turned by the local sidereal time.
 */
function observerAu(clock: SiteClock, tMs: number): Vec3 {
  const c = 1 / Math.sqrt(clock.cosLat ** 2 + (1 - WGS84_F) ** 2 * clock.sinLat ** 2);
  const s = (1 - WGS84_F) ** 2 * c;
  const rhoCos = ((WGS84_A_M * c + clock.elevationM) * clock.cosLat) / AU_M;
  const rhoSin = ((WGS84_A_M * s + clock.elevationM) * clock.sinLat) / AU_M;
  const lst = localSiderealDeg(clock, tMs) * DEG;
  return [rhoCos * Math.cos(lst), rhoCos * Math.sin(lst), rhoSin];
}

/** Geocentric Moon (AU, of date) at an instant: quadratic (three-node Lagrange) interpolation. */
function geocentricAt(track: Pick<MoonTrack, 'startMs' | 'stepMs' | 'nodes'>, tMs: number): Vec3 {
  const x = (tMs - track.startMs) / track.stepMs;
  const i = Math.max(0, Math.min(track.nodes.length - 3, Math.floor(x)));
  const u = x - i;
  const w0 = ((u - 1) * (u - 2)) / 2;
  const w1 = -u * (u - 2);
  const w2 = (u * (u - 1)) / 2;
  const [a, b, c] = [track.nodes[i]!, track.nodes[i + 1]!, track.nodes[i + 2]!];
  return [w0 * a[0] + w1 * b[0] + w2 * c[0], w0 * a[1] + w1 * b[1] + w2 * c[1], w0 * a[2] + w1 * b[2] + w2 * c[2]];
}

/** The Moon's topocentric unit vector of date (geometric: no aberration, like the star positions). */
export function moonVectorAt(track: MoonTrack, tMs: number): Vec3 {
  const g = geocentricAt(track, tMs);
  const o = observerAu(track.clock, tMs);
  const v: Vec3 = [g[0] - o[0], g[1] - o[1], g[2] - o[2]];
  const r = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / r, v[1] / r, v[2] / r];
}

/** Topocentric geometric altitude of the Moon's centre (deg). */
function moonAltitudeDeg(track: MoonTrack, tMs: number): number {
  const [x, y, z] = moonVectorAt(track, tMs);
  const lst = localSiderealDeg(track.clock, tMs) * DEG;
  const c = track.clock;
  return Math.asin(c.sinLat * z + c.cosLat * (x * Math.cos(lst) + y * Math.sin(lst))) / DEG;
}

/**
 * Tabulates the Moon for a night with a dark span: astronomy-engine's GeoMoon (J2000) at a few
 * nodes, turned to the true equator of date with the clock's precession-nutation matrix.
 */
export function moonTrack(night: Night, clock: SiteClock): MoonTrack {
  const startMs = night.darkStart!.getTime();
  const endMs = night.darkEnd!.getTime();
  const count = Math.max(3, Math.ceil((endMs - startMs) / MAX_NODE_STEP_MS) + 1);
  const stepMs = (endMs - startMs) / (count - 1);
  const nodes = Array.from({ length: count }, (_, k): Vec3 => {
    const m = GeoMoon(MakeTime(new Date(startMs + k * stepMs)));
    return rotateToDate(clock.frame, [m.x, m.y, m.z]);
  });
  const track: MoonTrack = { clock, startMs, stepMs, nodes, upSpans: [], illumination: night.moon.illumination };
  track.upSpans = spansWhereNonNegative((t) => moonAltitudeDeg(track, t) - MOON_UP_ALTITUDE_DEG, [startMs, endMs], UP_STEP_MS, 1000);
  return track;
}

/** Separation (deg) between a unit vector of date and the Moon at an instant. */
export function moonSeparationDeg(track: MoonTrack, vector: Vec3, tMs: number): number {
  return angleBetweenDeg(vector, moonVectorAt(track, tMs));
}

/**
 * The separation a target must keep from the Moon while the Moon is up:
 * limit x (0.5 + 0.5 x illuminated fraction), so the full limit at full Moon and half of it at new
 * Moon (our rule: scattered moonlight grows with the lit fraction; the weights are our choice).
 * While the Moon is down there is no limit.
 */
export function requiredMoonSeparationDeg(limitDeg: number, illumination: number): number {
  return limitDeg * (0.5 + 0.5 * illumination);
}
