import path from 'node:path';
import { Horizon, MakeTime } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { observerOf } from '../../src/astro/bodies.js';
import { kastenYoungAirmass } from '../../src/astro/airmass.js';
import { ofDateFrame, starOfDate } from '../../src/astro/position.js';
import { pressureHpaAtElevation } from '../../src/astro/pressure.js';
import { readSite } from '../../src/io/site.js';
import { SITES_DIR } from '../../src/io/paths.js';
import type { Constraints, Target } from '../../src/model.js';
import { computeNights } from '../../src/sky/nights.js';
import { airmassAt, altitudeDeg, hourAngleDeg, preparePosition, siteClock } from '../../src/sky/target-position.js';
import { computeWindows } from '../../src/sky/visibility.js';

const laSilla = readSite(path.join(SITES_DIR, 'la-silla.json'));
const masked = readSite(path.join(import.meta.dirname, '..', 'fixtures', 'sites', 'masked-south.json'));
const base: Constraints = { twilight: 'nautical', maxAirmass: 2, moonSeparationDeg: 0, minSpacingHours: 0, sameNightSpacingHours: 0, minWindowMinutes: 0 };
const star = (id: string, raDeg: number, decDeg: number): Target => ({
  id,
  starId: id,
  raDeg,
  decDeg,
  pmRaMasYr: 0,
  pmDecMasYr: 0,
  epochYear: 2000,
  vmag: 9,
  teffK: 5500,
  massSun: 1,
  vsiniKms: 2,
  jitterMps: 1.5,
  priority: 1,
  estimated: [],
  source: 'test',
});

describe('prepared positions', () => {
  it('altitude matches astronomy-engine Horizon, its normal refraction scaled by the site pressure / 1010 hPa, within 0.01 deg over a night', () => {
    const at = new Date('2027-03-02T04:00:00Z');
    const target = { ...star('x', 150, -40), pmRaMasYr: 500, pmDecMasYr: -300, epochYear: 2016 };
    const p = preparePosition(target, siteClock(laSilla, at));
    const frame = ofDateFrame(at);
    const { raDeg, decDeg } = starOfDate(target, frame);
    for (let h = -6; h <= 6; h++) {
      const t = new Date(at.getTime() + h * 3.6e6);
      const geometric = Horizon(MakeTime(t), observerOf(laSilla), raDeg / 15, decDeg).altitude;
      const standard = Horizon(MakeTime(t), observerOf(laSilla), raDeg / 15, decDeg, 'normal').altitude;
      // Refraction scales with pressure (Meeus 1998, ch. 16); the pressure at 2400 m is checked in test/astro/refraction.test.ts.
      const ref = geometric + ((standard - geometric) * pressureHpaAtElevation(laSilla.elevationM)) / 1010;
      expect(Math.abs(altitudeDeg(p, t) - ref)).toBeLessThan(0.01);
      expect(airmassAt(p, t)).toBeCloseTo(kastenYoungAirmass(ref), 3);
    }
  });
});

describe('computeWindows', () => {
  const nights = computeNights(laSilla, '2027-03-01', '2027-03-01', 'nautical');

  it('best time is the transit when it falls in the window, and the window edges sit at the altitude floor', () => {
    const { windows } = computeWindows(laSilla, [star('transits', 150, -30)], nights, base);
    const w = windows[0]!;
    const p = preparePosition(star('transits', 150, -30), siteClock(laSilla, w.bestTime));
    expect(Math.abs(hourAngleDeg(p, w.bestTime))).toBeLessThan(0.01);
    // Floor: max(site minimum 20 deg, airmass 2 -> 29.9 deg).
    for (const edge of [w.start, w.end]) if (edge > nights[0]!.darkStart! && edge < nights[0]!.darkEnd!) expect(airmassAt(p, edge)).toBeCloseTo(2, 3);
    expect(w.minAirmass).toBeLessThan(1.01);
  });

  it('drops a star that never gets above the floor, one that never rises, and a short window, with causes and reasons', () => {
    const targets = [star('north', 150, 60), star('far-north', 150, 70), star('late', 40, -30)];
    const { windows, dropped } = computeWindows(laSilla, targets, nights, { ...base, minWindowMinutes: 120 });
    expect(windows).toEqual([]);
    const of = (id: string) => dropped.find((d) => d.targetId === id)!;
    // Culmination 90 - |phi - delta| (Meeus 1998, ch. 13): 90 - |-29.26 - 60| = 0.74 deg above the
    // horizon, 90 - |-29.26 - 70| = 9.26 deg below it; precession to 2027 lowers the declination of
    // date at RA 150 deg by 20″/yr × 27 yr × |cos 150°| = 0.13 deg (Meeus 1998, ch. 21).
    expect(of('north')).toMatchObject({ cause: 'too low' });
    expect(of('north').reason).toMatch(/^culminates at 0\.[6-9] deg, never above 29\.9 deg/);
    expect(of('far-north')).toMatchObject({ cause: 'never rises' });
    expect(of('far-north').reason).toMatch(/^never rises at this site \(culminates 9\.[0-3] deg below the horizon\)$/);
    expect(of('late').cause).toBe('short window');
    expect(dropped.find((d) => d.targetId === 'late')!.reason).toMatch(/longest window 79 min is shorter than the minimum 120 min/);
  });

  it('a night with no dark span drops every target with the night note', () => {
    const arctic = readSite(path.join(import.meta.dirname, '..', 'fixtures', 'sites', 'high-arctic.json'));
    const { windows, dropped } = computeWindows(arctic, [star('a', 0, 80)], computeNights(arctic, '2027-06-20', '2027-06-20', 'nautical'), base);
    expect(windows).toEqual([]);
    expect(dropped[0]!.reason).toMatch(/^no dark span: .*Sun never below -12 deg/);
  });

  it('hour-angle limits and the horizon mask hold inside every window (property)', () => {
    const maskedNights = computeNights(masked, '2027-05-10', '2027-05-12', 'nautical');
    const targets = Array.from({ length: 24 }, (_, i) => star(`s${i}`, i * 15, -70 + ((i * 37) % 100)));
    const { windows } = computeWindows(masked, targets, maskedNights, base);
    expect(windows.length).toBeGreaterThan(20);
    for (const w of windows) {
      const target = targets.find((t) => t.id === w.targetId)!;
      const p = preparePosition(target, siteClock(masked, w.bestTime));
      for (let t = w.start.getTime() + 1000; t < w.end.getTime(); t += 5 * 60_000) {
        const haHours = hourAngleDeg(p, t) / 15;
        expect(haHours).toBeGreaterThanOrEqual(-4.001);
        expect(haHours).toBeLessThanOrEqual(4.501);
      }
    }
  });

  it('the Moon limit cuts windows near a bright Moon (full Moon 2027-03-22)', () => {
    const full = computeNights(laSilla, '2027-03-22', '2027-03-22', 'nautical');
    const moonRaDeg = 180; // near the full Moon, opposite the Sun in late March
    const t = star('near-moon', moonRaDeg, 0);
    const without = computeWindows(laSilla, [t], full, base).windows;
    const withLimit = computeWindows(laSilla, [t], full, { ...base, moonSeparationDeg: 60 });
    const hours = (ws: { start: Date; end: Date }[]) => ws.reduce((s, w) => s + (w.end.getTime() - w.start.getTime()) / 3.6e6, 0);
    expect(hours(without)).toBeGreaterThan(3);
    expect(hours(withLimit.windows)).toBeLessThan(hours(without) - 1);
  });
});
