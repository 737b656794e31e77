// Star positions: J2000/ICRS with proper motion, carried to the true equator and equinox of date.
import { MakeTime, Rotation_EQJ_EQD, type RotationMatrix } from 'astronomy-engine';
import { julianYearsSinceJ2000 } from './time-scales.js';
import { raDecFromVector, unitVectorFromRaDec, type Vec3 } from './vectors.js';

/** What a star needs for its position: J2000/ICRS coordinates at `epochYear`, proper motion in mas/yr. */
export interface StarCoordinates {
  raDeg: number;
  decDeg: number;
  /** Proper motion in right ascension times cos(dec), mas/yr. */
  pmRaMasYr: number;
  pmDecMasYr: number;
  /** Julian epoch of raDeg/decDeg (e.g. 2000 or 2016). */
  epochYear: number;
}

/** The rotation J2000 -> true equator and equinox of date at one instant, shared by all stars. */
export interface OfDateFrame {
  date: Date;
  /** Julian epoch of the instant (TT). */
  epochYear: number;
  rotation: RotationMatrix;
}

/** Builds the precession-nutation rotation of astronomy-engine (Rotation_EQJ_EQD, IAU 2006/2000B) for one instant. */
export function ofDateFrame(date: Date): OfDateFrame {
  return { date, epochYear: 2000 + julianYearsSinceJ2000(date), rotation: Rotation_EQJ_EQD(MakeTime(date)) };
}

/** A J2000 vector turned to the true equator of date: the product astronomy-engine's RotateVector forms, without its allocations. */
export function rotateToDate(frame: OfDateFrame, [x, y, z]: Vec3): Vec3 {
  const r = frame.rotation.rot;
  return [r[0]![0]! * x + r[1]![0]! * y + r[2]![0]! * z, r[0]![1]! * x + r[1]![1]! * y + r[2]![1]! * z, r[0]![2]! * x + r[1]![2]! * y + r[2]![2]! * z];
}

const MAS_RAD = Math.PI / 180 / 3.6e6;

/**
 * The star's J2000 unit vector with proper motion carried from its epoch to `epochYear`: the
 * motion is a step along the sky's local east and north unit vectors, p' = p + t (mu_a* e + mu_d n),
 * renormalised (the straight-line space motion without radial velocity [ESA1997 Vol. 1 sect. 1.5.5]).
 * Valid at the poles, where a step in right ascension is not. Radial velocity and parallax are
 * left out (below 0.1" over decades for all but the nearest stars).
 */
export function properMotionVectorJ2000(star: StarCoordinates, epochYear: number): Vec3 {
  const years = epochYear - star.epochYear;
  const [x, y, z] = unitVectorFromRaDec(star.raDeg, star.decDeg);
  const ra = (star.raDeg * Math.PI) / 180;
  const east: Vec3 = [-Math.sin(ra), Math.cos(ra), 0];
  const north: Vec3 = [-z * Math.cos(ra), -z * Math.sin(ra), Math.hypot(x, y)];
  const a = star.pmRaMasYr * years * MAS_RAD;
  const d = star.pmDecMasYr * years * MAS_RAD;
  const v: Vec3 = [x + a * east[0] + d * north[0], y + a * east[1] + d * north[1], z + a * east[2] + d * north[2]];
  const r = Math.hypot(...v);
  return [v[0] / r, v[1] / r, v[2] / r];
}

/** J2000 right ascension (0..360) and declination (deg) with proper motion carried to `epochYear` (above). */
export function properMotionJ2000(star: StarCoordinates, epochYear: number): { raDeg: number; decDeg: number } {
  return raDecFromVector(properMotionVectorJ2000(star, epochYear));
}

/** Unit vector of the star on the true equator and equinox of the frame's date (no aberration). */
export function starVectorOfDate(star: StarCoordinates, frame: OfDateFrame): Vec3 {
  return rotateToDate(frame, properMotionVectorJ2000(star, frame.epochYear));
}

/** Right ascension and declination (deg) on the true equator and equinox of date. */
export function starOfDate(star: StarCoordinates, frame: OfDateFrame): { raDeg: number; decDeg: number } {
  return raDecFromVector(starVectorOfDate(star, frame));
}
