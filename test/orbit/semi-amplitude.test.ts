import { describe, expect, it } from 'vitest';
import { EARTH_PER_SUN } from '../../src/astro/constants.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';

const base = { starMassSun: 0.8, planetMassEarth: 10, periodDays: 12 };

describe('semi-amplitude K: properties of K = (2πG/P)^(1/3) m sin i (M★ + m)^(−2/3) / √(1 − e²)', () => {
  it('scales as P^(−1/3)', () => {
    // Property of the formula (docs/references.md [K-formula]): eight times the period halves K.
    for (const periodDays of [0.5, 3, 40, 1000]) {
      const ratio = semiAmplitudeMps({ ...base, periodDays: 8 * periodDays }) / semiAmplitudeMps({ ...base, periodDays });
      expect(ratio).toBeCloseTo(0.5, 13);
    }
  });

  it('is linear in m sin i when m << M★', () => {
    // Property: K ∝ m (M★ + m)^(−2/3); for m/M★ ~ 1e-6 the non-linearity is (2/3)·1e-6.
    const k1 = semiAmplitudeMps({ ...base, planetMassEarth: 0.3 });
    for (const factor of [2, 5, 10]) {
      const ratio = semiAmplitudeMps({ ...base, planetMassEarth: 0.3 * factor }) / k1;
      expect(Math.abs(ratio / factor - 1)).toBeLessThan(1e-5);
    }
  });

  it('departs from linearity by (1 + m/M★)^(−2/3) for a massive companion', () => {
    // Property of the formula: doubling m from M★/10 changes K by 2 ((M★ + m)/(M★ + 2m))^(2/3).
    const mEarth = 0.1 * 0.8 * EARTH_PER_SUN; // a tenth of the star
    const ratio = semiAmplitudeMps({ ...base, planetMassEarth: 2 * mEarth }) / semiAmplitudeMps({ ...base, planetMassEarth: mEarth });
    expect(ratio).toBeCloseTo(2 * (1.1 / 1.2) ** (2 / 3), 6);
  });

  it('scales with sin i and 1/√(1 − e²)', () => {
    // Property of the formula (docs/references.md [K-formula]).
    const k = semiAmplitudeMps(base);
    expect(semiAmplitudeMps({ ...base, inclinationDeg: 30 }) / k).toBeCloseTo(0.5, 13);
    expect(semiAmplitudeMps({ ...base, ecc: 0.6 }) / k).toBeCloseTo(1.25, 13);
  });
});
