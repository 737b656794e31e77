// `crest precision`: the first case as a subprocess (the built command line end to end), the others in-process.
import { describe, expect, it } from 'vitest';
import { runCli, runCliInProcess } from '../cli/run-cli.js';

describe('crest precision', () => {
  it('--json shows every factor of the budget, and they multiply to the photon noise', () => {
    const r = runCli([
      'precision',
      '--instrument',
      'stable-2m',
      '--vmag',
      '10.5',
      '--teff',
      '6300',
      '--vsini',
      '9',
      '--jitter',
      '2.5',
      '--exposure',
      '1200',
      '--airmass',
      '1.5',
      '--json',
    ]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    const b = out.exposure.budget;
    const product = Object.values(b.factors as Record<string, number>).reduce((a, x) => a * x, 1);
    expect(b.photonSigmaMps).toBeCloseTo(1.43 * product, 10); // stable-2m reference sigma 1.43 m/s
    expect(b.factors.magnitude).toBeCloseTo(10 ** (0.2 * 2.5), 12);
    expect(b.factors.exposure).toBeCloseTo(Math.sqrt(600 / 1200), 12);
    expect(b.snrPerPixel).toBeGreaterThan(0);
    expect(b.effectiveSigmaMps).toBeCloseTo(Math.hypot(b.photonSigmaMps, 1.5, 2.5), 10);
    expect(out.exposure.goal).toBe('fixed');
    expect(out.visitCostSec).toBe(1200 + 40 + 180);
  });

  it('the table shows the budget and a too-faint warning', async () => {
    const r = await runCliInProcess(['precision', '--instrument', 'stable-4m', '--vmag', '13.5', '--teff', '5000', '--target-sigma', '1']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/effective sigma/);
    expect(r.stdout).toMatch(/Warning: too faint/);
  });

  it('prints S/N per pixel, and the jitter with its source: a G star at v sin i 10 km/s gets 20-45 m/s ([Saar1998])', async () => {
    const r = await runCliInProcess(['precision', '--instrument', 'stable-4m', '--vmag', '8', '--teff', '5800', '--vsini', '10', '--json']);
    const out = JSON.parse(r.stdout);
    expect(out.star.jitterMps).toBeGreaterThanOrEqual(20);
    expect(out.star.jitterMps).toBeLessThanOrEqual(45);
    expect(out.star.jitterSource).toMatch(/rotation \[Saar1998\]/);
    const text = await runCliInProcess(['precision', '--instrument', 'stable-4m', '--vmag', '8', '--teff', '5800', '--jitter', '3']);
    expect(text.stdout).toMatch(/S\/N per pixel at 550 nm: \d+/);
    expect(text.stdout).toMatch(/stellar jitter +3\.00 m\/s +as given/);
  });

  it('a hot star is refused in one line, a warm one warned about', async () => {
    const hot = await runCliInProcess(['precision', '--instrument', 'stable-4m', '--vmag', '8', '--teff', '9500']);
    expect(hot.status).toBe(2);
    expect(hot.stderr.trim()).toMatch(/^crest: command line: teffK = 9500: outside 3000-8000 K, .*\(instrument stable-4m\)$/);
    const warm = await runCliInProcess(['precision', '--instrument', 'stable-4m', '--vmag', '8', '--teff', '7400']);
    expect(warm.status).toBe(0);
    expect(warm.stdout).toMatch(/Warning: Teff 7400 K is outside 3300-7000 K/);
  });

  it.each([
    [['--vmag', '9'], /--teff = \(missing\): required/],
    [['--vmag', '9', '--teff', '5000', '--exposure', '600', '--target-sigma', '2'], /give --exposure or --target-sigma, not both/],
    [['--vmag', 'bright', '--teff', '5000'], /--vmag = "bright"/],
  ])('bad input: one line, exit 2 (%s)', async (args, pattern) => {
    const r = await runCliInProcess(['precision', '--instrument', 'stable-4m', ...(args as string[])]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(pattern);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
