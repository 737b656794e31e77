// `crest detect`: the first case as a subprocess (the built command line end to end), the others in-process.
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { runCli, runCliInProcess } from '../cli/run-cli.js';

const DEMO = 'examples/demo/targets.csv';

describe('crest detect', () => {
  it('one row per demo target, with verdicts', () => {
    const r = runCli(['detect', '--targets', DEMO, '--instrument', 'stable-4m']);
    expect(r.status).toBe(0);
    for (const id of ['SELVA-12', 'SELVA-85', 'Vira', 'Castell']) expect(r.stdout).toContain(id);
    expect(r.stdout).toMatch(/logarithmic middle of 2-60 d/);
  });

  it('--csv: one row per target; visits at random phases are twice those at quadratures, plus one ((N - 1)/2)', async () => {
    const r = await runCliInProcess(['detect', '--targets', DEMO, '--instrument', 'stable-2m', '--csv']);
    expect(r.status).toBe(0);
    const rows = parse(r.stdout, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(13);
    for (const row of rows) {
      const [random, quad] = [Number(row.visits5Random), Number(row.visits5Quadrature)];
      expect(Math.abs(random - 2 * quad - 1)).toBeLessThanOrEqual(2);
      expect(Number(row.snrPerPixel)).toBeGreaterThan(0);
    }
  });

  it('a hypothetical planet around one star, with mass limits at a planned N (--json)', async () => {
    const r = await runCliInProcess([
      'detect',
      '--instrument',
      'stable-4m',
      '--vmag',
      '9',
      '--teff',
      '4800',
      '--planet-mass',
      '10',
      '--period',
      '20',
      '--visits',
      '40',
      '--json',
    ]);
    expect(r.status).toBe(0);
    const [row] = JSON.parse(r.stdout).targets;
    expect(row.planet.source).toBe('hypothetical');
    expect(row.atPlannedVisits.massLimits.map((m: { periodDays: number }) => m.periodDays)).toEqual([1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]);
    const at20 = row.atPlannedVisits.massLimits[4];
    expect(at20.massMinRandomEarth).toBeCloseTo(row.atPlannedVisits.massMinRandomEarth, 9);
  });

  it.each([
    [['--planet-mass', '10', '--vmag', '9', '--teff', '5000'], /--period = \(missing\): --planet-mass and --period go together/],
    [['--vmag', '9', '--teff', '5000', '--targets', DEMO], /not both/],
    [[], /--targets = \(missing\)/],
  ])('bad input: one line, exit 2 (%s)', async (args, pattern) => {
    const r = await runCliInProcess(['detect', '--instrument', 'stable-4m', ...(args as string[])]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(pattern);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('--mass-unit jupiter: --planet-mass read in Jupiter masses, the text table in MJup, --json still in M⊕', async () => {
    // 1 MJup = 317.83 M⊕ (IAU 2015 nominal GM ratio, from memory).
    const star = ['detect', '--instrument', 'stable-4m', '--vmag', '9', '--teff', '4800', '--period', '20', '--visits', '40'];
    const inJupiter = await runCliInProcess([...star, '--planet-mass', '0.05', '--mass-unit', 'jupiter', '--json']);
    const inEarth = await runCliInProcess([...star, '--planet-mass', String(0.05 * 317.83), '--json']);
    const [a] = JSON.parse(inJupiter.stdout).targets;
    const [b] = JSON.parse(inEarth.stdout).targets;
    expect(a.planet.msiniEarth).toBeCloseTo(0.05 * 317.83, 1);
    expect(a.planet.kMps).toBeCloseTo(b.planet.kMps, 3);
    const text = await runCliInProcess([...star, '--planet-mass', '0.05', '--mass-unit', 'jupiter']);
    expect(text.status).toBe(0);
    expect(text.stdout).toContain('min m sin i (MJup)');
    expect(text.stdout).toContain('Smallest detectable m sin i (MJup)');
    // The table's minimum mass at random phases, in MJup, is the JSON's M⊕ value over 317.83 (3 decimals).
    const expected = (b.atPlannedVisits.massMinRandomEarth / 317.83).toFixed(3);
    expect(text.stdout).toMatch(new RegExp(`\\s${expected.replace('.', '\\.')}/`));
  });

  it('--planet-mass beyond the heaviest planet in either unit: one line, exit 2', async () => {
    const star = ['detect', '--instrument', 'stable-4m', '--vmag', '9', '--teff', '4800', '--period', '20'];
    const r = await runCliInProcess([...star, '--planet-mass', '200', '--mass-unit', 'jupiter']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--planet-mass.*200.*at most 30000 M⊕ \(94\.4 MJup\)/);
  });
});
