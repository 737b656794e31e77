import { describe, expect, it } from 'vitest';
import { EARTH_PER_JUPITER } from '../../src/astro/constants.js';
import { summarizeOrbit } from '../../src/orbit/summary.js';

describe('orbit summary', () => {
  it('reports the Sun–Jupiter pair in unit-named fields', () => {
    // Jupiter about the Sun: a = 5.2026 au, orbital speed 13.07 km/s, K = 12.5 m/s
    // (common practice, from memory; Jupiter's e = 0.048 ignored here).
    const s = summarizeOrbit({ starMassSun: 1, planetMassEarth: EARTH_PER_JUPITER, periodDays: 4332.59 });
    expect(s.semiMajorAxisAu).toBeCloseTo(5.2026, 3);
    expect(s.planetSpeedKmps).toBeCloseTo(13.06, 1);
    expect(s.kMps).toBeCloseTo(12.5, 1);
    expect(s.massJupiter).toBeCloseTo(1, 12);
  });

  it('projects the mass and the star orbit with sin i', () => {
    // Property: m sin i and a★ sin i scale with sin 30° = 1/2.
    const s = summarizeOrbit({ starMassSun: 0.6, planetMassEarth: 40, periodDays: 9, inclinationDeg: 30 });
    expect(s.msiniEarth).toBeCloseTo(20, 12);
    expect(s.starOrbitProjectedKm / s.starOrbitRadiusKm).toBeCloseTo(0.5, 12);
  });
});
