import { describe, expect, it } from 'vitest';
import { EARTH_PER_JUPITER } from '../../src/astro/constants.js';
import { planetMassFromKEarth } from '../../src/orbit/minimum-mass.js';
import { runCliInProcess } from './run-cli.js';

const json = async (args: string[]) => {
  const r = await runCliInProcess(['amplitude', ...args, '--json']);
  expect(r.status).toBe(0);
  return JSON.parse(r.stdout) as Record<string, number | string>;
};

describe('crest amplitude', () => {
  it('prints K, a, a★ and the speeds for a Jupiter on a one-year orbit', async () => {
    const r = await runCliInProcess(['amplitude', '--star-mass', '1', '--planet-mass', '1', '--mass-unit', 'jupiter', '--period', '365.25']);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    // 28.4 m/s: Lovis & Fischer 2010 (docs/references.md [K-handy-form], from memory)
    expect(r.stdout).toMatch(/semi-amplitude K\s+28\.4\d* +m\/s/);
    for (const label of ['semi-major axis a', "star's orbit a*", "planet's orbital speed", "star's orbital speed"]) expect(r.stdout).toContain(label);
  });

  it('--json gives one object with unit-named fields', async () => {
    const out = await json(['--star-mass', '1', '--planet-mass', '1', '--mass-unit', 'jupiter', '--period', '365.25']);
    expect(out.mode).toBe('forward');
    expect(out.massEarth).toBeCloseTo(EARTH_PER_JUPITER, 9);
    expect(out.massJupiter).toBeCloseTo(1, 12);
    // Jupiter-mass planet at ~1 au: K 28.4 m/s (Lovis & Fischer 2010, from memory); planet speed
    // 29.8 km/s and star speed = K for a circular edge-on orbit (common practice).
    expect(out.kMps).toBeCloseTo(28.4, 1);
    expect(out.semiMajorAxisAu).toBeCloseTo(1.0, 2);
    expect(out.planetSpeedKmps).toBeCloseTo(29.8, 1);
    expect(out.starSpeedMps).toBeCloseTo(out.kMps as number, 9);
    expect(Object.keys(out)).toEqual(
      expect.arrayContaining(['kMps', 'massEarth', 'massJupiter', 'semiMajorAxisAu', 'starOrbitRadiusKm', 'planetSpeedKmps', 'starSpeedMps']),
    );
  });

  it('inverts K: m sin i exact beside the m << M★ approximation', async () => {
    const r = await runCliInProcess(['amplitude', '--star-mass', '0.3', '--k', '100', '--period', '3']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('m sin i (exact)');
    expect(r.stdout).toContain('m sin i (if m << M*)');
    const out = await json(['--star-mass', '0.3', '--k', '100', '--period', '3', '--ecc', '0.2']);
    expect(out.mode).toBe('inverse');
    // Property: the printed mass is the library's exact solution and reproduces the given K.
    expect(out.msiniEarth).toBeCloseTo(planetMassFromKEarth({ starMassSun: 0.3, kMps: 100, periodDays: 3, ecc: 0.2 }), 9);
    expect(out.kMps).toBeCloseTo(100, 9);
    expect(out.massSinIApproxEarth as number).toBeLessThan(out.msiniEarth as number);
  });

  it('with --incl, the true mass is m sin i / sin i', async () => {
    // Property: forward with i = 30° then inverse with i = 30° returns the mass given.
    const k = (await json(['--star-mass', '1.1', '--planet-mass', '50', '--period', '20', '--incl', '30'])).kMps as number;
    const out = await json(['--star-mass', '1.1', '--k', String(k), '--period', '20', '--incl', '30']);
    expect(out.massEarth).toBeCloseTo(50, 8);
    expect(out.msiniEarth).toBeCloseTo(25, 8);
  });
});
