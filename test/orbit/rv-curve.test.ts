import { describe, expect, it } from 'vitest';
import { periastronFromConjunctionBjdTdb } from '../../src/orbit/periastron-time.js';
import { radialVelocityMps, trueAnomalyAtRad, type RvOrbit } from '../../src/orbit/rv-curve.js';

const DEG = Math.PI / 180;
const TC = 2_461_400.25;

function orbitFromTc(ecc: number, omegaDeg: number, tcBjdTdb = TC, periodDays = 6.3, kMps = 12): RvOrbit {
  return { kMps, periodDays, ecc, omegaDeg, gammaMps: -3.5, periastronBjdTdb: periastronFromConjunctionBjdTdb({ tcBjdTdb, periodDays, ecc, omegaDeg }) };
}

/**
 * The star's distance behind the barycentre, in units of a★ sin i: z = r sin(ν + ω) with
 * r = (1 − e²) / (1 + e cos ν) (the ellipse in polar form). Its time derivative is the RV,
 * dz/dt = (v − γ) · 2π / (K P √(1 − e²)) (docs/references.md [Reflex-orbit]: K = 2π a★ sin i / (P √(1 − e²))).
 */
function depth(orbit: RvOrbit, t: number): number {
  const nu = trueAnomalyAtRad(orbit, t);
  return ((1 - orbit.ecc ** 2) / (1 + orbit.ecc * Math.cos(nu))) * Math.sin(nu + orbit.omegaDeg * DEG);
}

const SHAPES: [number, number][] = [
  [0, 90],
  [0, 17],
  [0.2, 40],
  [0.5, 250],
  [0.9, 300],
  [0.97, 100],
];

describe('Keplerian RV curve', () => {
  it('is v = γ − K sin(2π (t − Tc)/P) for a circular orbit', () => {
    // docs/references.md [Kepler-RV]: circular orbit with mid-transit time Tc (common practice).
    for (const omegaDeg of [90, 0, 200]) {
      const orbit = orbitFromTc(0, omegaDeg);
      for (let j = 0; j < 50; j++) {
        const t = TC - 20 + j * 0.83;
        // 1e-7 m/s: a full BJD carries ~5e-10 d of rounding, worth ~6e-9 m/s here.
        expect(radialVelocityMps(orbit, t)).toBeCloseTo(-3.5 - 12 * Math.sin((2 * Math.PI * (t - TC)) / 6.3), 7);
      }
    }
  });

  it.each(SHAPES)("is the time derivative of the star's position (e = %s, ω = %s°)", (ecc, omegaDeg) => {
    // Property: v − γ = dz/dt, checked by central differences of the orbit's geometry. Times near
    // zero keep every bit of t ± h (a full BJD leaves only ~1e-10 d of resolution).
    const orbit = orbitFromTc(ecc, omegaDeg, 0.4);
    const h = orbit.periodDays * 1e-6;
    const scale = (orbit.kMps * orbit.periodDays * Math.sqrt(1 - ecc * ecc)) / (2 * Math.PI);
    for (let j = 0; j < 200; j++) {
      const t = (j / 200) * orbit.periodDays;
      const dzdt = (depth(orbit, t + h) - depth(orbit, t - h)) / (2 * h);
      expect(Math.abs(radialVelocityMps(orbit, t) - orbit.gammaMps! - scale * dzdt)).toBeLessThan(1e-5 * orbit.kMps);
    }
  });

  it.each(SHAPES)('averages to γ over one period (e = %s, ω = %s°)', (ecc, omegaDeg) => {
    // Property: the orbit closes, so ∫ (v − γ) dt over a period is zero; this checks the e cos ω term.
    const orbit = orbitFromTc(ecc, omegaDeg);
    const n = 200_000;
    let sum = 0;
    for (let j = 0; j < n; j++) sum += radialVelocityMps(orbit, TC + ((j + 0.5) / n) * orbit.periodDays);
    expect(sum / n).toBeCloseTo(-3.5, 3);
  });

  it.each(SHAPES)('puts the star straight behind the planet at Tc (e = %s, ω = %s°)', (ecc, omegaDeg) => {
    // Property of the conjunction: from Tc back through T_p, Kepler's equation and ν, the offset
    // along the line of nodes r cos(ν + ω) is zero and the star is behind (sin(ν + ω) = 1).
    // 1e-6 rad: a full BJD's ~5e-10 d rounding is amplified up to ~300 times near periastron at e = 0.97.
    for (const epoch of [0, 3, -11]) {
      const orbit = orbitFromTc(ecc, omegaDeg);
      const nu = trueAnomalyAtRad(orbit, TC + epoch * orbit.periodDays);
      expect(Math.cos(nu + omegaDeg * DEG)).toBeCloseTo(0, 6);
      expect(Math.sin(nu + omegaDeg * DEG)).toBeCloseTo(1, 6);
    }
    // The star's RV falls through the transit: dv/dt = −K sin(ν + ω) dν/dt < 0.
    const orbit = orbitFromTc(ecc, omegaDeg);
    expect(radialVelocityMps(orbit, TC + 1e-4) - radialVelocityMps(orbit, TC - 1e-4)).toBeLessThan(0);
  });

  it('repeats every period', () => {
    // Property: v(t + P) = v(t).
    const orbit = orbitFromTc(0.6, 123);
    for (const t of [TC, TC + 1.7, TC - 40.2]) expect(radialVelocityMps(orbit, t + 5 * orbit.periodDays)).toBeCloseTo(radialVelocityMps(orbit, t), 9);
  });
});
