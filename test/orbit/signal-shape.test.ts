import { describe, expect, it } from 'vitest';
import { radialVelocityMps } from '../../src/orbit/rv-curve.js';
import { periastronFromConjunctionBjd } from '../../src/orbit/periastron-time.js';
import { signalShape } from '../../src/orbit/signal-shape.js';
import { gaussianMean } from '../support/gaussian-mean.js';


describe('signal shape of a Keplerian orbit against phase from transit', () => {
  it('is -sin(2 pi phase) for a circular orbit, and its moments have the closed form (common practice)', () => {
    const shape = signalShape(0, 90);
    for (const phase of [0, 0.1, 0.25, 0.6, 0.93]) {
      expect(shape.at(phase)).toBeCloseTo(-Math.sin(2 * Math.PI * phase), 12);
      for (const sigma of [0, 0.004, 0.019, 0.021, 0.08, 0.3]) {
        const { m, q } = shape.moments(phase, sigma);
        expect(m).toBeCloseTo(-Math.sin(2 * Math.PI * phase) * Math.exp(-2 * Math.PI ** 2 * sigma ** 2), 9);
        expect(q).toBeCloseTo(0.5 - 0.5 * Math.cos(4 * Math.PI * phase) * Math.exp(-8 * Math.PI ** 2 * sigma ** 2), 9);
      }
    }
  });

  it('equals the RV curve with K = 1 at Tc + phase P, and e cos(omega) at transit where it falls', () => {
    for (const [ecc, omegaDeg] of [[0.3, 40], [0.6, 250], [0.1, 90]] as const) {
      const shape = signalShape(ecc, omegaDeg);
      const tc = 2461400.25;
      const periodDays = 7.3;
      const orbit = { kMps: 1, periodDays, ecc, omegaDeg, periastronBjd: periastronFromConjunctionBjd({ tcBjd: tc, periodDays, ecc, omegaDeg }) };
      for (const phase of [0.05, 0.3, 0.55, 0.8]) expect(shape.at(phase)).toBeCloseTo(radialVelocityMps(orbit, tc + phase * periodDays), 9);
      // At conjunction nu + omega = pi/2, so v = K e cos(omega), and dv/dnu = -K sin(nu + omega) = -K (geometry).
      expect(shape.at(0)).toBeCloseTo(ecc * Math.cos((omegaDeg * Math.PI) / 180), 9);
      expect(shape.at(1e-4)).toBeLessThan(shape.at(0));
    }
  });

  it('has moments that match brute-force averaging over the phase error, both below and above the quadrature switch', () => {
    const shape = signalShape(0.5, 120);
    for (const phase of [0.02, 0.37, 0.71]) {
      for (const sigma of [0.003, 0.015, 0.025, 0.06, 0.15]) {
        const { m, q } = shape.moments(phase, sigma);
        expect(m).toBeCloseTo(gaussianMean(shape.at, phase, sigma), 3);
        expect(q).toBeCloseTo(gaussianMean((p) => shape.at(p) ** 2, phase, sigma), 3);
      }
    }
  });
});
