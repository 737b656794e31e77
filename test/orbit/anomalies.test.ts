import { describe, expect, it } from 'vitest';
import { eccentricFromTrueRad, trueAnomalyRad } from '../../src/orbit/anomalies.js';

describe('true and eccentric anomaly', () => {
  it('agrees with cos ν = (cos E − e) / (1 − e cos E)', () => {
    // A second form of the same relation (Meeus, Astronomical Algorithms, ch. 30, from memory).
    for (const ecc of [0, 0.1, 0.5, 0.9, 0.99]) {
      for (let j = 0; j <= 64; j++) {
        const e = (2 * Math.PI * j) / 64;
        const nu = trueAnomalyRad(e, ecc);
        expect(Math.cos(nu)).toBeCloseTo((Math.cos(e) - ecc) / (1 - ecc * Math.cos(e)), 12);
        expect(Math.sign(Math.sin(nu))).toBe(Math.sign(Math.sin(e))); // same half of the orbit
      }
    }
  });

  it('is fixed at periastron and apastron and stays in the revolution of E', () => {
    // Property: ν = E at E = 0 and E = π; ν − E stays under π in magnitude.
    expect(trueAnomalyRad(0, 0.6)).toBe(0);
    expect(trueAnomalyRad(Math.PI, 0.6)).toBeCloseTo(Math.PI, 14);
    for (const e of [-9, -3.2, 4, 7.5, 20]) expect(Math.abs(trueAnomalyRad(e, 0.8) - e)).toBeLessThan(Math.PI);
  });

  it('round-trips E -> ν -> E', () => {
    // Property: the two conversions are inverses.
    for (const ecc of [0, 0.3, 0.97]) {
      for (const e of [-5, -1, 0.2, 2.9, 3.3, 9]) expect(eccentricFromTrueRad(trueAnomalyRad(e, ecc), ecc)).toBeCloseTo(e, 11);
    }
  });
});
