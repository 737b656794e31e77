// Checks against worked examples of Meeus, Astronomical Algorithms, 2nd ed. (1998), as listed in
// docs/references.md [Meeus1998] (from memory; the numbers agree with several independent public test suites).
import { Body, e_tilt, MakeTime } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { apparentPlace, moonIlluminatedFraction, observerOf } from '../../src/astro/bodies.js';
import { ofDateFrame, starVectorOfDate } from '../../src/astro/position.js';
import { ttMinusUtcSec } from '../../src/astro/time-scales.js';
import { raDecFromVector, type Vec3 } from '../../src/astro/vectors.js';
import { belowSpans } from '../../src/sky/crossings.js';
import { azimuthDeg, geometricAltitudeDeg, siteClock, type PreparedPosition } from '../../src/sky/target-position.js';

const DEG = Math.PI / 180;
const dms = (d: number, m: number, s: number) => Math.sign(d || 1) * (Math.abs(d) + m / 60 + s / 3600);
/** A UTC Date from a TD (TT) calendar instant, through our leap-second table. */
function fromTd(isoTd: string): Date {
  const asIfUtc = new Date(isoTd);
  return new Date(asIfUtc.getTime() - ttMinusUtcSec(asIfUtc) * 1000);
}

describe('Meeus 13.b: Venus from Washington, 1987 April 10, 19:21:00 UT', () => {
  it('altitude 15.1249 deg, azimuth 68.0337 deg west of south', () => {
    const site = { latitudeDeg: dms(38, 55, 17), longitudeDeg: -dms(77, 3, 56), elevationM: 0 };
    const date = new Date('1987-04-10T19:21:00Z');
    const raDeg = dms(23, 9, 16.641) * 15;
    const decDeg = -dms(6, 43, 11.61);
    const p: PreparedPosition = {
      raDeg,
      decDeg,
      sinDec: Math.sin(decDeg * DEG),
      cosDec: Math.cos(decDeg * DEG),
      vector: [0, 0, 1],
      clock: siteClock(site, date),
    };
    // Tolerance 0.001 deg: Meeus quotes four decimals; his sidereal time and astronomy-engine's agree to ~0.01 s.
    expect(geometricAltitudeDeg(p, date)).toBeCloseTo(15.1249, 3);
    expect(azimuthDeg(p, date)).toBeCloseTo(68.0337 + 180, 3);
  });
});

describe('Meeus 15.a: Venus at Boston, 1988 March 20, standard altitude -0.5667 deg', () => {
  it('rises about 12:25 UT and sets about 02:55 UT the next day', () => {
    const observer = observerOf({ latitudeDeg: 42.3333, longitudeDeg: -71.0833, elevationM: 0 });
    const spans = belowSpans(Body.Venus, observer, -0.5667, Date.parse('1988-03-20T00:00:00Z'), Date.parse('1988-03-21T12:00:00Z'));
    const rise = spans.find((s) => s.endIsCrossing)!.endMs;
    const set = spans.find((s) => s.startIsCrossing && s.startMs > rise)!.startMs;
    // Tolerance 2 min: Meeus rounds to the minute and his three-point interpolation is good to ~1 min.
    expect(Math.abs(rise - Date.parse('1988-03-20T12:25:00Z')) / 60_000).toBeLessThan(2);
    expect(Math.abs(set - Date.parse('1988-03-21T02:55:00Z')) / 60_000).toBeLessThan(2);
  });
});

/** Mean-of-date from true-of-date: undo the nutation N = R1(-eps) R3(-dpsi) R1(eps0) (IAU convention). */
function removeNutation(v: Vec3, date: Date): Vec3 {
  const tilt = e_tilt(MakeTime(date));
  const r1 = (a: number, [x, y, z]: Vec3): Vec3 => [x, Math.cos(a) * y + Math.sin(a) * z, -Math.sin(a) * y + Math.cos(a) * z];
  const r3 = (a: number, [x, y, z]: Vec3): Vec3 => [Math.cos(a) * x + Math.sin(a) * y, -Math.sin(a) * x + Math.cos(a) * y, z];
  return r1(-tilt.mobl * DEG, r3((tilt.dpsi / 3600) * DEG, r1(tilt.tobl * DEG, v)));
}

describe('Meeus 21.b: theta Persei precessed with proper motion to 2028 Nov 13.19 TD', () => {
  it('alpha = 2h46m11.331s, delta = +49 20 54.54 (mean equator and equinox of date)', () => {
    const decDeg = dms(49, 13, 42.48);
    const star = { raDeg: dms(2, 44, 11.986) * 15, decDeg, pmRaMasYr: 0.03425 * 15_000 * Math.cos(decDeg * DEG), pmDecMasYr: -89.5, epochYear: 2000 };
    const date = fromTd('2028-11-13T04:33:36Z'); // 0.19 d = 4h33m36s
    const mean = raDecFromVector(removeNutation(starVectorOfDate(star, ofDateFrame(date)), date));
    // Tolerance 0.1": Meeus uses the IAU 1976 precession, astronomy-engine IAU 2006 with IAU 2000B
    // nutation (undone here); they differ by several hundredths of an arcsecond over 29 years.
    expect(Math.abs(mean.raDeg - dms(2, 46, 11.331) * 15) * 3600 * Math.cos(decDeg * DEG)).toBeLessThan(0.1);
    expect(Math.abs(mean.decDeg - dms(49, 20, 54.54)) * 3600).toBeLessThan(0.1);
  });
});

describe('Meeus 25.a: the Sun on 1992 October 13.0 TD', () => {
  it('apparent alpha = 198.38083 deg, delta = -7.78507 deg', () => {
    const sun = apparentPlace(Body.Sun, fromTd('1992-10-13T00:00:00Z'));
    // Tolerance 0.01 deg: the accuracy Meeus states for his low-accuracy solar method of example 25.a.
    expect(Math.abs(sun.raDeg - 198.38083)).toBeLessThan(0.01);
    expect(Math.abs(sun.decDeg - -7.78507)).toBeLessThan(0.01);
  });
});

describe('Meeus 47.a and 48.a: the Moon on 1992 April 12, 0h TD', () => {
  const date = fromTd('1992-04-12T00:00:00Z');
  it('47.a: apparent alpha = 134.688470 deg, delta = +13.768368 deg, distance 368 409.7 km', () => {
    const moon = apparentPlace(Body.Moon, date);
    // Tolerance 0.003 deg (11") and 20 km: Meeus's abridged ELP-2000/82 series is good to about 10" in
    // longitude and 4" in latitude and drops distance terms of some km; astronomy-engine uses a
    // different truncated lunar theory (it differs here by about 15 km).
    expect(Math.abs(moon.raDeg - 134.68847)).toBeLessThan(0.003);
    expect(Math.abs(moon.decDeg - 13.768368)).toBeLessThan(0.003);
    expect(Math.abs(moon.distanceKm - 368_409.7)).toBeLessThan(20);
  });
  it('48.a: illuminated fraction 0.6786', () => {
    // Tolerance 0.001: Meeus's example uses the geocentric elongation formula (48.2-48.3), good to 0.001.
    expect(moonIlluminatedFraction(date)).toBeCloseTo(0.6786, 3);
  });
});
