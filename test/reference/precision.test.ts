import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import type { Instrument } from '../../src/rv/instrument.js';
import { photonNoise, visitPrecision } from '../../src/rv/precision.js';
import { entranceCoupling, seeingAtAirmassArcsec } from '../../src/rv/seeing.js';
import { instrumentEfficiency, referenceObservation, signalToNoise } from '../../src/rv/signal-to-noise.js';
import { lineWidthFactor, lineWidthKms } from '../../src/rv/star-factors.js';
import { teffFactor } from '../../src/rv/teff-information.js';
import { electronsPerPixel, transferSigmaMps } from '../support/photon-transfer.js';

const load = (id: string) => readInstrument(path.join(INSTRUMENTS_DIR, `${id}.json`));
const stable4m = load('stable-4m');
const g2 = { vmag: 6, teffK: 5800, vsiniKms: 2, jitterMps: 0 };
const within20 = (value: number, published: number) => expect(Math.abs(value / published - 1)).toBeLessThanOrEqual(0.2);

describe('the 1 m/s class against published figures', () => {
  it('G2 dwarf, V = 6, 60 s, airmass 1.2, 1" seeing: 0.90 m/s and S/N 110 per pixel at 550 nm [HARPSOverview]', () => {
    const b = photonNoise(stable4m, g2, 60, 1.2, { seeingArcsec: 1.0 / 1.2 ** 0.6 });
    expect(b.photonSigmaMps).toBeGreaterThanOrEqual(0.7);
    expect(b.photonSigmaMps).toBeLessThanOrEqual(1.15);
    within20(b.photonSigmaMps, 0.9);
    within20(b.snrPerPixel, 110);
  });

  it('K dwarf, V = 7.5, 60 s: about 1 m/s [Dumusque2011, section 1]', () => {
    const b = photonNoise(stable4m, { ...g2, vmag: 7.5, teffK: 5000 }, 60, 1.2);
    expect(b.photonSigmaMps).toBeGreaterThanOrEqual(0.75);
    expect(b.photonSigmaMps).toBeLessThanOrEqual(1.3);
    within20(b.photonSigmaMps, 1.0);
  });

  it('G2 dwarf at S/N 100 per pixel at 550 nm: about 1 m/s photon noise [HARPSManual]', () => {
    // The exposure giving S/N 100 at V = 8 (bisection), then its photon noise.
    let lo = 1;
    let hi = 10_000;
    for (let i = 0; i < 60; i++) {
      const mid = Math.sqrt(lo * hi);
      if (photonNoise(stable4m, { ...g2, vmag: 8 }, mid, 1.2).snrPerPixel < 100) lo = mid;
      else hi = mid;
    }
    within20(photonNoise(stable4m, { ...g2, vmag: 8 }, hi, 1.2).photonSigmaMps, 1.0);
  });
});

describe('overall efficiency solved from the published S/N', () => {
  it('the 1 m/s class: η × fibre coupling in 1" seeing is a few per cent, as published for fibre spectrographs (about 6% total, [Tokovinin2013])', () => {
    const refObs = referenceObservation(stable4m);
    const total = instrumentEfficiency(stable4m) * signalToNoise(stable4m, refObs).coupling;
    expect(total).toBeGreaterThan(0.03);
    expect(total).toBeLessThan(0.12);
  });

  it('the red class: its reference S/N means the 15% average throughput published for a near-infrared fibre spectrograph of its class ([Donati2018])', () => {
    within20(instrumentEfficiency(load('red-4m')), 0.15);
  });
});

describe('classes estimated from a published efficiency and the 1 m/s class (an independent photon count and the line-width law, [BeattyGaudi2015])', () => {
  // 6% total efficiency, fibre losses at the reference seeing included: the published figure of a
  // 1.5 m fibre spectrograph [Tokovinin2013]; photons counted afresh (sky neglected: bright stars).
  const readVariance = (i: Instrument) => i.spatialPixels * i.readNoiseE ** 2;
  const ref4 = stable4m.reference;
  const view = (i: Instrument) => ({ ...i, lineWidthKms: lineWidthKms(i.resolvingPower) });

  it.each(['compact-1m', 'stable-2m'])('%s: its reference point within 20% of the S/N and sigma this gives', (id) => {
    const b = load(id);
    const ref = b.reference;
    const couplingOnly =
      electronsPerPixel(b, ref.mag, ref.exposureSec, ref.airmass, ref.seeingArcsec, 1) / electronsPerPixel(b, ref.mag, ref.exposureSec, ref.airmass, 1e-6, 1);
    expect(couplingOnly).toBeGreaterThan(0.5); // the fibre takes most of the light at this seeing
    const electrons = electronsPerPixel(b, ref.mag, ref.exposureSec, ref.airmass, ref.seeingArcsec, 0.06 / couplingOnly);
    const snr = electrons / Math.sqrt(electrons + readVariance(b));
    within20(ref.snrPerPixel, snr);
    within20(ref.photonSigmaMps, transferSigmaMps(view(stable4m), ref4.photonSigmaMps, ref4.snrPerPixel, view(b), snr));
  });

  it('the 10 m/s class at V = 8, 1200 s, K0 dwarf: photon noise 1-5 m/s, the old 10 m/s was 2-7x pessimistic (issue 11)', () => {
    const p = photonNoise(load('compact-1m'), { ...g2, vmag: 8, teffK: 5300 }, 1200, 1.2).photonSigmaMps;
    expect(p).toBeGreaterThan(1);
    expect(p).toBeLessThan(5);
  });
});

describe('photon-noise scaling laws: σ ∝ 10^(0.2 m) t^(-1/2) D^(-1) in the photon limit ([Bouchy2001])', () => {
  const slope = (xs: number[], ys: number[]) => {
    const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
    const my = ys.reduce((a, b) => a + b, 0) / ys.length;
    const sxy = xs.reduce((a, x, i) => a + (x - mx) * (ys[i]! - my), 0);
    return sxy / xs.reduce((a, x) => a + (x - mx) ** 2, 0);
  };
  const log = (x: number) => Math.log10(x);
  const grid = (from: number, to: number, n: number) => Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1));

  it('fitted exponents over bright grids: 0.2 in magnitude, -1/2 in exposure, -1 in aperture', () => {
    const mags = grid(3, 7, 9);
    expect(
      slope(
        mags,
        mags.map((m) => log(photonNoise(stable4m, { ...g2, vmag: m }, 300, 1.2).photonSigmaMps)),
      ),
    ).toBeCloseTo(0.2, 2);
    const times = grid(60, 900, 9);
    expect(
      slope(
        times.map(log),
        times.map((t) => log(photonNoise(stable4m, g2, t, 1.2).photonSigmaMps)),
      ),
    ).toBeCloseTo(-0.5, 2);
    const apertures = grid(2, 8, 7);
    expect(
      slope(
        apertures.map(log),
        apertures.map((d) => log(photonNoise(stable4m, g2, 300, 1.2, { apertureM: d }).photonSigmaMps)),
      ),
    ).toBeCloseTo(-1, 2);
  });

  it('read noise and sky take over at the faint end: the slope in magnitude rises well above 0.2 (1 m class, 900 s)', () => {
    const compact = load('compact-1m');
    const faint = grid(15, 17, 5);
    const s = slope(
      faint,
      faint.map((m) => log(photonNoise(compact, { ...g2, vmag: m }, 900, 1.2).photonSigmaMps)),
    );
    expect(s).toBeGreaterThan(0.3);
    expect(photonNoise(compact, { ...g2, vmag: 14 }, 900, 1.2).factors.detector).toBeGreaterThan(1.3);
  });
});

describe('airmass: extinction at the instrument wavelength and entrance losses with seeing ∝ X^0.6 ([Roddier1981])', () => {
  it('fibre coupling against a direct 2-D integral of a Gaussian seeing disc (slow reference)', () => {
    const numeric = (d: number, fwhm: number) => {
      const s = fwhm / 2.3548;
      let inside = 0;
      let total = 0;
      const n = 400;
      const half = 5 * s;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const x = -half + ((i + 0.5) * 2 * half) / n;
          const y = -half + ((j + 0.5) * 2 * half) / n;
          const w = Math.exp(-(x * x + y * y) / (2 * s * s));
          total += w;
          if (x * x + y * y <= (d / 2) ** 2) inside += w;
        }
      }
      return inside / total;
    };
    for (const [d, fwhm] of [
      [1, 1],
      [1, 1.6],
      [2.58, 1.5],
    ] as const) {
      expect(entranceCoupling({ kind: 'fibre', diameterArcsec: d }, fwhm)).toBeCloseTo(numeric(d, fwhm), 2);
    }
    expect(seeingAtAirmassArcsec(1, 2)).toBeCloseTo(2 ** 0.6, 12);
  });

  it('airmass 2 against 1: σ grows by extinction and entrance losses together', () => {
    const b1 = photonNoise(stable4m, g2, 300, 1);
    const b2 = photonNoise(stable4m, g2, 300, 2);
    expect(b2.factors.extinction / b1.factors.extinction).toBeCloseTo(10 ** (0.2 * stable4m.extinctionMagPerAirmass), 12);
    expect(b2.factors.entrance).toBeGreaterThan(b1.factors.entrance);
    expect(b2.photonSigmaMps / b1.photonSigmaMps).toBeGreaterThan(1.2);
  });
});

describe('line width from the resolving power', () => {
  it('w0 = √(w_int² + (c/R)²): 5 km/s at R = 115,000, 7.5-8 km/s at R = 45,000 (issue 11)', () => {
    expect(lineWidthKms(115000)).toBeCloseTo(5, 1);
    expect(lineWidthKms(45000)).toBeGreaterThanOrEqual(7.5);
    expect(lineWidthKms(45000)).toBeLessThanOrEqual(8);
  });

  // Weak-line limit of [Bouchy2001]: information ∝ ∫ (dF/dv)² dv for a line of fixed
  // equivalent width W, depth W / (s √(2π)), integrated numerically; σ ∝ information^(−1/2).
  const information = (widthKms: number) => {
    const depth = 1 / (widthKms * Math.sqrt(2 * Math.PI));
    const steps = 20000;
    const h = (20 * widthKms) / steps;
    let sum = 0;
    for (let i = 0; i <= steps; i++) {
      const v = -10 * widthKms + i * h;
      const slopeValue = depth * (v / widthKms ** 2) * Math.exp((-v * v) / (2 * widthKms ** 2));
      sum += slopeValue * slopeValue * h;
    }
    return sum;
  };
  it.each([
    [0, 2, 5],
    [10, 2, 5],
    [30, 2, 7.9],
    [5, 5, 3],
  ])('factor against the Gaussian-line integral: v sin i = %s vs %s km/s, w0 = %s km/s', (vsini, vsiniRef, w0) => {
    const width = (v: number) => Math.hypot(w0, v);
    expect(lineWidthFactor(vsini, vsiniRef, w0)).toBeCloseTo(Math.sqrt(information(width(vsiniRef)) / information(width(vsini))), 6);
  });
});

describe('spectral type: the RV-information table ([ReinersZechmeister2020] shape)', () => {
  it('K dwarf against G2 at fixed V is 0.5-0.62, the ratio of the two published anchors ([HARPSOverview], [Dumusque2011])', () => {
    // 1 m/s at V = 7.5 and 0.90 m/s at V = 6 give σ(K)/σ(G2) = (1 / 0.9) / 10^(0.2 · 1.5) = 0.557 at fixed V.
    const f = teffFactor(5000, 5800, 'optical').factor;
    expect(f).toBeGreaterThan(0.5);
    expect(f).toBeLessThan(0.62);
  });

  it('rises steeply for hot stars, warns outside the trusted range and refuses outside the table', () => {
    expect(teffFactor(7000, 5800, 'optical').factor).toBeGreaterThan(2.5);
    expect(teffFactor(6000, 5800, 'optical').warning).toBeUndefined();
    expect(teffFactor(7500, 5800, 'optical').warning).toMatch(/outside 3300-7000 K/);
    expect(() => teffFactor(8500, 5800, 'optical')).toThrow(/outside 3000-8000 K/);
    expect(() => teffFactor(2700, 3500, 'near-infrared')).toThrow(RangeError);
  });

  it('an unusable Teff is one input-error line naming the star and the instrument', () => {
    expect(() => visitPrecision(stable4m, { ...g2, teffK: 12000, source: 'list.csv: row 4 (line 5)' }, 60, 1.2)).toThrow(
      /^list\.csv: row 4 \(line 5\): teffK = 12000: outside 3000-8000 K, .* \(instrument stable-4m\)$/,
    );
  });

  it('an instrument table overrides the built-in one, normalised at the reference Teff', () => {
    const table: [number, number][] = [
      [4000, 0.8],
      [5300, 1.6],
      [6500, 3.2],
    ];
    const { factor, source } = teffFactor(5900, 5300, 'optical', table);
    expect(factor).toBeCloseTo(2.4 / 1.6, 12); // linear interpolation
    expect(source).toBe('instrument profile teffFactors');
  });
});

describe('the budget (common practice)', () => {
  it('adds photon, floor and jitter in quadrature, and the factors multiply to the photon noise', () => {
    const star = { vmag: 10.7, teffK: 4900, vsiniKms: 6, jitterMps: 2.1 };
    const b = visitPrecision(stable4m, star, 900, 1.4);
    const product = Object.values(b.factors).reduce((a, x) => a * x, 1);
    expect(b.photonSigmaMps).toBeCloseTo(stable4m.reference.photonSigmaMps * product, 12);
    expect(b.visitSigmaMps ** 2).toBeCloseTo(b.photonSigmaMps ** 2 + stable4m.floorMps ** 2, 12);
    expect(b.effectiveSigmaMps ** 2).toBeCloseTo(b.visitSigmaMps ** 2 + 2.1 ** 2, 12);
    expect(b.whiteSigmaMps ** 2).toBeCloseTo(b.photonSigmaMps ** 2 + 2.1 ** 2, 12);
  });

  it('the red class takes J: a missing J comes from V and the dwarf colours, flagged', () => {
    const red = load('red-4m');
    const m2 = { vmag: 10.4, teffK: 3500, vsiniKms: 2, jitterMps: 0 };
    const estimated = photonNoise(red, m2, 900, 1.2);
    expect(estimated.band).toBe('J');
    expect(estimated.magEstimated).toBe(true);
    const given = photonNoise(red, { ...m2, mags: { J: estimated.mag } }, 900, 1.2);
    expect(given.magEstimated).toBe(false);
    expect(given.photonSigmaMps).toBeCloseTo(estimated.photonSigmaMps, 12);
  });
});
