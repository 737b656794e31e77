import { describe, expect, it } from 'vitest';
import { nearestEpoch, phaseAt, phaseErrCycles, tcAtEpochBjdTdb, tcErrAtEpochDays } from '../../src/orbit/ephemeris.js';
import type { Ephemeris } from '../../src/model.js';

const EPH: Ephemeris = { tcBjdTdb: 2_461_342.6124, tcErrDays: 0.0011, periodDays: 3.41872, periodErrDays: 0.00012 };

/** A seeded normal generator (mulberry32 + Box–Muller), for the Monte Carlo check. */
function normals(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

describe('ephemeris propagation', () => {
  it('finds the nearest epoch and its transit time, before and after Tc', () => {
    // Arithmetic: Tc(n) = Tc + n P.
    expect(nearestEpoch(EPH, EPH.tcBjdTdb + 100 * EPH.periodDays + 1.6)).toBe(100);
    expect(nearestEpoch(EPH, EPH.tcBjdTdb + 100 * EPH.periodDays + 1.8)).toBe(101);
    expect(nearestEpoch(EPH, EPH.tcBjdTdb - 7 * EPH.periodDays)).toBe(-7);
    expect(tcAtEpochBjdTdb(EPH, -7)).toBeCloseTo(EPH.tcBjdTdb - 7 * 3.41872, 9);
  });

  it('grows σ_Tc(n) as √(σ_T0² + n² σ_P²), matching a Monte Carlo of the ephemeris', () => {
    // docs/references.md [Ephemeris-propagation] (common practice); checked against 40 000 seeded draws of (Tc, P).
    const draw = normals(7);
    for (const n of [0, 30, 300]) {
      let sum = 0;
      let sumSq = 0;
      const trials = 40_000;
      for (let i = 0; i < trials; i++) {
        const tc =
          tcAtEpochBjdTdb({ ...EPH, tcBjdTdb: EPH.tcBjdTdb + EPH.tcErrDays * draw(), periodDays: EPH.periodDays + EPH.periodErrDays * draw() }, n) -
          tcAtEpochBjdTdb(EPH, n);
        sum += tc;
        sumSq += tc * tc;
      }
      const sd = Math.sqrt(sumSq / trials - (sum / trials) ** 2);
      expect(sd / tcErrAtEpochDays(EPH, n)).toBeGreaterThan(0.97);
      expect(sd / tcErrAtEpochDays(EPH, n)).toBeLessThan(1.03);
    }
  });

  it('gives phases in [0, 1) with 0 at transit and 0.25 a quarter period later', () => {
    // Definition (docs/references.md [Kepler-RV]: quadratures at phases 0.25 and 0.75).
    const atTransit = phaseAt(EPH, EPH.tcBjdTdb + 12 * EPH.periodDays);
    expect(Math.min(atTransit, 1 - atTransit)).toBeLessThan(1e-9); // 0, or just below 1 by rounding
    expect(phaseAt(EPH, EPH.tcBjdTdb + 12.25 * EPH.periodDays)).toBeCloseTo(0.25, 9);
    expect(phaseAt(EPH, EPH.tcBjdTdb - 0.25 * EPH.periodDays)).toBeCloseTo(0.75, 9);
    for (let j = 0; j < 500; j++) {
      const p = phaseAt(EPH, EPH.tcBjdTdb - 900 + j * 3.7);
      expect(p).toBeGreaterThanOrEqual(0);
      expect(p).toBeLessThan(1);
    }
  });

  it('gives the phase error σ_Tc(n) / P at a transit epoch, and more between epochs later on', () => {
    // Property: at an integer epoch the phase error is the transit-time error in cycles.
    for (const n of [-40, 0, 250]) {
      expect(phaseErrCycles(EPH, tcAtEpochBjdTdb(EPH, n))).toBeCloseTo(tcErrAtEpochDays(EPH, n) / EPH.periodDays, 12);
    }
    expect(phaseErrCycles(EPH, tcAtEpochBjdTdb(EPH, 250.5))).toBeGreaterThan(phaseErrCycles(EPH, tcAtEpochBjdTdb(EPH, 250)));
  });
});
