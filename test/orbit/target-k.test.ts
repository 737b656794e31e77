import { describe, expect, it } from 'vitest';
import { parseTargets } from '../../src/io/targets.js';
import { targetKMps } from '../../src/orbit/target-k.js';

const HEADER = 'id,ra,dec,vmag,teffK,massSun,periodDays,tcBjdTdb,planetMsiniEarth,planetKMps,ecc';

describe('K of a target list row', () => {
  it('uses the given K, or computes it from the planet mass with the eccentricity', () => {
    // The row's K is the forward formula of the row's numbers.
    const [given, fromMass, none] = parseTargets(
      `${HEADER}\n` +
        'A,10:00:00,-10:00:00,9,5000,0.8,4.5,2461000.5,,7.5,\n' +
        'B,10:00:00,-10:00:00,9,5000,0.8,4.5,2461000.5,12,,0.3\n' +
        'C,10:00:00,-10:00:00,9,5000,0.8,,,,,\n',
      't.csv',
    );
    expect(targetKMps(given!)).toBe(7.5);
    // 5.653733844 m/s: the K formula of Cumming, Marcy & Butler 1999 with astropy 5.2.1's IAU 2015
    // nominal GM_sun and GM_earth (astropy.constants), computed once in Python.
    expect(targetKMps(fromMass!)).toBeCloseTo(5.653733844, 8);
    expect(targetKMps(none!)).toBeUndefined();
  });
});
