import { describe, expect, it } from 'vitest';
import { AU_M, EARTH_PER_SUN } from '../../src/astro/constants.js';
import { periodDaysFromAu, semiMajorAxisAu } from '../../src/orbit/kepler-third-law.js';
import { orbitalSpeedsMps, projectedStarOrbitM, starOrbitRadiusM } from '../../src/orbit/reflex.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';

const CASES = [
  { starMassSun: 1, planetMassEarth: 1, periodDays: 365.25, ecc: 0, inclinationDeg: 90 },
  { starMassSun: 0.3, planetMassEarth: 5, periodDays: 4.2, ecc: 0.3, inclinationDeg: 60 },
  { starMassSun: 1.4, planetMassEarth: 3000, periodDays: 800, ecc: 0.9, inclinationDeg: 12 },
  { starMassSun: 0.1, planetMassEarth: 80 * 317.8, periodDays: 1.1, ecc: 0.5, inclinationDeg: 89 },
];

describe('reflex orbit of the star', () => {
  it.each(CASES)('a★ sin i = K P √(1 − e²) / 2π (%o)', (orbit) => {
    // docs/references.md [Reflex-orbit]: the identity ties K to the star's orbit.
    const kMps = semiAmplitudeMps(orbit);
    const projected = projectedStarOrbitM({ kMps, periodDays: orbit.periodDays, ecc: orbit.ecc });
    const sinI = Math.sin((orbit.inclinationDeg * Math.PI) / 180);
    expect(projected / (starOrbitRadiusM(orbit) * sinI)).toBeCloseTo(1, 12);
  });

  it.each(CASES)('momentum balance M★ v★ = m_p v_p (%o)', (orbit) => {
    // docs/references.md [Reflex-orbit]: momentum balance about the barycentre.
    const { planetMps, starMps } = orbitalSpeedsMps(orbit);
    expect((orbit.starMassSun * EARTH_PER_SUN * starMps) / (orbit.planetMassEarth * planetMps)).toBeCloseTo(1, 12);
  });

  it.each(CASES)('the star travels its orbit 2π a★ in one period at r = a for a circular orbit (%o)', (orbit) => {
    // Common practice: for a circular orbit the star's speed is 2π a★ / P, and K = v★ sin i.
    const circular = { ...orbit, ecc: 0 };
    const { starMps } = orbitalSpeedsMps(circular);
    expect(starMps / ((2 * Math.PI * starOrbitRadiusM(circular)) / (orbit.periodDays * 86_400))).toBeCloseTo(1, 12);
    const sinI = Math.sin((orbit.inclinationDeg * Math.PI) / 180);
    expect((starMps * sinI) / semiAmplitudeMps(circular)).toBeCloseTo(1, 12);
  });

  it('puts a Jupiter-like planet at 5.20 au after 4332.6 days', () => {
    // Jupiter: sidereal period 4332.59 d, semi-major axis 5.2026 au (common practice, from memory).
    expect(semiMajorAxisAu({ starMassSun: 1, planetMassEarth: 317.83, periodDays: 4332.59 })).toBeCloseTo(5.2026, 3);
  });

  it("inverts Kepler's third law", () => {
    // Property: P(a(P)) = P.
    for (const orbit of CASES) {
      const aAu = semiMajorAxisAu(orbit);
      expect(periodDaysFromAu({ ...orbit, semiMajorAxisAu: aAu }) / orbit.periodDays).toBeCloseTo(1, 12);
    }
  });

  it('gives the star about 450 km of reflex orbit from the Earth', () => {
    // Common practice, from memory: the Sun moves about 450 km about the Earth–Sun barycentre.
    const aStarKm = starOrbitRadiusM({ starMassSun: 1, planetMassEarth: 1, periodDays: 365.256 }) / 1000;
    expect(aStarKm).toBeGreaterThan(440);
    expect(aStarKm).toBeLessThan(460);
    expect(aStarKm / (AU_M / 1000 / EARTH_PER_SUN)).toBeCloseTo(1, 5);
  });
});
