// `crest plan` as a subprocess (dist/cli.js; `npm test` builds it first): the five files and the
// summary, the same bytes from two runs with the same seed, --json, K/sigma_K recomputed from the
// written plan.csv, bad input, and an output folder that holds the inputs. The two demo runs are
// the shared ones of the global setup (test/support/demo-plan.ts).
import { copyFileSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCliInProcess, tempFiles, type CliResult } from '../cli/run-cli.js';
import { demoRuns } from '../support/demo-plan.js';
import { fixture } from './fixtures.js';
import { planFromJson } from '../../src/io/plan-json.js';
import { CSV_ROUNDING, csvVisits, kOverSigmaKFromCsv, parsePlanCsv } from './recompute-k.js';

/** Planets with an ephemeris in the demo's target list. */
const EPHEMERIS_PLANETS = 11;

const OUTPUTS = ['plan.csv', 'plan.ics', 'plan.json', 'plan.md', 'report.html'];
const read = (dir: string, name: string) => readFileSync(path.join(dir, name), 'utf8');
const oneLine = (r: CliResult) => r.stderr.trim().split('\n').length === 1 && r.stderr.trim().length > 0;

describe('crest plan on the demo', () => {
  // Two runs side by side, the second with --json: the files of both must be the same bytes.
  const { summary: summaryRun, json: jsonRun } = demoRuns();
  const [summaryDir, jsonDir] = [summaryRun.dir, jsonRun.dir];
  const [summary, json] = [summaryRun.result, jsonRun.result];

  it('exits 0, writes the five files and prints the summary', () => {
    expect(summary.status).toBe(0);
    expect(summary.stderr).toBe('');
    expect(readdirSync(summaryDir).sort()).toEqual(OUTPUTS);
    for (const id of ['SELVA-12', 'SELVA-85', 'Vira', 'Castell']) expect(summary.stdout).toContain(id);
    expect(summary.stdout).toMatch(/\d+ visits on \d+ nights/);
    expect(summary.stdout).toContain(`Wrote ${path.join(summaryDir, 'plan.md')}`);
  });

  it('the same seed writes byte-identical files', () => {
    expect(json.status).toBe(0);
    for (const name of OUTPUTS) expect(read(jsonDir, name) === read(summaryDir, name), name).toBe(true);
  });

  it('--json prints plan.json: one JSON document with schemaVersion 1', () => {
    expect(json.stderr).toBe('');
    expect(() => JSON.parse(json.stdout)).not.toThrow();
    expect(json.stdout).toBe(read(jsonDir, 'plan.json'));
    const plan = JSON.parse(json.stdout) as { schemaVersion: number; visits: unknown[]; campaign: { name: string } };
    expect(plan.schemaVersion).toBe(1);
    expect(plan.campaign.name).toBe('SELVA follow-up 2027A');
    expect(plan.visits.length).toBeGreaterThan(0);
  });

  it('K/sigma_K in the written plan.json equals a recomputation from the written plan.csv', () => {
    const plan = planFromJson(JSON.parse(read(summaryDir, 'plan.json')), 'plan.json');
    const visits = csvVisits(parsePlanCsv(read(summaryDir, 'plan.csv')).rows);
    const ephemerisTargets = plan.targets.filter((t) => t.kind === 'ephemeris');
    expect(ephemerisTargets.length).toBe(EPHEMERIS_PLANETS);
    for (const t of ephemerisTargets) {
      const value = kOverSigmaKFromCsv(plan, t, visits);
      expect(Math.abs(t.kOverSigmaK! - value), t.targetId).toBeLessThanOrEqual(CSV_ROUNDING * value + 1e-9);
    }
  });
});

describe('crest plan --nights', () => {
  it("chooses that many nights instead of the campaign's number", async () => {
    const dir = tempFiles({
      'campaign.yaml':
        'name: few\nsite: la-silla\ninstrument: stable-4m\ntargets: targets.csv\n' +
        'window: { start: 2027-04-01, end: 2027-04-10 }\ntime: { mode: choose-nights, nights: 5 }\n',
      'targets.csv': read(path.dirname(fixture('small')), 'targets.csv'),
    });
    const r = await runCliInProcess(['plan', path.join(dir, 'campaign.yaml'), '--nights', '2', '--json', '--out', path.join(dir, 'out')]);
    expect(r.status).toBe(0);
    const plan = JSON.parse(r.stdout) as { plannedDates: string[]; visits: { localDate: string }[]; campaign: { time: unknown } };
    expect(plan.campaign.time).toEqual({ mode: 'choose-nights', nights: 2 });
    expect(plan.plannedDates.length).toBeLessThanOrEqual(2);
    expect(new Set(plan.visits.map((v) => v.localDate)).size).toBeLessThanOrEqual(2);
  });
});

describe('plan.json names its inputs from the output folder', () => {
  it('a campaign given by absolute path: every file path is relative and resolves from the folder to the file read', async () => {
    const dir = tempFiles({
      'in/campaign.yaml':
        'name: paths\nsite: la-silla\ninstrument: stable-4m\ntargets: targets.csv\n' +
        'window: { start: 2027-04-01, end: 2027-04-04 }\ntime: { mode: choose-nights, nights: 2 }\n',
      'in/targets.csv': read(path.dirname(fixture('small')), 'targets.csv'),
    });
    const out = path.join(dir, 'results', 'run1');
    const r = await runCliInProcess(['plan', path.join(dir, 'in', 'campaign.yaml'), '--out', out]);
    expect(r.status).toBe(0);
    const plan = JSON.parse(read(out, 'plan.json')) as {
      campaign: { file: string; targetsFile: string; site: { file: string }; instrument: { file: string }; targets: { source: string }[] };
    };
    const c = plan.campaign;
    const expected = [
      [c.file, path.join(dir, 'in', 'campaign.yaml')],
      [c.targetsFile, path.join(dir, 'in', 'targets.csv')],
      [c.site.file, path.resolve('sites', 'la-silla.json')],
      [c.instrument.file, path.resolve('sites', 'instruments', 'stable-4m.json')],
    ];
    for (const [written, file] of expected) {
      expect(path.isAbsolute(written!), written).toBe(false);
      expect(path.resolve(out, written!)).toBe(file);
    }
    expect(c.file).toBe(path.join('..', '..', 'in', 'campaign.yaml'));
    for (const t of c.targets) expect(t.source.startsWith(`${c.targetsFile} row `), t.source).toBe(true);
  });
});

describe('crest plan on bad input', () => {
  it('a campaign asking for 0 nights: exit 2, one line naming the field', async () => {
    const dir = tempFiles({
      'campaign.yaml':
        'name: bad\nsite: la-silla\ninstrument: stable-4m\ntargets: targets.csv\n' +
        'window: { start: 2027-04-01, end: 2027-04-05 }\ntime: { mode: choose-nights, nights: 0 }\n',
      'targets.csv': read(path.dirname(fixture('small')), 'targets.csv'),
    });
    const r = await runCliInProcess(['plan', path.join(dir, 'campaign.yaml'), '--out', path.join(dir, 'out')]);
    expect(r.status).toBe(2);
    expect(oneLine(r)).toBe(true);
    expect(r.stderr).toContain('time.nights');
    expect(existsSync(path.join(dir, 'out'))).toBe(false);
  });

  it('--nights on a campaign that does not choose nights: exit 2, one line naming the flag', async () => {
    const r = await runCliInProcess(['plan', fixture('small'), '--nights', '3', '--out', path.join(tempFiles({}), 'out')]);
    expect(r.status).toBe(2);
    expect(oneLine(r)).toBe(true);
    expect(r.stderr).toContain('--nights');
  });

  it('a campaign file that does not exist: exit 2, one line', async () => {
    const r = await runCliInProcess(['plan', path.join(tempFiles({}), 'missing.yaml')]);
    expect(r.status).toBe(2);
    expect(oneLine(r)).toBe(true);
  });
});

describe('--out pointing at the folder that holds the inputs', () => {
  const small = path.dirname(fixture('small'));
  const campaignText = readFileSync(fixture('small'), 'utf8');

  it('a target list named plan.csv: exit 2, one line, nothing written, the list unchanged', async () => {
    const dir = tempFiles({ 'campaign.yaml': campaignText.replace('targets: targets.csv', 'targets: plan.csv') });
    copyFileSync(path.join(small, 'targets.csv'), path.join(dir, 'plan.csv'));
    const before = read(dir, 'plan.csv');
    const r = await runCliInProcess(['plan', 'campaign.yaml', '--out', '.'], dir);
    expect(r.status).toBe(2);
    expect(oneLine(r)).toBe(true);
    expect(r.stderr).toContain('--out');
    expect(read(dir, 'plan.csv')).toBe(before);
    expect(readdirSync(dir).sort()).toEqual(['campaign.yaml', 'plan.csv']);
  });

  it('a campaign file named plan.json: exit 2 and the file unchanged', async () => {
    const dir = tempFiles({});
    copyFileSync(path.join(small, 'targets.csv'), path.join(dir, 'targets.csv'));
    const campaign = JSON.stringify({
      name: 'as json',
      site: 'la-silla',
      instrument: 'stable-4m',
      targets: 'targets.csv',
      window: { start: '2027-04-01', end: '2027-04-04' },
      time: { mode: 'choose-nights', nights: 1 },
    });
    writeFileSync(path.join(dir, 'plan.json'), campaign);
    const r = await runCliInProcess(['plan', path.join(dir, 'plan.json'), '--out', dir]);
    expect(r.status).toBe(2);
    expect(oneLine(r)).toBe(true);
    expect(read(dir, 'plan.json')).toBe(campaign);
  });

  it('no name in common: exit 0, the five files beside the inputs, the inputs unchanged', async () => {
    const dir = tempFiles({ 'campaign.yaml': campaignText });
    copyFileSync(path.join(small, 'targets.csv'), path.join(dir, 'targets.csv'));
    const before = read(dir, 'targets.csv');
    const r = await runCliInProcess(['plan', 'campaign.yaml', '--out', '.'], dir);
    expect(r.status).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['campaign.yaml', ...OUTPUTS, 'targets.csv'].sort());
    expect(read(dir, 'targets.csv')).toBe(before);
    expect(read(dir, 'campaign.yaml')).toBe(campaignText);
  });
});
