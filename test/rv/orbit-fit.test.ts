import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/errors.js';
import { periastronFromConjunctionBjdTdb } from '../../src/orbit/periastron-time.js';
import { radialVelocityMps } from '../../src/orbit/rv-curve.js';
import { BLIND_PEAK_FAP, blindPeak } from '../../src/rv/blind-peak.js';
import { fitOrbits, type FitPlanetPrior, type FitPoint } from '../../src/rv/orbit-fit.js';
import { createRng, type Rng } from '../../src/rv/random.js';
import { leastSquares } from './least-squares.js';

// Invented planets of invented stars.
interface Truth {
  kMps: number;
  periodDays: number;
  tcBjdTdb: number;
  ecc?: number;
  omegaDeg?: number;
}

/** v(t) of the true orbits (src/orbit), plus an offset per instrument. */
function truthRv(truths: Truth[], t: number, gammaMps: number): number {
  return truths.reduce((v, tr) => {
    const ecc = tr.ecc ?? 0;
    const omegaDeg = tr.omegaDeg ?? 90;
    const periastronBjdTdb = periastronFromConjunctionBjdTdb({ tcBjdTdb: tr.tcBjdTdb, periodDays: tr.periodDays, ecc, omegaDeg });
    return v + radialVelocityMps({ kMps: tr.kMps, periodDays: tr.periodDays, ecc, omegaDeg, periastronBjdTdb }, t);
  }, gammaMps);
}

function simulate(
  truths: Truth[],
  times: number[],
  rvErrorMps: number,
  rng: Rng | null,
  instrumentOf: (i: number) => string = () => 'echelle-a',
  gammas: Record<string, number> = { 'echelle-a': 3 },
): FitPoint[] {
  return times.map((bjd, i) => {
    const instrument = instrumentOf(i);
    return { bjdTdb: bjd, instrument, rvErrorMps, rvMps: truthRv(truths, bjd, gammas[instrument]!) + (rng ? rvErrorMps * rng.normal() : 0) };
  });
}

/** n visit times over `spanDays` from `startBjdTdb`, one per night at a random hour. */
function visitTimes(rng: Rng, n: number, startBjdTdb: number, spanDays: number): number[] {
  return Array.from({ length: n }, (_, i) => startBjdTdb + (i * spanDays) / (n - 1) + 0.3 * rng.uniform()).sort((a, b) => a - b);
}

/** The phase difference, in days, of two Tc's of the same period (any number of orbits apart). */
function tcOffsetDays(a: number, b: number, periodDays: number): number {
  const d = (a - b) / periodDays;
  return (d - Math.round(d)) * periodDays;
}

const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;
const sd = (v: number[]) => Math.sqrt(v.reduce((s, x) => s + (x - mean(v)) ** 2, 0) / (v.length - 1));

describe('fitOrbits', () => {
  it('recovers K, Tc, P and γ from noise-free data (property: the truth is the minimum)', () => {
    const rng = createRng(11);
    const truth: Truth = { kMps: 10, periodDays: 4.3, tcBjdTdb: 2461000.4 };
    const points = simulate([truth], visitTimes(rng, 14, 2461030, 20), 0.01, null);
    // Catalogue 0.03 d and 0.002 d off the truth, with priors wide against the data's information.
    const prior: FitPlanetPrior = {
      id: 'Orvel-2 b',
      periodDays: 4.302,
      periodErrDays: 0.01,
      tcBjdTdb: 2461000.43,
      tcErrDays: 0.2,
      kMps: 7,
      ecc: 0,
      omegaDeg: 90,
    };
    const fit = fitOrbits([prior], points, 0);
    const pl = fit.planets[0]!;
    expect(fit.converged).toBe(true);
    expect(pl.kMps).toBeCloseTo(10, 3);
    expect(pl.periodDays).toBeCloseTo(4.3, 6);
    expect(Math.abs(tcOffsetDays(pl.tcBjdTdb, truth.tcBjdTdb, truth.periodDays))).toBeLessThan(1e-5);
    expect(fit.offsets[0]!.gammaMps).toBeCloseTo(3, 3);
    expect(fit.rmsMps).toBeLessThan(1e-3);
    // The reported Tc lies at the epoch of the data, not at the catalogue's (≈ 7 orbits later).
    expect(Math.round((pl.tcBjdTdb - prior.tcBjdTdb) / prior.periodDays)).toBeGreaterThan(3);
  });

  it('reaches the minimum of a dense grid of the penalised χ² over (Tc, P), K and γ solved linearly (slow reference)', () => {
    const rng = createRng(12);
    const truth: Truth = { kMps: 9, periodDays: 6.1, tcBjdTdb: 2461010.2 };
    const sigma = 2;
    const points = simulate([truth], visitTimes(rng, 12, 2461040, 16), sigma, rng);
    const prior: FitPlanetPrior = { id: 'Sanu b', periodDays: 6.1, periodErrDays: 0.004, tcBjdTdb: 2461010.3, tcErrDays: 0.15, kMps: 9, ecc: 0, omegaDeg: 90 };
    const fit = fitOrbits([prior], points, 0);
    // Reference: for circular orbits v = γ + K cos(ν + ω) is linear in (γ, K) at fixed (Tc, P) (least squares by Gauss–Jordan, test/rv/least-squares.ts).
    const penalised = (tc: number, period: number) => {
      const design = points.map((pt) => [1, truthRv([{ kMps: 1, periodDays: period, tcBjdTdb: tc }], pt.bjdTdb, 0)]);
      const { coef } = leastSquares(
        design,
        points.map((pt) => pt.rvMps),
        sigma,
      );
      const data = points.reduce((s, pt, i) => s + ((pt.rvMps - coef[0]! - coef[1]! * design[i]![1]!) / sigma) ** 2, 0);
      return data + ((tc - prior.tcBjdTdb) / prior.tcErrDays) ** 2 + ((period - prior.periodDays) / prior.periodErrDays) ** 2;
    };
    let best = { chi2: Infinity, tc: 0, period: 0 };
    const cells = 160;
    for (let a = 0; a <= cells; a++) {
      for (let b = 0; b <= cells; b++) {
        const tc = prior.tcBjdTdb + 3 * prior.tcErrDays * ((2 * a) / cells - 1);
        const period = prior.periodDays + 3 * prior.periodErrDays * ((2 * b) / cells - 1);
        const chi2 = penalised(tc, period);
        if (chi2 < best.chi2) best = { chi2, tc, period };
      }
    }
    const pl = fit.planets[0]!;
    const epochs = Math.round((pl.tcBjdTdb - prior.tcBjdTdb) / pl.periodDays);
    const fittedTc0 = pl.tcBjdTdb - epochs * pl.periodDays;
    // Same optimum: within one grid cell, and never above the grid's minimum.
    expect(Math.abs(fittedTc0 - best.tc)).toBeLessThan((6 * prior.tcErrDays) / cells);
    expect(Math.abs(pl.periodDays - best.period)).toBeLessThan((6 * prior.periodErrDays) / cells);
    expect(penalised(fittedTc0, pl.periodDays)).toBeLessThanOrEqual(best.chi2 + 1e-6);
  });

  it('Tc 2σ from the catalogue: over 200 seeded trials the stated 1σ and 2σ of Tc and σ_K hold', () => {
    const rng = createRng(13);
    const catalogue: FitPlanetPrior = {
      id: 'Tekla b',
      periodDays: 5.2,
      periodErrDays: 0.002,
      tcBjdTdb: 2461000.5,
      tcErrDays: 0.5,
      kMps: 10,
      ecc: 0,
      omegaDeg: 90,
    };
    // Phase error of the catalogue ≈ 0.1 cycles; the truth sits 2σ (1 d) from the catalogue Tc.
    const truth: Truth = { kMps: 10, periodDays: 5.2, tcBjdTdb: catalogue.tcBjdTdb + 2 * catalogue.tcErrDays };
    const times = visitTimes(rng, 10, 2461100, 14);
    const within1: boolean[] = [];
    const within2: boolean[] = [];
    const ks: number[] = [];
    const kErrs: number[] = [];
    for (let trial = 0; trial < 200; trial++) {
      const fit = fitOrbits([catalogue], simulate([truth], times, 2, rng), 0);
      const pl = fit.planets[0]!;
      const z = Math.abs(tcOffsetDays(pl.tcBjdTdb, truth.tcBjdTdb, truth.periodDays)) / pl.tcErrDays;
      within1.push(z < 1);
      within2.push(z < 2);
      ks.push(pl.kMps);
      kErrs.push(pl.kErrMps);
    }
    const f1 = within1.filter(Boolean).length / 200;
    const f2 = within2.filter(Boolean).length / 200;
    const kRatio = sd(ks) / mean(kErrs);
    console.log(`Tc within 1σ: ${f1}, within 2σ: ${f2}; scatter of K / stated σ_K: ${kRatio.toFixed(3)} (mean K ${mean(ks).toFixed(2)})`);
    // A Gaussian's 68.3% and 95.4% (common practice), less a little for the pull of the off-centre prior.
    expect(f1).toBeGreaterThanOrEqual(0.6);
    expect(f1).toBeLessThanOrEqual(0.76);
    expect(f2).toBeGreaterThanOrEqual(0.9);
    expect(kRatio).toBeGreaterThan(0.85);
    expect(kRatio).toBeLessThan(1.15);
  });

  it('fits two planets jointly, one of them eccentric with a prior on e cos ω and e sin ω', () => {
    const rng = createRng(14);
    const truths: Truth[] = [
      { kMps: 8, periodDays: 3.1, tcBjdTdb: 2461000.2 },
      { kMps: 5, periodDays: 7.7, tcBjdTdb: 2461002.9, ecc: 0.2, omegaDeg: 60 },
    ];
    const points = simulate(truths, visitTimes(rng, 36, 2461020, 30), 1, rng);
    const priors: FitPlanetPrior[] = [
      { id: 'Orvel-3 b', periodDays: 3.1005, periodErrDays: 0.001, tcBjdTdb: 2461000.22, tcErrDays: 0.05, kMps: 6, ecc: 0, omegaDeg: 90 },
      { id: 'Orvel-3 c', periodDays: 7.698, periodErrDays: 0.003, tcBjdTdb: 2461002.85, tcErrDays: 0.1, kMps: 6, ecc: 0.15, omegaDeg: 70, eccSigma: 0.1 },
    ];
    const fit = fitOrbits(priors, points, 0);
    expect(fit.converged).toBe(true);
    fit.planets.forEach((pl, k) => {
      const tr = truths[k]!;
      expect(Math.abs(pl.kMps - tr.kMps)).toBeLessThan(4 * pl.kErrMps);
      expect(Math.abs(pl.periodDays - tr.periodDays)).toBeLessThan(4 * pl.periodErrDays);
      expect(Math.abs(tcOffsetDays(pl.tcBjdTdb, tr.tcBjdTdb, tr.periodDays))).toBeLessThan(4 * pl.tcErrDays);
    });
    expect(fit.planets[0]!.eccErr).toBeUndefined();
    expect(Math.abs(fit.planets[1]!.ecc - 0.2)).toBeLessThan(4 * fit.planets[1]!.eccErr!);
    // χ² of the data near its degrees of freedom (36 points − γ − 2 × (K, Tc, P) − e cos ω, e sin ω):
    // within 4 √(2 dof) (χ² distribution, common practice).
    expect(fit.dof).toBe(36 - 9);
    expect(Math.abs(fit.chi2 - fit.dof)).toBeLessThan(4 * Math.sqrt(2 * fit.dof));
  });

  it('fits an offset per instrument', () => {
    const rng = createRng(15);
    const truth: Truth = { kMps: 12, periodDays: 4.9, tcBjdTdb: 2461001.1 };
    const gammas = { 'echelle-a': -4, 'echelle-b': 21 };
    const points = simulate([truth], visitTimes(rng, 20, 2461030, 18), 1.5, rng, (i) => (i % 3 === 0 ? 'echelle-b' : 'echelle-a'), gammas);
    const prior: FitPlanetPrior = { id: 'Sanu c', periodDays: 4.9, periodErrDays: 0.002, tcBjdTdb: 2461001.15, tcErrDays: 0.1, kMps: 10, ecc: 0, omegaDeg: 90 };
    const fit = fitOrbits([prior], points, 1);
    expect(fit.offsets.map((o) => o.instrument)).toEqual(['echelle-b', 'echelle-a']);
    for (const o of fit.offsets) expect(Math.abs(o.gammaMps - gammas[o.instrument as keyof typeof gammas])).toBeLessThan(4 * o.gammaErrMps);
    expect(Math.abs(fit.planets[0]!.kMps - 12)).toBeLessThan(4 * fit.planets[0]!.kErrMps);
  });

  it('holds a parameter with a catalogue error of 0 fixed, and reports infinite errors when K is not determined', () => {
    const prior: FitPlanetPrior = { id: 'Tekla c', periodDays: 3.3, periodErrDays: 0, tcBjdTdb: 2461000.5, tcErrDays: 0, kMps: 5, ecc: 0, omegaDeg: 90 };
    const fixed = fitOrbits([prior], simulate([{ kMps: 5, periodDays: 3.3, tcBjdTdb: 2461000.5 }], [2461010.1, 2461011.3, 2461012.2], 1, null), 0);
    expect(fixed.planets[0]).toMatchObject({ periodDays: 3.3, periodErrDays: 0, tcBjdTdb: 2461000.5, tcErrDays: 0 });
    expect(fixed.planets[0]!.kMps).toBeCloseTo(5, 6);
    // One point: γ absorbs it and K is free of the data.
    const single = fitOrbits([prior], [{ bjdTdb: 2461010.1, rvMps: 2, rvErrorMps: 1, instrument: 'echelle-a' }], 0);
    expect(single.planets[0]!.kErrMps).toBe(Infinity);
    const loose = fitOrbits([{ ...prior, tcErrDays: 0.1, periodErrDays: 0.01 }], [{ bjdTdb: 2461010.1, rvMps: 2, rvErrorMps: 1, instrument: 'echelle-a' }], 0);
    expect(loose.planets[0]).toMatchObject({ kErrMps: Infinity, tcErrDays: Infinity, periodErrDays: Infinity });
  });

  it('refuses impossible calls with a ValidationError', () => {
    const prior: FitPlanetPrior = { id: 'x', periodDays: 3, periodErrDays: 0.1, tcBjdTdb: 2461000, tcErrDays: 0.1, kMps: 5, ecc: 0, omegaDeg: 90 };
    expect(() => fitOrbits([prior], [], 0)).toThrow(ValidationError);
    expect(() => fitOrbits([{ ...prior, kMps: 0 }], [{ bjdTdb: 2461000, rvMps: 1, rvErrorMps: 1, instrument: 'a' }], 0)).toThrow(ValidationError);
    expect(() => fitOrbits([prior], [{ bjdTdb: 2461000, rvMps: 1, rvErrorMps: 0, instrument: 'a' }], 0)).toThrow(ValidationError);
  });
});

describe('blindPeak', () => {
  it('finds an injected sinusoid, its period and K, below the FAP level', () => {
    const rng = createRng(16);
    const times = visitTimes(rng, 40, 2461000, 80);
    const points = simulate([{ kMps: 6, periodDays: 11, tcBjdTdb: 2461003 }], times, 1.5, rng);
    const peak = blindPeak(points, { periodMinDays: 2, periodMaxDays: 60 }, 0)!;
    expect(peak.significant).toBe(true);
    expect(peak.fapLevel).toBe(BLIND_PEAK_FAP);
    expect(Math.abs(peak.periodDays - 11) / 11).toBeLessThan(0.01);
    expect(Math.abs(peak.kMps - 6)).toBeLessThan(1.5);
  });

  it('noise alone is flagged at most about as often as the FAP level says (Monte Carlo; the Baluev FAP is an upper bound [Baluev2008])', () => {
    const rng = createRng(17);
    const times = visitTimes(rng, 20, 2461000, 40);
    let flagged = 0;
    for (let trial = 0; trial < 300; trial++) {
      const points = times.map((bjd, i) => ({ bjdTdb: bjd, rvMps: 2 * rng.normal(), rvErrorMps: 2, instrument: i % 2 ? 'a' : 'b' }));
      if (blindPeak(points, { periodMinDays: 2, periodMaxDays: 30 }, 0)!.significant) flagged++;
    }
    // Binomial(300, 0.01): mean 3, P(X > 9) < 0.1% (common practice).
    expect(flagged).toBeLessThanOrEqual(9);
  });

  it('gives nothing for fewer than five points', () => {
    expect(blindPeak([{ bjdTdb: 2461000, rvMps: 1, rvErrorMps: 1, instrument: 'a' }], { periodMinDays: 2, periodMaxDays: 30 }, 0)).toBeUndefined();
  });
});
