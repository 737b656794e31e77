import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/run-cli.js';

describe('crest precision', () => {
  it('--json shows every factor of the budget, and they multiply to the photon noise', () => {
    const r = runCli(['precision', '--instrument', 'stable-2m', '--vmag', '10.5', '--teff', '6300', '--vsini', '9', '--jitter', '2.5', '--exposure', '1200', '--airmass', '1.5', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    const b = out.exposure.budget;
    const product = Object.values(b.factors as Record<string, number>).reduce((a, x) => a * x, 1);
    expect(b.photonMps).toBeCloseTo(3.0 * product, 10); // stable-2m reference sigma 3 m/s
    expect(b.factors.magnitude).toBeCloseTo(10 ** (0.2 * 2.5), 12);
    expect(b.factors.exposure).toBeCloseTo(Math.sqrt(900 / 1200), 12);
    expect(b.effMps).toBeCloseTo(Math.hypot(b.photonMps, 1.5, 2.5), 10);
    expect(out.exposure.goal).toBe('fixed');
    expect(out.visitCostSec).toBe(1200 + 40 + 180);
  });

  it('the table shows the budget and a too-faint warning', () => {
    const r = runCli(['precision', '--instrument', 'stable-4m', '--vmag', '13.5', '--teff', '5000', '--target-sigma', '1']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/effective sigma/);
    expect(r.stdout).toMatch(/Warning: too faint/);
  });

  it.each([
    [['--vmag', '9'], /--teff = \(missing\): required/],
    [['--vmag', '9', '--teff', '5000', '--exposure', '600', '--target-sigma', '2'], /give --exposure or --target-sigma, not both/],
    [['--vmag', 'bright', '--teff', '5000'], /--vmag = "bright"/],
  ])('bad input: one line, exit 2 (%s)', (args, pattern) => {
    const r = runCli(['precision', '--instrument', 'stable-4m', ...(args as string[])]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(pattern);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
