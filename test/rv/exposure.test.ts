import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import { visitsExact } from '../../src/rv/detect.js';
import { chooseExposureSec, fixedExposure, minimumExposure, visitCostSec } from '../../src/rv/exposure.js';
import { photonNoise, visitPrecision } from '../../src/rv/precision.js';

const stable4m = readInstrument(path.join(INSTRUMENTS_DIR, 'stable-4m.json'));
const kDwarf = { vmag: 11, teffK: 5000, vsiniKms: 2, jitterMps: 1.5 };

describe('chooseExposureSec', () => {
  it('by default, the shortest whole-second exposure with photon noise at or below √(jitter² + floor²)', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1.3);
    const level = Math.hypot(1.5, stable4m.floorMps);
    expect(choice.goal).toBe('photon-at-noise-floor');
    expect(choice.goalMps).toBeCloseTo(level, 12);
    expect(choice.clippedTo).toBeNull();
    expect(choice.budget.photonSigmaMps).toBeLessThanOrEqual(level);
    expect(photonNoise(stable4m, kDwarf, choice.exposureSec - 1, 1.3).photonSigmaMps).toBeGreaterThan(level);
  });

  it('reaches a requested σ per visit (photon and floor), and no shorter exposure does', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1.1, 1.2);
    expect(choice.budget.visitSigmaMps).toBeLessThanOrEqual(1.2);
    expect(visitPrecision(stable4m, kDwarf, choice.exposureSec - 1, 1.1).visitSigmaMps).toBeGreaterThan(1.2);
    expect(choice.budget.effectiveSigmaMps).toBeGreaterThan(choice.budget.visitSigmaMps); // jitter is not an exposure's to beat
  });

  it('clips to the minimum for a bright star: the p-mode period for a K dwarf, above the instrument minimum', () => {
    const choice = chooseExposureSec(stable4m, { ...kDwarf, vmag: 4 }, 1);
    expect(choice.clippedTo).toBe('min');
    expect(choice.minimumReason).toBe('oscillations');
    expect(choice.exposureSec).toBe(choice.minimumSec);
    expect(choice.exposureSec).toBeGreaterThan(stable4m.minExposureSec);
    expect(choice.tooFaint).toBe(false);
  });

  it('clips to the maximum and warns when too faint for a requested sigma', () => {
    const choice = chooseExposureSec(stable4m, { ...kDwarf, vmag: 14 }, 1.5, 2);
    expect(choice.exposureSec).toBe(stable4m.maxExposureSec);
    expect(choice.tooFaint).toBe(true);
    expect(choice.requiredSec).toBeGreaterThan(stable4m.maxExposureSec);
    expect(choice.warning).toMatch(/too faint: sigma per visit 2 m\/s needs \d+ s; the maximum exposure of 3600 s gives/);
  });

  it('by default, a faint star is flagged photon-limited at the maximum exposure', () => {
    const choice = chooseExposureSec(stable4m, { ...kDwarf, vmag: 14 }, 1.5);
    expect(choice.exposureSec).toBe(stable4m.maxExposureSec);
    expect(choice.tooFaint).toBe(true);
    expect(choice.budget.photonSigmaMps).toBeGreaterThan(choice.goalMps);
    expect(choice.warning).toMatch(/photon-limited: the maximum exposure of 3600 s leaves photon noise at [\d.]+ m\/s, above jitter and floor/);
  });

  it('says plainly when the requested σ is below the instrument floor', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1, 0.4);
    expect(choice.tooFaint).toBe(true);
    expect(choice.warning).toMatch(/at or below the instrument floor of 0.44 m\/s/);
  });

  it('a fixed exposure outside the limits is kept but warned about', () => {
    const choice = fixedExposure(stable4m, kDwarf, 1, 20);
    expect(choice.exposureSec).toBe(20);
    expect(choice.budget.exposureSec).toBe(20);
    expect(choice.warning).toMatch(/outside stable-4m's limits of 60-3600 s/);
  });
});

describe('oscillations: the shortest exposure is one p-mode period 1/nu_max ([Chaplin2019], [KjeldsenBedding1995])', () => {
  it('the Sun: about 5.4 min, its five-minute oscillations (common knowledge); a K dwarf: 3-4 min ([Chaplin2019]: as short as 4 min)', () => {
    const sun = minimumExposure(stable4m, { vmag: 5, teffK: 5772, vsiniKms: 2, jitterMps: 1.5, logg: 4.438 });
    expect(sun.reason).toBe('oscillations');
    expect(sun.sec / 60).toBeGreaterThan(5);
    expect(sun.sec / 60).toBeLessThan(5.7);
    const k = minimumExposure(stable4m, { vmag: 5, teffK: 5000, vsiniKms: 2, jitterMps: 1.5 });
    expect(k.sec / 60).toBeGreaterThan(3);
    expect(k.sec / 60).toBeLessThan(4.2);
  });

  it('a V = 5.5 G dwarf no longer gets 60 s (issue 11), and a subgiant needs longer still', () => {
    const g = chooseExposureSec(stable4m, { vmag: 5.5, teffK: 5800, vsiniKms: 2, jitterMps: 1.5 }, 1.2);
    expect(g.exposureSec).toBeGreaterThanOrEqual(300);
    const sub = minimumExposure(stable4m, { vmag: 5.5, teffK: 5800, vsiniKms: 2, jitterMps: 1.5, logg: 3.8 });
    expect(sub.sec).toBeGreaterThan(3 * g.exposureSec);
  });

  it('a fixed exposure shorter than the p-mode period is warned about', () => {
    expect(fixedExposure(stable4m, { ...kDwarf, vmag: 5 }, 1, 90).warning).toMatch(/shorter than this star's p-mode period/);
  });
});

describe('exposure for the fewest hours given K', () => {
  const hoursAt = (star: typeof kDwarf, k: number, sec: number) => {
    const white = Math.hypot(photonNoise(stable4m, star, sec, 1.2).photonSigmaMps, star.jitterMps);
    return visitsExact(k, white, 5, 'random', stable4m.floorMps) * visitCostSec(stable4m, sec);
  };

  it('a hot Jupiter (K = 127 m/s) gets the shortest exposure; a small K a longer one', () => {
    const star = { ...kDwarf, vmag: 9 };
    const hot = chooseExposureSec(stable4m, star, 1.2, undefined, { kMps: 127, goalSignificance: 5 });
    expect(hot.goal).toBe('fewest-hours');
    expect(hot.exposureSec).toBe(hot.minimumSec);
    const small = chooseExposureSec(stable4m, { ...star, vmag: 11.5 }, 1.2, undefined, { kMps: 3, goalSignificance: 5 });
    expect(small.exposureSec).toBeGreaterThan(hot.exposureSec);
  });

  it('is within 1% of the best whole-second exposure found by brute force (slow reference)', () => {
    for (const [vmag, k] of [
      [11.5, 3],
      [12.5, 8],
      [10, 0.6],
    ] as const) {
      const star = { ...kDwarf, vmag };
      const choice = chooseExposureSec(stable4m, star, 1.2, undefined, { kMps: k, goalSignificance: 5 });
      let best = Infinity;
      for (let sec = choice.minimumSec; sec <= stable4m.maxExposureSec; sec++) best = Math.min(best, hoursAt(star, k, sec));
      expect(hoursAt(star, k, choice.exposureSec) / best).toBeLessThan(1.01);
    }
  });

  it('with a cap on visits (one a night over the campaign), the cheapest exposure that fits under it', () => {
    const star = { ...kDwarf, vmag: 11.5 };
    const free = chooseExposureSec(stable4m, star, 1.2, undefined, { kMps: 3, goalSignificance: 5 });
    const visitsAt = (sec: number) =>
      visitsExact(3, Math.hypot(photonNoise(stable4m, star, sec, 1.2).photonSigmaMps, star.jitterMps), 5, 'random', stable4m.floorMps);
    const cap = Math.floor(visitsAt(free.exposureSec) / 2);
    const capped = chooseExposureSec(stable4m, star, 1.2, undefined, { kMps: 3, goalSignificance: 5, maxVisits: cap });
    expect(capped.exposureSec).toBeGreaterThan(free.exposureSec);
    expect(visitsAt(capped.exposureSec)).toBeLessThanOrEqual(cap);
  });

  it('K at or below the floor: no exposure helps, the default goal is kept', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1.2, undefined, { kMps: 0.9 * stable4m.floorMps, goalSignificance: 5 });
    expect(choice.goal).toBe('photon-at-noise-floor');
  });
});

describe('visitCostSec', () => {
  it('is exposure + readout + acquisition', () => {
    expect(visitCostSec(stable4m, 600)).toBe(600 + stable4m.readoutSec + stable4m.acquisitionSec);
  });
});
