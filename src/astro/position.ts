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
  return [
    r[0]![0]! * x + r[1]![0]! * y + r[2]![0]! * z,
    r[0]![1]! * x + r[1]![1]! * y + r[2]![1]! * z,
    r[0]![2]! * x + r[1]![2]! * y + r[2]![2]! * z,
  ];
}

/**
 * J2000 coordinates with proper motion carried linearly from the star's epoch to the frame's
 * epoch (Meeus 1998, ch. 21: alpha += mu_alpha t, delta += mu_delta t; mu_alpha = pmRA / cos delta).
 * Radial velocity and parallax are left out (below 0.1" over decades for all but the nearest stars).
 */
export function properMotionJ2000(star: StarCoordinates, epochYear: number): { raDeg: number; decDeg: number } {
  const years = epochYear - star.epochYear;
  const cosDec = Math.max(Math.cos((star.decDeg * Math.PI) / 180), 1e-9);
  const raDeg = star.raDeg + (star.pmRaMasYr * years) / 3.6e6 / cosDec;
  const decDeg = Math.max(-90, Math.min(90, star.decDeg + (star.pmDecMasYr * years) / 3.6e6));
  return { raDeg: ((raDeg % 360) + 360) % 360, decDeg };
}

/** Unit vector of the star on the true equator and equinox of the frame's date (no aberration). */
export function starVectorOfDate(star: StarCoordinates, frame: OfDateFrame): Vec3 {
  const j2000 = properMotionJ2000(star, frame.epochYear);
  return rotateToDate(frame, unitVectorFromRaDec(j2000.raDeg, j2000.decDeg));
}

/** Right ascension and declination (deg) on the true equator and equinox of date. */
export function starOfDate(star: StarCoordinates, frame: OfDateFrame): { raDeg: number; decDeg: number } {
  return raDecFromVector(starVectorOfDate(star, frame));
}
