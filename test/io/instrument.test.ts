import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseInstrument, readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';

const GOOD = {
  id: 'test-1m',
  name: 'Test spectrograph',
  apertureM: 1,
  reference: { sigmaMps: 5, vmag: 8, exposureSec: 600, teffK: 5300, vsiniKms: 2 },
  floorMps: 2,
  readoutSec: 30,
  acquisitionSec: 120,
  minExposureSec: 60,
  maxExposureSec: 3600,
  sourceNote: 'invented for a test',
};

describe('instrument profiles', () => {
  const files = readdirSync(INSTRUMENTS_DIR).filter((f) => f.endsWith('.json'));

  it('reads every bundled profile: at least three classes, better precision on larger telescopes', () => {
    const instruments = files.map((f) => readInstrument(path.join(INSTRUMENTS_DIR, f)));
    expect(instruments.length).toBeGreaterThanOrEqual(3);
    for (const i of instruments) expect(path.basename(i.file, '.json')).toBe(i.id);
    // Common practice: the stabilised spectrographs on larger telescopes reach better reference precision.
    const byAperture = instruments.slice().sort((a, b) => a.apertureM - b.apertureM);
    for (let k = 1; k < byAperture.length; k++) expect(byAperture[k]!.reference.sigmaMps).toBeLessThan(byAperture[k - 1]!.reference.sigmaMps);
  });

  it('fills the documented defaults and sorts spectral-type factors', () => {
    const inst = parseInstrument({ ...GOOD, teffFactors: [[6500, 2], [5000, 1]] }, 'i.json');
    expect(inst.extinctionMagPerAirmass).toBe(0.15);
    expect(inst.lineWidthKms).toBe(5);
    expect(inst.teffFactors).toEqual([[5000, 1], [6500, 2]]);
  });

  it.each([
    ['negative aperture', { apertureM: -1 }, /^i\.json: apertureM = -1: 0.1 to 50 metres$/],
    ['reference magnitude out of range', { reference: { ...GOOD.reference, vmag: 25 } }, /^i\.json: reference\.vmag = 25: a V magnitude from -2 to 20$/],
    ['shortest exposure above the longest', { minExposureSec: 4000 }, /^i\.json: maxExposureSec = 3600: at least minExposureSec$/],
    ['a misspelt key', { floorMPS: 2 }, /^i\.json: floorMPS = 2: unknown key/],
  ])('names the key of a bad value: %s', (_name, change, message) => {
    expect(() => parseInstrument({ ...GOOD, ...change }, 'i.json')).toThrow(message);
  });
});
