import { describe, expect, it } from 'vitest';
import { EARTH_PER_JUPITER, EARTH_PER_SUN, GM_EARTH, GM_SUN } from '../../src/astro/constants.js';
import { massFunctionGm, planetMassFromKApproxEarth, planetMassFromKEarth } from '../../src/orbit/minimum-mass.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';

/** Masses from 0.1 Earth masses to 80 Jupiter masses, evenly in log. */
const MASSES_EARTH = Array.from({ length: 41 }, (_, i) => 0.1 * ((80 * EARTH_PER_JUPITER) / 0.1) ** (i / 40));
const SYSTEMS = [
  { starMassSun: 0.08, periodDays: 0.3, ecc: 0, inclinationDeg: 90 },
  { starMassSun: 0.5, periodDays: 5, ecc: 0.2, inclinationDeg: 90 },
  { starMassSun: 1, periodDays: 365.25, ecc: 0.6, inclinationDeg: 45 },
  { starMassSun: 2.5, periodDays: 3000, ecc: 0.95, inclinationDeg: 5 },
];

describe('planet mass from K (the exact inverse)', () => {
  it.each(SYSTEMS)('inverse(forward(m)) = m to 1e-9 from 0.1 Earth to 80 Jupiter masses (%o)', (system) => {
    // Property: the inverse undoes the forward formula of docs/references.md [K-formula].
    for (const massEarth of MASSES_EARTH) {
      const kMps = semiAmplitudeMps({ ...system, planetMassEarth: massEarth });
      const back = planetMassFromKEarth({ ...system, kMps });
      expect(Math.abs(back / massEarth - 1)).toBeLessThan(1e-9);
    }
  });

  it('solves the mass function (m sin i)³ / (M★ + m)² = P K³ (1 − e²)^(3/2) / 2πG', () => {
    // docs/references.md [Mass-function]: the mass found satisfies the mass function to rounding.
    const input = { starMassSun: 0.7, kMps: 3000, periodDays: 2.5, ecc: 0.4, inclinationDeg: 70 };
    const m = planetMassFromKEarth(input) * GM_EARTH;
    const sinI = Math.sin((70 * Math.PI) / 180);
    const f = (m * sinI) ** 3 / (0.7 * GM_SUN + m) ** 2;
    expect(f / massFunctionGm(input)).toBeCloseTo(1, 12);
  });

  it('lies above the m << M★ approximation by exactly (1 + m/M★)^(2/3)', () => {
    // Algebra of the mass function: m = f^(1/3) (M★ + m)^(2/3) / sin i, while the approximation drops m.
    for (const kMps of [0.1, 10, 1000, 30_000]) {
      const input = { starMassSun: 0.9, kMps, periodDays: 11 };
      const exact = planetMassFromKEarth(input);
      const approx = planetMassFromKApproxEarth(input);
      expect(exact).toBeGreaterThan(approx);
      expect(exact / approx).toBeCloseTo((1 + exact / (0.9 * EARTH_PER_SUN)) ** (2 / 3), 12);
    }
  });

  it('agrees with the approximation for an Earth-mass planet', () => {
    // Property: for m/M★ ~ 3e-6 the two differ by (2/3)·3e-6.
    const input = { starMassSun: 1, kMps: 0.0895, periodDays: 365.25 };
    expect(planetMassFromKApproxEarth(input) / planetMassFromKEarth(input)).toBeCloseTo(1, 5);
  });

  it('finds a companion heavier than its star', () => {
    // Property: the solver has no m << M★ limit; forward K of a 2 M★ companion is inverted.
    const system = { starMassSun: 0.2, periodDays: 10, ecc: 0.1 };
    const massEarth = 0.4 * EARTH_PER_SUN;
    const kMps = semiAmplitudeMps({ ...system, planetMassEarth: massEarth });
    expect(planetMassFromKEarth({ ...system, kMps }) / massEarth).toBeCloseTo(1, 10);
  });
});
