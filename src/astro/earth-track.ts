// The Earth's barycentric position over a span of hours (e.g. one night), tabulated a few times and
// interpolated, so that BJD_TDB at many instants costs one ephemeris evaluation per node, not per instant.
import { BaryState, Body, MakeTime } from 'astronomy-engine';
import { DAY_MS } from './constants.js';
import type { Vec3 } from './vectors.js';

/**
 * Longest spacing of the nodes. The cubic Hermite error is at most |x''''| h^4 / 384 [BurdenFaires2011]; the Earth's x'''' (Sun and Moon terms, ~5e-16 m/s^4)
 * gives ~2 m over 12 h, far below the 300 km that 1 ms of light time is.
 */
const MAX_NODE_STEP_MS = 12 * 3_600_000;

/** One node: barycentric position (AU) and velocity (AU/day), J2000 axes. */
interface EarthNode {
  position: Vec3;
  velocityAuPerDay: Vec3;
}

export interface EarthTrack {
  startMs: number;
  endMs: number;
  stepMs: number;
  /** At least two nodes, evenly spread from startMs to endMs. */
  nodes: EarthNode[];
}

function earthNode(ms: number): EarthNode {
  const s = BaryState(Body.Earth, MakeTime(new Date(ms)));
  return { position: [s.x, s.y, s.z], velocityAuPerDay: [s.vx, s.vy, s.vz] };
}

/** Tabulates the Earth's barycentric state (astronomy-engine BaryState) at nodes <= 12 h apart over [startMs, endMs]. */
export function earthTrack(startMs: number, endMs: number): EarthTrack {
  const pieces = Math.max(1, Math.ceil((endMs - startMs) / MAX_NODE_STEP_MS));
  const stepMs = (endMs - startMs) / pieces || 1;
  const nodes = Array.from({ length: pieces + 1 }, (_, i) => earthNode(startMs + i * stepMs));
  return { startMs, endMs, stepMs, nodes };
}

/**
 * The Earth's barycentric position (AU, J2000 axes) at an instant inside the track: the cubic
 * Hermite through the two nodes around it, their positions and velocities [BurdenFaires2011].
 */
export function earthPositionAu(track: EarthTrack, tMs: number): Vec3 {
  if (!(tMs >= track.startMs && tMs <= track.endMs)) throw new RangeError(`instant ${new Date(tMs).toISOString()} is outside the Earth track`);
  const x = (tMs - track.startMs) / track.stepMs;
  const i = Math.min(track.nodes.length - 2, Math.floor(x));
  const s = x - i;
  const hDays = track.stepMs / DAY_MS;
  const s2 = s * s;
  const s3 = s2 * s;
  const h00 = 2 * s3 - 3 * s2 + 1;
  const h10 = (s3 - 2 * s2 + s) * hDays;
  const h01 = -2 * s3 + 3 * s2;
  const h11 = (s3 - s2) * hDays;
  const a = track.nodes[i]!;
  const b = track.nodes[i + 1]!;
  const at = (k: 0 | 1 | 2) => h00 * a.position[k] + h10 * a.velocityAuPerDay[k] + h01 * b.position[k] + h11 * b.velocityAuPerDay[k];
  return [at(0), at(1), at(2)];
}
