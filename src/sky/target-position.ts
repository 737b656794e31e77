// A target prepared for one night: its place of date once, then altitude and airmass at any instant.
import { MakeTime, SiderealTime } from 'astronomy-engine';
import { kastenYoungAirmass } from '../astro/airmass.js';
import { DAY_MS, SIDEREAL_PER_SOLAR } from '../astro/constants.js';
import { ofDateFrame, starVectorOfDate, type OfDateFrame, type StarCoordinates } from '../astro/position.js';
import { pressureHpaAtElevation } from '../astro/pressure.js';
import { apparentAltitudeDeg } from '../astro/refraction.js';
import type { Vec3 } from '../astro/vectors.js';
import type { Site } from '../model.js';

const DEG = Math.PI / 180;

/**
 * The site's sidereal clock around one instant: local apparent sidereal time at `t0Ms`, advancing
 * at the sidereal rate (Meeus 1998, eq. 12.4). Over a day the neglected change of nutation shifts
 * it by under 0.01 s of time. Also carries the precession-nutation frame of that instant.
 */
export interface SiteClock {
  t0Ms: number;
  elevationM: number;
  /** Air pressure at the site's elevation (hPa), for refraction. */
  pressureHpa: number;
  lst0Deg: number;
  latitudeDeg: number;
  sinLat: number;
  cosLat: number;
  frame: OfDateFrame;
}

/** Builds the clock for instants within about a day of `at` (e.g. the middle of a night). */
export function siteClock(site: Pick<Site, 'latitudeDeg' | 'longitudeDeg' | 'elevationM'>, at: Date): SiteClock {
  const gastHours = SiderealTime(MakeTime(at));
  return {
    t0Ms: at.getTime(),
    elevationM: site.elevationM,
    pressureHpa: pressureHpaAtElevation(site.elevationM),
    lst0Deg: gastHours * 15 + site.longitudeDeg,
    latitudeDeg: site.latitudeDeg,
    sinLat: Math.sin(site.latitudeDeg * DEG),
    cosLat: Math.cos(site.latitudeDeg * DEG),
    frame: ofDateFrame(at),
  };
}

/** A target's place on the true equator and equinox of the night, with the site clock. */
export interface PreparedPosition {
  raDeg: number;
  decDeg: number;
  sinDec: number;
  cosDec: number;
  /** Unit vector of date (for separations). */
  vector: Vec3;
  clock: SiteClock;
}

/** Proper motion to the clock's date, then J2000 -> true of date: once per target per night. */
export function preparePosition(star: StarCoordinates, clock: SiteClock): PreparedPosition {
  const vector = starVectorOfDate(star, clock.frame);
  const raDeg = Math.atan2(vector[1], vector[0]) / DEG;
  const decRad = Math.asin(Math.max(-1, Math.min(1, vector[2])));
  return { raDeg, decDeg: decRad / DEG, sinDec: Math.sin(decRad), cosDec: Math.cos(decRad), vector, clock };
}

const ms = (t: Date | number) => (typeof t === 'number' ? t : t.getTime());

/** Local apparent sidereal time in degrees (not reduced to 0..360) at an instant in ms. */
export function localSiderealDeg(clock: SiteClock, tMs: number): number {
  return clock.lst0Deg + (360 * SIDEREAL_PER_SOLAR * (tMs - clock.t0Ms)) / DAY_MS;
}

/** Local hour angle in degrees, in (-180, 180]: west positive. */
export function hourAngleDeg(p: PreparedPosition, t: Date | number): number {
  const lstDeg = localSiderealDeg(p.clock, ms(t));
  const h = ((((lstDeg - p.raDeg) % 360) + 540) % 360) - 180;
  return h === -180 ? 180 : h;
}

/** Geometric altitude (deg): sin h = sin phi sin delta + cos phi cos delta cos H (Meeus 1998, eq. 13.6). */
export function geometricAltitudeDeg(p: PreparedPosition, t: Date | number): number {
  const c = p.clock;
  const sinH = c.sinLat * p.sinDec + c.cosLat * p.cosDec * Math.cos(hourAngleDeg(p, t) * DEG);
  return Math.asin(Math.max(-1, Math.min(1, sinH))) / DEG;
}

/** Apparent (refracted at the site's pressure) altitude in degrees: what minimum altitudes and horizon masks are compared with. */
export function altitudeDeg(p: PreparedPosition, t: Date | number): number {
  return apparentAltitudeDeg(geometricAltitudeDeg(p, t), p.clock.pressureHpa);
}

/** Kasten & Young airmass at an instant (Infinity below the horizon). */
export function airmassAt(p: PreparedPosition, t: Date | number): number {
  return kastenYoungAirmass(altitudeDeg(p, t));
}

/** Azimuth in degrees from north through east, 0..360 (Meeus 1998, eq. 13.5, turned to start at north). */
export function azimuthDeg(p: PreparedPosition, t: Date | number): number {
  const c = p.clock;
  const h = hourAngleDeg(p, t) * DEG;
  const east = -p.cosDec * Math.sin(h);
  const north = p.sinDec * c.cosLat - p.cosDec * Math.cos(h) * c.sinLat;
  const az = Math.atan2(east, north) / DEG;
  return az < 0 ? az + 360 : az;
}
