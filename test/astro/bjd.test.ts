import { Body, Equator, MakeTime, Observer } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { bjdTdb } from '../../src/astro/bjd.js';
import { jdTdb, jdUtc, tdbMinusTtSec, ttMinusUtcSec } from '../../src/astro/time-scales.js';

const DAY_SEC = 86_400;

describe('time scales', () => {
  it('TT - UTC is 69.184 s since 2017 and 66.184 s in 2010 (IERS Bulletin C leap seconds + 32.184 s)', () => {
    expect(ttMinusUtcSec(new Date('2027-03-01T00:00:00Z'))).toBe(69.184);
    expect(ttMinusUtcSec(new Date('2010-06-01T00:00:00Z'))).toBe(66.184);
    expect(ttMinusUtcSec(new Date('2016-12-31T23:59:59Z'))).toBe(68.184);
  });

  it('JD of the J2000 epoch in UTC terms (common practice: 2000-01-01T11:58:55.816 UTC = JD_TT 2451545.0)', () => {
    const date = new Date('2000-01-01T11:58:55.816Z');
    expect(jdUtc(date) + ttMinusUtcSec(date) / DAY_SEC).toBeCloseTo(2_451_545.0, 8);
  });

  it('TDB - TT stays within 1.7 ms with a yearly period (Fairhead & Bretagnon 1990, from memory)', () => {
    const values = Array.from({ length: 366 }, (_, d) => tdbMinusTtSec(2_461_000.5 + d));
    expect(Math.max(...values)).toBeGreaterThan(0.0015);
    expect(Math.max(...values.map(Math.abs))).toBeLessThan(0.0017);
  });
});

describe('bjdTdb (Eastman, Siverd & Gaudi 2010)', () => {
  const days = Array.from({ length: 365 }, (_, d) => new Date(Date.UTC(2027, 0, 1 + d)));

  it('the light-time term for a star in the ecliptic reaches about 499 s (1 au / c; docs/references.md [BJD-TDB])', () => {
    // A star at ecliptic longitude 90 deg, latitude 0: RA 90 deg, Dec +23.44 deg (J2000).
    const delays = days.map((d) => (bjdTdb(d, 90, 23.4393) - jdTdb(d)) * DAY_SEC);
    // Half the yearly range: 1 au / c = 499.0 s, give or take the orbit's eccentricity and the barycentre.
    const halfRangeSec = (Math.max(...delays) - Math.min(...delays)) / 2;
    expect(halfRangeSec).toBeGreaterThan(490);
    expect(halfRangeSec).toBeLessThan(510);
  });

  it('is near zero for a star at the ecliptic pole (barycentre wobble only, < 5 s)', () => {
    for (const d of days) expect(Math.abs((bjdTdb(d, 270, 66.5607) - jdTdb(d)) * DAY_SEC)).toBeLessThan(5);
  });

  it('is later than JD_TDB when the Earth lies between the Sun and the star (opposition; property)', () => {
    const date = new Date('2027-06-21T00:00:00Z');
    const sun = Equator(Body.Sun, MakeTime(date), new Observer(0, 0, 0), false, false);
    const star = { raDeg: (sun.ra * 15 + 180) % 360, decDeg: -sun.dec };
    expect((bjdTdb(date, star.raDeg, star.decDeg) - jdTdb(date)) * DAY_SEC).toBeGreaterThan(480);
  });
});
