// `crest map --plan plan.json` on the report's invented fixture plan with four more visits of its
// blind-search target: the first case as subprocesses (the built CLI and its worker threads in a
// fresh process), the others in-process.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { renderPlanJson } from '../../src/report/plan-json.js';
import { fixturePlan } from '../report/fixture.js';
import { runCliAsync, runCliInProcess, tempFiles } from './run-cli.js';

/** The fixture plan with Alba observed on four more nights (7 visits in all), days apart. */
function planWithSearchVisits(): Plan {
  const plan = fixturePlan();
  const alba = plan.visits.filter((v) => v.starId === 'Alba');
  const extra = [2.9, 6.1, 8.8, 13.2].map((days, k) => {
    const base = alba[k % alba.length]!;
    const start = new Date(Date.parse(base.startUtc) + days * 86_400_000);
    return { ...base, startUtc: start.toISOString(), midBjdTdb: base.midBjdTdb + days };
  });
  return { ...plan, visits: [...plan.visits, ...extra] };
}

let dir: string;
let planFile: string;
beforeAll(() => {
  dir = tempFiles({});
  planFile = path.join(dir, 'plan.json');
  writeFileSync(planFile, renderPlanJson(planWithSearchVisits()));
});

const small = ['--grid', '4x5', '--trials', '40', '--seed', '9'];

describe('crest map', () => {
  it('gives the same map with 1 and 2 threads, and one JSON document', async () => {
    const [one, two] = await Promise.all([
      runCliAsync(['map', '--plan', planFile, '--target', 'Alba', ...small, '--threads', '1', '--json', '--out', path.join(dir, 'one')]),
      runCliAsync(['map', '--plan', planFile, '--target', 'Alba', ...small, '--threads', '2', '--json', '--out', path.join(dir, 'two')]),
    ]);
    expect(one.stderr).toBe('');
    expect(one.status).toBe(0);
    const a = JSON.parse(one.stdout),
      b = JSON.parse(two.stdout);
    expect(a.targets).toHaveLength(1);
    expect(a.targets[0].simulated).toEqual(b.targets[0].simulated);
    expect(a.targets[0].simulated).toHaveLength(4);
    expect(a.targets[0].simulated[0]).toHaveLength(5);
    // Defaults from the search spec (2 to 40 d) and its mass (8 Earth masses: half to eight times).
    expect(a.targets[0].periodsDays[0]).toBeCloseTo(2, 9);
    expect(a.targets[0].periodsDays[3]).toBeCloseTo(40, 9);
    expect(a.targets[0].msinisEarth[0]).toBeCloseTo(4, 9);
    expect(a.targets[0].msinisEarth[4]).toBeCloseTo(64, 9);
    expect(existsSync(path.join(dir, 'one', 'map-alba.svg'))).toBe(true);
  });

  it('prints tables for every mappable target, writes SVG maps and map data, re-renders a report.html beside them', async () => {
    const seeded = tempFiles({ 'report.html': 'old' });
    const r = await runCliInProcess(['map', '--plan', planFile, ...small, '--out', seeded]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Alba: 7 visits over .* blind search, detection probability/);
    expect(r.stdout).toMatch(/Teyu-3 +P = +3\.217 d: /);
    expect(r.stdout).toMatch(/Mirador-7 +P = +8\.703 d: /);
    const svg = readFileSync(path.join(seeded, 'map-teyu-3.svg'), 'utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    // Two panels (analytic, simulated) of 4 x 5 cells each.
    expect(svg.match(/role-mark map_cells_marks/g)).toHaveLength(2);
    expect(readFileSync(path.join(seeded, 'report.html'), 'utf8')).toContain('chart-detection-map');
    expect(JSON.parse(readFileSync(path.join(seeded, 'map-alba.json'), 'utf8')).targetId).toBe('Alba');
    // Mapping another target later keeps Alba's saved map in the report.
    const again = await runCliInProcess(['map', '--plan', planFile, ...small, '--target', 'Teyu-3', '--out', seeded]);
    expect(again.status).toBe(0);
    expect(readFileSync(path.join(seeded, 'report.html'), 'utf8').match(/<figure class="chart chart-detection-map"/g)).toHaveLength(1);
  });

  it('writes CSV with one row per cell and method', async () => {
    const r = await runCliInProcess(['map', '--plan', planFile, '--target', 'Teyu-3', ...small, '--csv', '--out', path.join(dir, 'csv')]);
    expect(r.status).toBe(0);
    const lines = r.stdout.trim().split('\r\n');
    expect(lines[0]).toBe('target,kind,method,periodDays,msiniEarth,detectionProbability');
    expect(lines).toHaveLength(1 + 2 * 4 * 5);
    expect(lines[1]).toMatch(/^Teyu-3,ephemeris,analytic,/);
  });

  it('injects eccentric orbits with --ecc-max (0 is the circular map, a wider range changes it)', async () => {
    const run = (extra: string[], out: string) =>
      runCliInProcess(['map', '--plan', planFile, '--target', 'Alba', ...small, '--json', '--out', path.join(dir, out), ...extra]);
    const [circular, zero, eccentric] = await Promise.all([run([], 'c'), run(['--ecc-max', '0'], 'z'), run(['--ecc-max', '0.6'], 'e')]);
    const [c, z, e] = [circular, zero, eccentric].map((r) => JSON.parse(r.stdout));
    expect(z.targets[0].simulated).toEqual(c.targets[0].simulated);
    expect(e.eccMax).toBe(0.6);
    expect(e.targets[0].simulated).not.toEqual(c.targets[0].simulated);
  });

  it('answers bad flags with one line and exit 2', async () => {
    const cases = [
      ['--grid', '4'],
      ['--periods', '10:2'],
      ['--masses', 'a:b'],
      ['--trials', '0'],
      ['--fap', '1'],
      ['--threads', '0'],
      ['--target', 'Nowhere'],
      ['--ecc-max', '0.95'],
      ['--target', 'Alba', '--periods', '0.001:100000'],
    ];
    const results = await Promise.all(cases.map((flags) => runCliInProcess(['map', '--plan', planFile, ...flags])));
    for (const r of results) {
      expect(r.status).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
    }
    expect(results[6]!.stderr).toContain('Teyu-3, Mirador-7, Alba');
    // A period range whose periodogram grid would take hours is refused before any work.
    expect(results[8]!.stderr).toMatch(/^crest: command line: --periods = "0\.001:100000": a map of at most 1e\+9 frequency-trials/);
    const missing = await runCliInProcess(['map', '--plan', path.join(dir, 'none.json')]);
    expect(missing.status).toBe(2);
  });
});
