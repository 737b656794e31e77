import path from 'node:path';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { readSite } from '../../src/io/site.js';
import { SITES_DIR } from '../../src/io/paths.js';
import { localDateOf } from '../../src/sky/local-time.js';
import { computeNights } from '../../src/sky/nights.js';

const FIXTURES = path.join(import.meta.dirname, '..', 'fixtures', 'sites');
const laSilla = readSite(path.join(SITES_DIR, 'la-silla.json'));
const arctic = readSite(path.join(FIXTURES, 'high-arctic.json'));

describe('computeNights', () => {
  it('names each night by its evening across a DST change (Chile, clocks back on 2027-04-04; common practice)', () => {
    const nights = computeNights(laSilla, '2027-04-02', '2027-04-05', 'nautical');
    expect(nights.map((n) => n.localDate)).toEqual(['2027-04-02', '2027-04-03', '2027-04-04', '2027-04-05']);
    for (const n of nights) {
      expect(localDateOf(n.sunset!, laSilla.timeZone)).toBe(n.localDate);
      expect(localDateOf(n.sunrise!, laSilla.timeZone) > n.localDate).toBe(true);
    }
    // Sunsets a solar day apart (within 3 min), though the local clock jumps by an hour.
    for (let i = 1; i < nights.length; i++)
      expect(Math.abs(nights[i]!.sunset!.getTime() - nights[i - 1]!.sunset!.getTime() - 86_400_000)).toBeLessThan(180_000);
    const offset = (d: Date) => DateTime.fromJSDate(d, { zone: laSilla.timeZone }).offset;
    const across = nights[1]!;
    expect(offset(across.sunset!) - offset(across.sunrise!)).toBe(60);
  });

  it('a northern spring-forward night (Europe, 2027-03-28) keeps its evening date and a sensible length', () => {
    const site = readSite(path.join(SITES_DIR, 'calar-alto.json'));
    const [n] = computeNights(site, '2027-03-27', '2027-03-27', 'astronomical');
    expect(localDateOf(n!.darkStart!, site.timeZone)).toBe('2027-03-27');
    expect(n!.darkHours).toBeGreaterThan(7);
    expect(n!.darkHours).toBeLessThan(10);
  });

  it('orders the edges: sunset < civil < nautical < astronomical dusk < dawns < sunrise, dark span = chosen level', () => {
    for (const n of computeNights(laSilla, '2027-01-10', '2027-01-12', 'astronomical')) {
      const seq = [n.sunset, n.civil.dusk, n.nautical.dusk, n.astronomical.dusk, n.astronomical.dawn, n.nautical.dawn, n.civil.dawn, n.sunrise].map((d) =>
        d!.getTime(),
      );
      for (let i = 1; i < seq.length; i++) expect(seq[i]).toBeGreaterThan(seq[i - 1]!);
      expect(n.darkStart).toEqual(n.astronomical.dusk);
      expect(n.darkHours).toBeCloseTo((n.darkEnd!.getTime() - n.darkStart!.getTime()) / 3.6e6, 9);
      expect(n.note).toBeUndefined();
    }
  });

  it('78 N in June: no sunset, no dark span, and a note says why', () => {
    const [n] = computeNights(arctic, '2027-06-20', '2027-06-20', 'nautical');
    expect(n!.sunset).toBeNull();
    expect(n!.sunrise).toBeNull();
    expect(n!.darkStart).toBeNull();
    expect(n!.darkHours).toBe(0);
    expect(n!.note).toMatch(/Sun never below -12 deg/);
  });

  it('78 N in December: no sunrise (polar night), yet a nautical dark span most of the day', () => {
    const nights = computeNights(arctic, '2027-12-20', '2027-12-21', 'civil');
    for (const n of nights) {
      expect(n.sunrise).toBeNull();
      expect(n.sunset).toBeNull();
      expect(n.note).toMatch(/Sun below -0.833 deg all day/);
      // Sun below -6 deg all day: the civil dark span is noon to noon.
      expect(n.darkHours).toBeCloseTo(24, 6);
    }
    expect(nights[0]!.darkEnd).toEqual(nights[1]!.darkStart);
  });

  it('the Moon: illumination in [0, 1] cycling over a lunation; rise and set inside the night range', () => {
    const nights = computeNights(laSilla, '2027-03-01', '2027-03-30', 'nautical');
    const lit = nights.map((n) => n.moon.illumination);
    expect(Math.min(...lit)).toBeLessThan(0.02);
    expect(Math.max(...lit)).toBeGreaterThan(0.98);
    const fullish = nights.find((n) => n.moon.illumination > 0.98)!;
    expect(fullish.moon.upDuringDark).toBe(true);
  });
});
