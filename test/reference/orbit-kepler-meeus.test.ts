import { describe, expect, it } from 'vitest';
import { eccentricAnomalyRad } from '../../src/orbit/kepler-equation.js';

const DEG = Math.PI / 180;

describe("Kepler's equation against Meeus, Astronomical Algorithms, 2nd ed. 1998, ch. 30", () => {
  it('e = 0.100, M = 5 deg gives E = 5.554589 deg', () => {
    // docs/references.md [Meeus1998 ch. 30] (example 30.a)
    expect(eccentricAnomalyRad(5 * DEG, 0.1) / DEG).toBeCloseTo(5.554589, 6);
  });

  it('e = 0.99, M = 0.2 rad gives E = 1.066997365282 rad', () => {
    // docs/references.md [Meeus1998 ch. 30], high-eccentricity example
    expect(eccentricAnomalyRad(0.2, 0.99)).toBeCloseTo(1.066997365282, 12);
  });

  it('gives the same answers one revolution later and mirrored', () => {
    // Same check values (Meeus ch. 30), shifted by 2π and negated: E(M + 2π) = E(M) + 2π, E(−M) = −E(M).
    expect(eccentricAnomalyRad(0.2 + 2 * Math.PI, 0.99) - 2 * Math.PI).toBeCloseTo(1.066997365282, 11);
    expect(eccentricAnomalyRad(-0.2, 0.99)).toBeCloseTo(-1.066997365282, 12);
  });
});
