import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR } from '../../src/io/paths.js';
import { chooseExposureSec, fixedExposure, visitCostSec } from '../../src/rv/exposure.js';
import { photonNoise, visitPrecision } from '../../src/rv/precision.js';

const stable4m = readInstrument(path.join(INSTRUMENTS_DIR, 'stable-4m.json'));
const kDwarf = { vmag: 9.6, teffK: 5000, vsiniKms: 2, jitterMps: 1.5 };

describe('chooseExposureSec', () => {
  it('by default, the shortest whole-second exposure with photon noise at or below √(jitter² + floor²)', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1.3);
    const level = Math.hypot(1.5, stable4m.floorMps);
    expect(choice.goal).toBe('photon-at-noise-floor');
    expect(choice.goalMps).toBeCloseTo(level, 12);
    expect(choice.clippedTo).toBeNull();
    expect(choice.budget.photonMps).toBeLessThanOrEqual(level);
    expect(photonNoise(stable4m, kDwarf, choice.exposureSec - 1, 1.3).photonMps).toBeGreaterThan(level);
  });

  it('reaches a requested σ per visit (photon and floor), and no shorter exposure does', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1.1, 1.2);
    expect(choice.budget.visitMps).toBeLessThanOrEqual(1.2);
    expect(visitPrecision(stable4m, kDwarf, choice.exposureSec - 1, 1.1).visitMps).toBeGreaterThan(1.2);
    expect(choice.budget.effMps).toBeGreaterThan(choice.budget.visitMps); // jitter is not an exposure's to beat
  });

  it('clips to the minimum for a bright star', () => {
    const choice = chooseExposureSec(stable4m, { ...kDwarf, vmag: 4 }, 1);
    expect(choice.clippedTo).toBe('min');
    expect(choice.exposureSec).toBe(stable4m.minExposureSec);
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
    expect(choice.budget.photonMps).toBeGreaterThan(choice.goalMps);
    expect(choice.warning).toMatch(/photon-limited: the maximum exposure of 3600 s leaves photon noise at [\d.]+ m\/s, above jitter and floor/);
  });

  it('says plainly when the requested σ is below the instrument floor', () => {
    const choice = chooseExposureSec(stable4m, kDwarf, 1, 0.4);
    expect(choice.tooFaint).toBe(true);
    expect(choice.warning).toMatch(/at or below the instrument floor of 0.5 m\/s/);
  });

  it('a fixed exposure outside the limits is kept but warned about', () => {
    const choice = fixedExposure(stable4m, kDwarf, 1, 20);
    expect(choice.exposureSec).toBe(20);
    expect(choice.budget.exposureSec).toBe(20);
    expect(choice.warning).toMatch(/outside stable-4m's limits of 60-3600 s/);
  });
});

describe('visitCostSec', () => {
  it('is exposure + readout + acquisition', () => {
    expect(visitCostSec(stable4m, 600)).toBe(600 + stable4m.readoutSec + stable4m.acquisitionSec);
  });
});
