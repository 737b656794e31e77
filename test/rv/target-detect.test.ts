import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import { parseTargets } from '../../src/io/targets.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { OUT_OF_REACH_VISITS, planetOfTarget, targetDetectability } from '../../src/rv/target-detect.js';

const stable4m = readInstrument(path.join(INSTRUMENTS_DIR, 'stable-4m.json'));
const header =
  'id,ra,dec,vmag,teffK,massSun,jitterMps,periodDays,tcBjdTdb,planetMsiniEarth,planetKMps,ecc,searchPeriodMinDays,searchPeriodMaxDays,searchMsiniEarth';
const [given, byK, search, bare, tiny] = parseTargets(
  [
    header,
    'Given,10:00:00,-20:00:00,9.5,5200,0.85,1.5,6.5,2461000.5,9,,0.3,,,',
    'ByK,10:00:00,-20:00:00,9.5,5200,0.85,1.5,6.5,2461000.5,,4.2,,,,',
    'Search,10:00:00,-20:00:00,8,5200,0.85,1.5,,,,,,3,48,7',
    'Bare,10:00:00,-20:00:00,8,5200,0.85,1.5,,,,,,,,',
    'Tiny,10:00:00,-20:00:00,8,5200,0.85,1.5,300,2461000.5,0.5,,,,,',
  ].join('\n'),
  't.csv',
) as [never, never, never, never, never];

describe('planetOfTarget', () => {
  it('a given mass becomes K with the eccentricity factor (semiAmplitudeMps)', () => {
    const p = planetOfTarget(given)!;
    // 3.602584858 m/s: the K formula of Cumming, Marcy & Butler 1999 with astropy 5.2.1's IAU 2015
    // nominal GM_sun and GM_earth (astropy.constants), computed once in Python.
    expect(p.kMps).toBeCloseTo(3.602584858, 8);
    expect(p.kMps / semiAmplitudeMps({ starMassSun: 0.85, planetMassEarth: 9, periodDays: 6.5 })).toBeCloseTo(1 / Math.sqrt(1 - 0.09), 12);
  });

  it('a given K is used as it is', () => {
    expect(planetOfTarget(byK)!.kMps).toBe(4.2);
  });

  it('a search spec: its mass at the logarithmic middle of its period range', () => {
    const p = planetOfTarget(search)!;
    expect(p.periodDays).toBeCloseTo(12, 12); // √(3 · 48)
    expect(p.source).toBe('search');
    expect(p.note).toMatch(/logarithmic middle of 3-48 d/);
  });

  it("a hypothetical planet replaces the target's own, and nothing gives nothing", () => {
    expect(planetOfTarget(given, { msiniEarth: 10, periodDays: 20 })!.source).toBe('hypothetical');
    expect(planetOfTarget(bare)).toBeUndefined();
  });
});

describe('targetDetectability', () => {
  it('reports visits for 3σ, 5σ and the goal, and hours from the visit cost', () => {
    const d = targetDetectability(given, stable4m, { goalSignificance: 4, airmass: 1.2 });
    expect(d.needed.map((v) => v.goalSignificance)).toEqual([3, 4, 5]);
    for (const v of d.needed) expect(v.hoursRandom).toBeCloseTo((v.random * d.visitCostSec) / 3600, 12);
    expect(d.effectiveSigmaMps).toBe(d.exposure.budget.effectiveSigmaMps);
  });

  it("at a planned N: Φ(K/σ_K − n) and the smallest detectable mass at the planet's period", () => {
    const d = targetDetectability(given, stable4m, { goalSignificance: 5, airmass: 1.2, visits: 30, periodsDays: [1, 10] });
    const at = d.atPlannedVisits!;
    // σ_K² = σ_white² / E[S] + (floor/n)², E[S] = (N − 1)/2 at random phases.
    expect(at.sigmaKRandomMps).toBeCloseTo(Math.sqrt((2 * d.whiteSigmaMps ** 2) / 29 + (stable4m.floorMps / 5) ** 2), 12);
    expect(at.mass50RandomEarth!).toBeLessThan(at.mass90RandomEarth!);
    expect(at.massLimits).toHaveLength(2);
    const kMin = semiAmplitudeMps({ starMassSun: 0.85, planetMassEarth: at.massMinRandomEarth!, periodDays: 6.5, ecc: 0.3 });
    expect(kMin).toBeCloseTo(5 * at.sigmaKRandomMps, 9);
  });

  it('says plainly when K is below the instrument floor', () => {
    const d = targetDetectability(tiny, stable4m, { goalSignificance: 5, airmass: 1.2 });
    expect(d.planet!.kMps).toBeLessThan(stable4m.floorMps);
    expect(d.verdict.level).toBe('out of reach');
    expect(d.verdict.text).toMatch(/below the instrument floor of 0.44 m\/s, which does not average down/);
  });

  it('the floor one way everywhere: no out-of-reach verdict beside a mass limit below the planet (issue 11)', () => {
    for (const visits of [10, 100, 10_000]) {
      const d = targetDetectability(tiny, stable4m, { goalSignificance: 5, airmass: 1.2, visits });
      expect(d.verdict.level).toBe('out of reach');
      expect(d.atPlannedVisits!.massMinRandomEarth!).toBeGreaterThan(d.planet!.msiniEarth!);
      expect(d.atPlannedVisits!.mass50RandomEarth!).toBeGreaterThan(d.planet!.msiniEarth!);
      expect(d.atPlannedVisits!.probabilityRandom!).toBeLessThan(0.01);
      expect(5 * d.atPlannedVisits!.sigmaKRandomMps).toBeGreaterThan(stable4m.floorMps);
      expect(d.needed.every((v) => v.random === Infinity)).toBe(true);
    }
  });

  it(`says plainly when more than ${OUT_OF_REACH_VISITS} visits are needed`, () => {
    const d = targetDetectability(bare, stable4m, { goalSignificance: 5, airmass: 1.2, hypothetical: { msiniEarth: 2.5, periodDays: 30 } });
    expect(d.planet!.kMps).toBeGreaterThan(stable4m.floorMps);
    expect(d.needed.find((v) => v.goalSignificance === 5)!.random).toBeGreaterThan(OUT_OF_REACH_VISITS);
    expect(d.verdict.level).toBe('out of reach');
    expect(d.verdict.text).toMatch(/more than 200/);
  });

  it('without a planet: precision only', () => {
    const d = targetDetectability(bare, stable4m, { goalSignificance: 5, airmass: 1.2 });
    expect(d.needed).toEqual([]);
    expect(d.verdict.level).toBe('no planet');
  });
});
