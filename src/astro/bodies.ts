// Sun and Moon: thin wrappers over astronomy-engine (VSOP87 for the Earth, an ELP-derived series for the Moon).
import { Body, Equator, GeoVector, Illumination, MakeTime, Observer, RotateVector, Rotation_EQJ_EQD, type Vector } from 'astronomy-engine';
import type { Site } from '../model.js';
import { raDecFromVector, type Vec3 } from './vectors.js';

/** The astronomy-engine observer of a site (geodetic latitude, east longitude, elevation). */
export function observerOf(site: Pick<Site, 'latitudeDeg' | 'longitudeDeg' | 'elevationM'>): Observer {
  return new Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
}

export interface ApparentPlace {
  raDeg: number;
  decDeg: number;
  distanceKm: number;
  /** Unit vector, true equator and equinox of date. */
  vector: Vec3;
}

/** IAU 2012 Resolution B2 au, in km. */
const AU_KM = 149_597_870.7;

function placeFromVector(v: Vector): ApparentPlace {
  const r = Math.hypot(v.x, v.y, v.z);
  const vector: Vec3 = [v.x / r, v.y / r, v.z / r];
  return { ...raDecFromVector(vector), distanceKm: r * AU_KM, vector };
}

/**
 * Apparent place of the Sun or Moon on the true equator and equinox of date, with light time and
 * aberration: geocentric when `observer` is omitted (GeoVector rotated by Rotation_EQJ_EQD),
 * topocentric otherwise (Equator with ofdate = true).
 */
export function apparentPlace(body: Body.Sun | Body.Moon, date: Date, observer?: Observer): ApparentPlace {
  const time = MakeTime(date);
  if (observer) return placeFromVector(Equator(body, time, observer, true, true).vec);
  return placeFromVector(RotateVector(Rotation_EQJ_EQD(time), GeoVector(body, time, true)));
}

/** Illuminated fraction of the Moon's disc (0..1) seen from the geocentre. */
export function moonIlluminatedFraction(date: Date): number {
  return Illumination(Body.Moon, MakeTime(date)).phase_fraction;
}
