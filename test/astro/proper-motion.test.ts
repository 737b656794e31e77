import { describe, expect, it } from 'vitest';
import { properMotionJ2000 } from '../../src/astro/position.js';
import { angleBetweenDeg, unitVectorFromRaDec } from '../../src/astro/vectors.js';

describe('proper motion on the unit vector', () => {
  // astropy 5.2.1 SkyCoord(...).apply_space_motion(dt) with zero radial velocity at 1 kpc (straight-line
  // space motion), computed once: [RA, Dec, pmRA cos Dec, pmDec (mas/yr), years, RA', Dec'].
  // Stars within 0.01 deg of a pole, where a step in RA of pmRA / cos Dec is wrong by arcseconds.
  const cases: [number, number, number, number, number, number, number][] = [
    [37.95, 89.995, 200, -150, 30, 52.881417203, 89.993531594],
    [120, -89.998, -500, 300, 25, 79.624744497, -89.994640133],
  ];
  it.each(cases)('(%f, %f) moved by (%f, %f) mas/yr over %f years: within 1 mas of astropy', (raDeg, decDeg, pmRaMasYr, pmDecMasYr, years, ra2, dec2) => {
    const moved = properMotionJ2000({ raDeg, decDeg, pmRaMasYr, pmDecMasYr, epochYear: 2000 }, 2000 + years);
    const errMas = angleBetweenDeg(unitVectorFromRaDec(moved.raDeg, moved.decDeg), unitVectorFromRaDec(ra2, dec2)) * 3.6e6;
    expect(errMas).toBeLessThan(1);
  });

  it('moves a star on the equator by pm x t (common practice)', () => {
    const moved = properMotionJ2000({ raDeg: 10, decDeg: 0, pmRaMasYr: 3600, pmDecMasYr: -7200, epochYear: 2000 }, 2010);
    expect(moved.raDeg).toBeCloseTo(10 + 0.01, 7);
    expect(moved.decDeg).toBeCloseTo(-0.02, 7);
  });
});
