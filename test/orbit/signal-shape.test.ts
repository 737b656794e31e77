import { describe, expect, it } from 'vitest';
import { radialVelocityMps } from '../../src/orbit/rv-curve.js';
import { periastronFromConjunctionBjdTdb } from '../../src/orbit/periastron-time.js';
import { signalShape } from '../../src/orbit/signal-shape.js';

describe('signal shape of a Keplerian orbit against phase from transit', () => {
  it('is -sin(2 pi phase) for a circular orbit, with slope -2 pi cos(2 pi phase) (common practice)', () => {
    const shape = signalShape(0, 90);
    for (const phase of [0, 0.1, 0.25, 0.6, 0.93]) {
      expect(shape.at(phase)).toBeCloseTo(-Math.sin(2 * Math.PI * phase), 12);
      expect(shape.slope(phase)).toBeCloseTo(-2 * Math.PI * Math.cos(2 * Math.PI * phase), 12);
    }
  });

  it('equals the RV curve with K = 1 at Tc + phase P, and e cos(omega) at transit where it falls', () => {
    for (const [ecc, omegaDeg] of [
      [0.3, 40],
      [0.6, 250],
      [0.1, 90],
    ] as const) {
      const shape = signalShape(ecc, omegaDeg);
      const tc = 2461400.25;
      const periodDays = 7.3;
      const orbit = { kMps: 1, periodDays, ecc, omegaDeg, periastronBjdTdb: periastronFromConjunctionBjdTdb({ tcBjdTdb: tc, periodDays, ecc, omegaDeg }) };
      for (const phase of [0.05, 0.3, 0.55, 0.8]) expect(shape.at(phase)).toBeCloseTo(radialVelocityMps(orbit, tc + phase * periodDays), 9);
      // At conjunction nu + omega = pi/2, so v = K e cos(omega), and dv/dnu = -K sin(nu + omega) = -K (geometry).
      expect(shape.at(0)).toBeCloseTo(ecc * Math.cos((omegaDeg * Math.PI) / 180), 9);
      expect(shape.at(1e-4)).toBeLessThan(shape.at(0));
    }
  });

  it('has a slope equal to a central difference of the RV curve (e up to 0.8)', () => {
    for (const [ecc, omegaDeg] of [
      [0.5, 120],
      [0.8, 300],
      [0.05, 10],
    ] as const) {
      const periodDays = 3.1;
      const orbit = { kMps: 1, periodDays, ecc, omegaDeg, periastronBjdTdb: periastronFromConjunctionBjdTdb({ tcBjdTdb: 0, periodDays, ecc, omegaDeg }) };
      const shape = signalShape(ecc, omegaDeg);
      const h = 1e-6;
      for (const phase of [0.02, 0.37, 0.71, 0.9]) {
        const numeric = (radialVelocityMps(orbit, (phase + h) * periodDays) - radialVelocityMps(orbit, (phase - h) * periodDays)) / (2 * h);
        expect(shape.slope(phase)).toBeCloseTo(numeric, 4);
      }
    }
  });
});
