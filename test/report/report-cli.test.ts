// `crest report PLAN.json`: the built CLI run in-process (npm test builds dist/ first).
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/html/report-html.js';
import { renderPlanJson } from '../../src/report/plan-json.js';
import { runCliInProcess } from '../cli/run-cli.js';
import { fixturePlan } from './fixture.js';

let dir: string;

const crest = (...args: string[]) => runCliInProcess(args);

beforeAll(() => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'crest-report-'));
  writeFileSync(path.join(dir, 'plan.json'), renderPlanJson(fixturePlan()));
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('crest report', () => {
  it('re-renders report.html beside plan.json, byte for byte what the plan in memory gives', async () => {
    const r = await crest('report', path.join(dir, 'plan.json'));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const written = readFileSync(path.join(dir, 'report.html'), 'utf8');
    // Dates went to ISO strings and back: the page must not change.
    expect(written).toBe(await renderReportHtml(fixturePlan()));
  });

  it('writes under --out and prints one JSON document with --json', async () => {
    const out = path.join(dir, 'elsewhere');
    const r = await crest('report', path.join(dir, 'plan.json'), '--out', out, '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.written).toEqual([path.join(out, 'report.html')]);
    expect(doc.charts).toBeGreaterThan(5);
    expect(existsSync(path.join(out, 'report.html'))).toBe(true);
  });

  it.each([
    ['a campaign file', 'campaign.json', '{"name": "Demo", "site": "la-silla"}', /campaign\.json: schemaVersion = \(missing\): a Crest plan/],
    ['malformed JSON', 'broken.json', '{"schemaVersion": 1,', /broken\.json: line 1, column 21: malformed JSON: the text ends too early/],
    ['a list', 'list.json', '[1, 2]', /list\.json: \(file\) = "\[\.\.\.\]": a Crest plan/],
  ])('refuses %s with one line and exit status 2', async (_what, name, text, message) => {
    const file = path.join(dir, name);
    writeFileSync(file, text);
    const out = path.join(dir, `out-${name}`);
    const r = await crest('report', file, '--out', out);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message);
    expect(existsSync(out)).toBe(false);
  });

  it('names the key of a bad instant inside a plan', async () => {
    const plan = JSON.parse(renderPlanJson(fixturePlan()));
    plan.nights[2].sunset = 'yesterday evening';
    const file = path.join(dir, 'bad-night.json');
    writeFileSync(file, JSON.stringify(plan));
    const r = await crest('report', file);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad-night\.json: nights\[2\]\.sunset = "yesterday evening"/);
  });

  it('reports a missing file as bad input', async () => {
    const r = await crest('report', path.join(dir, 'nowhere.json'));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/nowhere\.json: plan file no such file/);
  });
});
