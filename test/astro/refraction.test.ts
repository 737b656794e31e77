import { describe, expect, it } from 'vitest';
import { pressureHpaAtElevation } from '../../src/astro/pressure.js';
import { apparentAltitudeDeg, trueAltitudeDeg } from '../../src/astro/refraction.js';

describe('pressure at a site elevation (barometric formula of the standard atmosphere)', () => {
  // U.S. Standard Atmosphere 1976 in SI units (pascals at altitudes converted from feet), as
  // tabulated by engineersedge.com, "Standard Atmospheric Data for Altitude and Temperature".
  it.each([
    [0, 1013.253],
    [914.4, 908.246],
    [1524.0, 843.229],
    [2438.4, 752.494],
    [3048.0, 696.922],
    [4572.0, 571.989],
  ])('%f m: %f hPa within 0.3 hPa', (elevationM, hpa) => {
    expect(Math.abs(pressureHpaAtElevation(elevationM) - hpa)).toBeLessThan(0.3);
  });
});

describe('refraction scaled to the site pressure', () => {
  // erfa.refco (pyerfa 2.0, the refraction model behind astropy's AltAz), 10 C, dry air, 0.55 um,
  // computed once: refraction in arcsec at geometric altitudes 20, 30, 45, 60 deg.
  const erfa: Record<number, [number, number, number, number]> = {
    1010: [157.829, 100.132, 57.973, 33.502],
    756.26: [118.216, 74.989, 43.413, 25.087],
    616.4: [96.37, 61.126, 35.386, 20.449],
  };
  const altitudes = [20, 30, 45, 60];
  const refractionSec = (altDeg: number, hpa: number) => (apparentAltitudeDeg(altDeg, hpa) - altDeg) * 3600;

  it('falls with pressure as erfa.refco does: ratios to 1010 hPa within 0.5%', () => {
    for (const hpa of [756.26, 616.4]) {
      altitudes.forEach((alt, i) => {
        const ratio = refractionSec(alt, hpa) / refractionSec(alt, 1010);
        expect(Math.abs(ratio / (erfa[hpa]![i]! / erfa[1010]![i]!) - 1)).toBeLessThan(0.005);
      });
    }
  });

  it('agrees with erfa.refco within 5% above 20 deg (Saemundsson with its 1.02 factor is 4% higher)', () => {
    for (const hpa of [1010, 756.26, 616.4]) {
      altitudes.forEach((alt, i) => {
        expect(Math.abs(refractionSec(alt, hpa) / erfa[hpa]![i]! - 1)).toBeLessThan(0.05);
      });
    }
  });

  it('trueAltitudeDeg inverts apparentAltitudeDeg at any pressure (property)', () => {
    for (const hpa of [1013.25, 600]) {
      for (const alt of [-1, 0, 0.5, 5, 20, 60, 89]) expect(apparentAltitudeDeg(trueAltitudeDeg(alt, hpa), hpa)).toBeCloseTo(alt, 9);
    }
  });
});
