import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import { visitPrecision, visitPrecisionByAirmass } from '../../src/rv/precision.js';

const instrument = readInstrument(path.join(INSTRUMENTS_DIR, 'compact-1m.json'));
const star = { vmag: 10.5, teffK: 4700, vsiniKms: 3, jitterMps: 2.5 };
const airmasses = [1.9, 1.0, 1.35, 2.6, 1.0, 1.9];

describe('precision prepared once per star, evaluated per airmass', () => {
  it('gives, in any order of airmasses, the one-shot budget at each, with nothing carried between calls', () => {
    const at = visitPrecisionByAirmass(instrument, star, 1200, { seeingArcsec: 1.1 });
    const budgets = airmasses.map((x) => at(x));
    airmasses.forEach((x, i) => {
      expect(budgets[i]).toEqual(visitPrecision(instrument, star, 1200, x, { seeingArcsec: 1.1 }));
    });
    expect(budgets[1]).not.toBe(budgets[4]);
  });

  it('loses precision as the airmass grows (extinction and seeing; common practice)', () => {
    const at = visitPrecisionByAirmass(instrument, star, 1200);
    const sigmas = [1, 1.3, 1.7, 2.2, 3].map((x) => at(x).photonSigmaMps);
    for (let i = 1; i < sigmas.length; i++) expect(sigmas[i]!).toBeGreaterThan(sigmas[i - 1]!);
  });
});
