import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseInstrument, readInstrument, SOURCED_FIELDS } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import type { Instrument } from '../../src/rv/instrument.js';
import { visitPrecision } from '../../src/rv/precision.js';

const GOOD = {
  id: 'test-1m',
  name: 'Test spectrograph',
  apertureM: 1,
  resolvingPower: 50000,
  band: 'V',
  wavelengthNm: 550,
  coverageNm: [400, 700],
  spectralRegion: 'optical',
  reference: { photonSigmaMps: 5, mag: 8, exposureSec: 600, airmass: 1.2, seeingArcsec: 1.5, snrPerPixel: 60, teffK: 5300, vsiniKms: 2 },
  readNoiseE: 4,
  pixelsPerResolutionElement: 4,
  spatialPixels: 6,
  entrance: { kind: 'fibre', diameterArcsec: 2 },
  skyMagPerArcsec2: 21.5,
  floorMps: 2,
  readoutSec: 30,
  acquisitionSec: 120,
  minExposureSec: 60,
  maxExposureSec: 3600,
  extinctionMagPerAirmass: 0.15,
  sources: Object.fromEntries(SOURCED_FIELDS.map((f) => [f, 'invented for a test'])),
  sourceNote: 'invented for a test',
};

describe('instrument profiles', () => {
  const files = readdirSync(INSTRUMENTS_DIR).filter((f) => f.endsWith('.json'));

  it('reads every bundled profile: at least four classes, one red; better precision on larger optical telescopes', () => {
    const instruments = files.map((f) => readInstrument(path.join(INSTRUMENTS_DIR, f)));
    expect(instruments.length).toBeGreaterThanOrEqual(4);
    for (const i of instruments) expect(path.basename(i.file, '.json')).toBe(i.id);
    expect(instruments.some((i) => i.spectralRegion === 'near-infrared')).toBe(true);
    // Common practice: at a common star and exposure, larger optical telescopes give smaller photon noise.
    const optical = instruments.filter((i) => i.spectralRegion === 'optical').sort((a, b) => a.apertureM - b.apertureM);
    const sigma = (i: Instrument) => visitPrecision(i, { vmag: 8, teffK: 5800, vsiniKms: 2, jitterMps: 0 }, 900, 1.2).photonSigmaMps;
    for (let k = 1; k < optical.length; k++) expect(sigma(optical[k]!)).toBeLessThan(sigma(optical[k - 1]!));
  });

  it('every bundled number has a source note, and a missing one is an error naming the key', () => {
    for (const f of files) {
      const i = readInstrument(path.join(INSTRUMENTS_DIR, f));
      for (const field of SOURCED_FIELDS) expect(i.sources[field]).toBeTruthy();
    }
    const { floorMps: _floor, ...fewer } = GOOD.sources;
    expect(() => parseInstrument({ ...GOOD, sources: fewer }, 'i.json')).toThrow(/^i\.json: sources\.floorMps = \(missing\): where this number comes from/);
  });

  it('sorts spectral-type factors', () => {
    const inst = parseInstrument(
      {
        ...GOOD,
        teffFactors: [
          [6500, 2],
          [5000, 1],
        ],
      },
      'i.json',
    );
    expect(inst.teffFactors).toEqual([
      [5000, 1],
      [6500, 2],
    ]);
  });

  it.each([
    ['negative aperture', { apertureM: -1 }, /^i\.json: apertureM = -1: metres from 0.1 to 50$/],
    ['reference magnitude out of range', { reference: { ...GOOD.reference, mag: 25 } }, /^i\.json: reference\.mag = 25: a magnitude from -2 to 20$/],
    ['an unknown band', { band: 'K' }, /^i\.json: band = "K": one of V, R, I, J, H, G$/],
    ['shortest exposure above the longest', { minExposureSec: 4000 }, /^i\.json: maxExposureSec = 3600: at least minExposureSec$/],
    ['a misspelt key', { floorMPS: 2 }, /^i\.json: floorMPS = 2: unknown key/],
  ])('names the key of a bad value: %s', (_name, change, message) => {
    expect(() => parseInstrument({ ...GOOD, ...change }, 'i.json')).toThrow(message);
  });
});
