import { describe, expect, it } from 'vitest';
import { parseTargets } from '../../src/io/targets.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { targetKMps } from '../../src/orbit/target-k.js';

const HEADER = 'id,ra,dec,vmag,teffK,massSun,periodDays,tcBjdTdb,planetMassEarth,planetKMps,ecc';

describe('K of a target list row', () => {
  it('uses the given K, or computes it from the planet mass with the eccentricity', () => {
    // Property: the row's K is the forward formula of the row's numbers.
    const [given, fromMass, none] = parseTargets(
      `${HEADER}\nA,10:00:00,-10:00:00,9,5000,0.8,4.5,2461000.5,,7.5,\nB,10:00:00,-10:00:00,9,5000,0.8,4.5,2461000.5,12,,0.3\nC,10:00:00,-10:00:00,9,5000,0.8,,,,,\n`,
      't.csv',
    );
    expect(targetKMps(given!)).toBe(7.5);
    expect(targetKMps(fromMass!)).toBe(semiAmplitudeMps({ starMassSun: 0.8, planetMassEarth: 12, periodDays: 4.5, ecc: 0.3 }));
    expect(targetKMps(none!)).toBeUndefined();
  });
});
