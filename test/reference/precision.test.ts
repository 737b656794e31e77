import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import { photonNoise, visitPrecision } from '../../src/rv/precision.js';
import { builtInTeffCurve, lineWidthFactor, spectralTypeFactor } from '../../src/rv/star-factors.js';

const instrument = readInstrument(path.join(INSTRUMENTS_DIR, 'stable-4m.json'));
const ref = instrument.reference;
const refStar = { vmag: ref.vmag, teffK: ref.teffK, vsiniKms: ref.vsiniKms, jitterMps: 0 };
const photon = (star: Partial<typeof refStar>, exposureSec = ref.exposureSec, airmass = 1, apertureM?: number) =>
  photonNoise(instrument, { ...refStar, ...star }, exposureSec, airmass, { apertureM }).photonMps;

describe('photon-noise scaling laws (Bouchy, Pepe & Queloz 2001, A&A 374, 733: σ ∝ 1/√photons)', () => {
  it('reproduces the reference point exactly', () => {
    expect(photon({})).toBe(ref.sigmaMps);
  });

  it('one magnitude fainter: σ × 10^0.2', () => {
    expect(photon({ vmag: 11.3 }) / photon({ vmag: 10.3 })).toBeCloseTo(10 ** 0.2, 12);
  });

  it('four times the exposure: σ / 2', () => {
    expect(photon({}, 2400) / photon({}, 600)).toBeCloseTo(0.5, 12);
  });

  it('twice the aperture: σ / 2', () => {
    expect(photon({}, 600, 1, 2 * instrument.apertureM) / photon({})).toBeCloseTo(0.5, 12);
  });

  it('extinction: 10^(0.2 k (X − 1)), k = 0.15 mag/airmass in the profile', () => {
    expect(photon({}, 600, 2) / photon({})).toBeCloseTo(10 ** (0.2 * 0.15), 12);
  });
});

describe('line-width factor against the information content of a Gaussian line (slow reference)', () => {
  // Weak-line limit of Bouchy et al. 2001: information ∝ ∫ (dF/dv)² dv for a line of fixed
  // equivalent width W, depth W / (s √(2π)), integrated numerically; σ ∝ information^(−1/2).
  const information = (widthKms: number) => {
    const depth = 1 / (widthKms * Math.sqrt(2 * Math.PI));
    const steps = 20000;
    const h = (20 * widthKms) / steps;
    let sum = 0;
    for (let i = 0; i <= steps; i++) {
      const v = -10 * widthKms + i * h;
      const slope = depth * (v / widthKms ** 2) * Math.exp((-v * v) / (2 * widthKms ** 2));
      sum += slope * slope * h;
    }
    return sum;
  };
  it.each([[0, 2, 5], [10, 2, 5], [30, 2, 5], [5, 5, 3]])('v sin i = %s vs %s km/s, w0 = %s km/s', (vsini, vsiniRef, w0) => {
    const width = (v: number) => Math.hypot(w0, v);
    const numeric = Math.sqrt(information(width(vsiniRef)) / information(width(vsini)));
    expect(lineWidthFactor(vsini, vsiniRef, w0)).toBeCloseTo(numeric, 6);
  });
});

describe('spectral-type factor', () => {
  it('is 1 at the reference Teff, and the built-in curve is the documented one (from memory)', () => {
    expect(spectralTypeFactor(5300, 5300).factor).toBe(1);
    // Values quoted in src/rv/star-factors.ts, relative to 5300 K.
    const rel = (t: number) => builtInTeffCurve(t) / builtInTeffCurve(5300);
    expect(rel(3500)).toBeCloseTo(0.64, 2);
    expect(rel(6500)).toBeCloseTo(1.89, 2);
    expect(rel(7000)).toBeCloseTo(3.41, 2);
  });

  it('rises with Teff, and steeply above ~6200 K (property)', () => {
    const f = (t: number) => spectralTypeFactor(t, 5300).factor;
    for (let t = 3000; t < 9000; t += 100) expect(f(t + 100)).toBeGreaterThan(f(t));
    // Per 400 K, the loss well above 6200 K is several times the loss among G dwarfs.
    expect(Math.log(f(7000) / f(6600))).toBeGreaterThan(3 * Math.log(f(5600) / f(5200)));
  });

  it('is smooth: the slope of ln f changes continuously (property)', () => {
    const slope = (t: number) => (Math.log(builtInTeffCurve(t + 0.5)) - Math.log(builtInTeffCurve(t - 0.5))) / 1;
    for (let t = 3000; t < 9000; t += 10) expect(Math.abs(slope(t + 10) - slope(t))).toBeLessThan(2e-5);
  });

  it('an instrument table overrides the curve, normalised at the reference Teff', () => {
    const table: [number, number][] = [[4000, 0.8], [5300, 1.6], [6500, 3.2]];
    const { factor, source } = spectralTypeFactor(5900, 5300, table);
    expect(factor).toBeCloseTo(2.4 / 1.6, 12); // linear interpolation
    expect(source).toBe('instrument profile teffFactors');
    expect(spectralTypeFactor(9000, 5300, table).factor).toBe(2); // clamped
  });
});

describe('the budget (docs/references.md [Noise-budget]; common practice)', () => {
  it('adds photon, floor and jitter in quadrature, and keeps every factor', () => {
    const star = { vmag: 10.7, teffK: 4900, vsiniKms: 6, jitterMps: 2.1 };
    const b = visitPrecision(instrument, star, 900, 1.4);
    const product = Object.values(b.factors).reduce((a, x) => a * x, 1);
    expect(b.photonMps).toBeCloseTo(ref.sigmaMps * product, 12);
    expect(b.visitMps ** 2).toBeCloseTo(b.photonMps ** 2 + instrument.floorMps ** 2, 12);
    expect(b.effMps ** 2).toBeCloseTo(b.visitMps ** 2 + 2.1 ** 2, 12);
    expect(Object.keys(b.factors).sort()).toEqual(['aperture', 'exposure', 'extinction', 'lineWidth', 'magnitude', 'spectralType']);
  });
});
