import { describe, expect, it } from 'vitest';
import { altitudeForAirmassDeg, kastenYoungAirmass } from '../../src/astro/airmass.js';

describe('Kasten & Young airmass', () => {
  // Kasten & Young 1989, Applied Optics 28, 4735 (values computed from the formula, docs/references.md [KastenYoung1989]).
  it.each([
    [30, 1.994],
    [10, 5.586],
    [0, 37.92],
  ])('altitude %d deg gives %f', (altDeg, expected) => {
    expect(kastenYoungAirmass(altDeg)).toBeCloseTo(expected, 2);
  });

  it('is 1 at the zenith and grows monotonically towards the horizon (property)', () => {
    expect(kastenYoungAirmass(90)).toBeCloseTo(1, 3);
    for (let alt = 89; alt >= 0; alt--) expect(kastenYoungAirmass(alt)).toBeGreaterThan(kastenYoungAirmass(alt + 1));
  });

  it('is close to sec z high in the sky (plane-parallel limit, common practice)', () => {
    expect(kastenYoungAirmass(60)).toBeCloseTo(1 / Math.sin((60 * Math.PI) / 180), 2);
  });

  it('altitudeForAirmassDeg inverts it', () => {
    for (const x of [1.0001, 1.2, 2, 3, 10, 30]) expect(kastenYoungAirmass(altitudeForAirmassDeg(x))).toBeCloseTo(x, 6);
    expect(altitudeForAirmassDeg(2)).toBeCloseTo(29.92, 1);
  });
});
