// Barycentric Julian date in TDB [EastmanSiverdGaudi2010].
import { BaryState, Body, MakeTime } from 'astronomy-engine';
import { AU_M, C_MPS, DAY_SEC } from './constants.js';
import { earthPositionAu, type EarthTrack } from './earth-track.js';
import { properMotionVectorJ2000, type StarCoordinates } from './position.js';
import { jdTdb, julianYearsSinceJ2000 } from './time-scales.js';
import { unitVectorFromRaDec, type Vec3 } from './vectors.js';

/**
 * BJD_TDB of a UTC instant for light arriving from the ICRS (J2000) unit vector n:
 * BJD_TDB = JD_TDB + (r_earth . n) / c ([EastmanSiverdGaudi2010] eq. 1, the Roemer term),
 * with r_earth the Earth's barycentric position from astronomy-engine (BaryState, J2000 axes).
 * Left out, as in their error budget: the observer's offset from the geocentre (at most 21 ms),
 * the Shapiro delay (at most ~20 us) and the star's parallax; so good to about 0.03 s.
 */
function bjdTdbTowards(date: Date, n: Vec3): number {
  const earth = BaryState(Body.Earth, MakeTime(date));
  return bjdTdbFrom(date, [earth.x, earth.y, earth.z], n);
}

/** JD_TDB plus the Roemer term (r_earth . n) / c, r_earth in AU. */
function bjdTdbFrom(date: Date, [ex, ey, ez]: Vec3, [nx, ny, nz]: Vec3): number {
  return jdTdb(date) + ((ex * nx + ey * ny + ez * nz) * AU_M) / C_MPS / DAY_SEC;
}

/** BJD_TDB for a fixed ICRS (J2000) direction raDeg, decDeg (no proper motion). */
export function bjdTdb(date: Date, raDeg: number, decDeg: number): number {
  return bjdTdbTowards(date, unitVectorFromRaDec(raDeg, decDeg));
}

/**
 * BJD_TDB for a star, its proper motion carried to the instant: a star moving 10"/yr has moved
 * 0.07 deg after 25 years, which shifts the light-time term by up to 0.6 s (499 s x 1.3e-3 rad).
 */
export function starBjdTdb(date: Date, star: StarCoordinates): number {
  return bjdTdbTowards(date, properMotionVectorJ2000(star, 2000 + julianYearsSinceJ2000(date)));
}

/**
 * BJD_TDB as above, the Earth's position interpolated on a track (src/astro/earth-track.ts) and the
 * direction given once, e.g. a star's J2000 vector with proper motion to the middle of the night
 * (12 h of a 10"/yr motion moves the light-time term by < 0.1 ms).
 */
export function bjdTdbOnTrack(track: EarthTrack, date: Date, n: Vec3): number {
  return bjdTdbFrom(date, earthPositionAu(track, date.getTime()), n);
}
