// The Moon across one dark span, computed once per night and shared by every target.
import { Body } from 'astronomy-engine';
import { apparentPlace, observerOf } from '../astro/bodies.js';
import { angleBetweenDeg, type Vec3 } from '../astro/vectors.js';
import type { Night, Site } from '../model.js';
import { belowSpans } from './crossings.js';
import { subtractSpans, type Span } from './intervals.js';
import { MOON_UP_ALTITUDE_DEG } from './nights.js';

/** Spacing of the Moon's tabulated places; linear interpolation between them errs below 0.005 deg. */
const NODE_STEP_MS = 30 * 60_000;

export interface MoonTrack {
  startMs: number;
  /** Topocentric unit vectors of date every NODE_STEP_MS from startMs, through the span's end. */
  nodes: Vec3[];
  /** When the Moon is up (centre above MOON_UP_ALTITUDE_DEG) inside the dark span. */
  upSpans: Span[];
  illumination: number;
}

/** Tabulates the Moon for a night with a dark span. */
export function moonTrack(site: Site, night: Night): MoonTrack {
  const startMs = night.darkStart!.getTime();
  const endMs = night.darkEnd!.getTime();
  const observer = observerOf(site);
  const nodes: Vec3[] = [];
  for (let t = startMs; t < endMs + NODE_STEP_MS; t += NODE_STEP_MS) nodes.push(apparentPlace(Body.Moon, new Date(t), observer).vector);
  const below: Span[] = belowSpans(Body.Moon, observer, MOON_UP_ALTITUDE_DEG, startMs, endMs).map((s) => [s.startMs, s.endMs]);
  return { startMs, nodes, upSpans: subtractSpans([[startMs, endMs]], below), illumination: night.moon.illumination };
}

/** The Moon's unit vector at an instant inside the dark span (linear interpolation, renormalised). */
export function moonVectorAt(track: MoonTrack, tMs: number): Vec3 {
  const x = Math.max(0, (tMs - track.startMs) / NODE_STEP_MS);
  const i = Math.min(Math.floor(x), track.nodes.length - 2);
  const f = x - i;
  const a = track.nodes[i]!;
  const b = track.nodes[Math.min(i + 1, track.nodes.length - 1)]!;
  const v: Vec3 = [a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1]), a[2] + f * (b[2] - a[2])];
  const r = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / r, v[1] / r, v[2] / r];
}

/** Separation (deg) between a unit vector of date and the Moon at an instant. */
export function moonSeparationDeg(track: MoonTrack, vector: Vec3, tMs: number): number {
  return angleBetweenDeg(vector, moonVectorAt(track, tMs));
}

/**
 * The separation a target must keep from the Moon while the Moon is up:
 * limit x (0.5 + 0.5 x illuminated fraction), so the full limit at full Moon and half of it at new
 * Moon (our rule: scattered moonlight grows with the lit fraction; common practice in spirit, the
 * weights are our choice). While the Moon is down there is no limit.
 */
export function requiredMoonSeparationDeg(limitDeg: number, illumination: number): number {
  return limitDeg * (0.5 + 0.5 * illumination);
}
