// Large inputs: long series, long lists and deep nesting must end in a result or one located
// line, never in a stack overflow (argument spreads into Math.min, recursive parsers).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { renderTable } from '../../src/report/table.js';
import { CAMPAIGN_YAML, INSTRUMENT_JSON, SITE_JSON } from './bases.js';
import { caseFaults, runCase, type FuzzCase } from './fuzz-case.js';

const root = mkdtempSync(path.join(tmpdir(), 'crest-size-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

async function passes(name: string, c: FuzzCase) {
  const dir = path.join(root, name);
  const run = await runCase(c, dir);
  expect(caseFaults(c, run, dir)).toEqual([]);
  return run;
}

function rvSeries(rows: number): string {
  const lines = ['bjdTdb,rvMps,rvErrorMps'];
  for (let i = 0; i < rows; i++) lines.push(`${(2461000 + (i * 100) / rows).toFixed(6)},${(3 * Math.sin(i / 7)).toFixed(3)},2`);
  return `${lines.join('\n')}\n`;
}

function targetList(rows: number): string {
  const lines = ['id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,planetMsiniEarth'];
  for (let i = 0; i < rows; i++) {
    const planet = i % 2 ? ',,' : `${2 + (i % 50)},2461000.5,${5 + (i % 40)}`;
    lines.push(`Star-${i},${i % 360},${(i % 170) - 85},${6 + (i % 8)},${3500 + (i % 3000)},${planet}`);
  }
  return `${lines.join('\n')}\n`;
}

const nested = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;
const BASE = { 'campaign.yaml': CAMPAIGN_YAML, 'site.json': SITE_JSON, 'instrument.json': INSTRUMENT_JSON };

describe('size cases', () => {
  it('a 150,000-row RV series gives its periodogram', async () => {
    const run = await passes('rv', { files: { 'rv.csv': rvSeries(150_000) }, args: ['periodogram', '{dir}/rv.csv', '--json', '--top', '2'] });
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).visits).toBe(150_000);
  });

  it('a 100,000-target list is read whole (the run stops at the out folder, before planning)', async () => {
    const run = await passes('targets', {
      files: { ...BASE, 'targets.csv': targetList(100_000) },
      args: ['plan', '{dir}/campaign.yaml', '--out', '{dir}/site.json'],
    });
    expect(run.stderr).toMatch(/^crest: command line: --out = ".*site\.json": names an existing file/);
  });

  it.each([
    [
      'campaign.yaml',
      `${CAMPAIGN_YAML}extra: ${nested(100_000)}\n`,
      ['plan', '{dir}/campaign.yaml', '--out', '{dir}/out'],
      /campaign\.yaml: line 11, column 108: malformed YAML: nested more than 100 levels/,
    ],
    [
      'site.json',
      nested(100_000),
      ['nights', '--site', '{dir}/site.json', '--from', '2027-03-01', '--to', '2027-03-01'],
      /site\.json: line 1, column 101: malformed JSON: nested more than 100 levels/,
    ],
    [
      'plan.json',
      `{"a": ${nested(100_000)}}`,
      ['report', '{dir}/plan.json', '--out', '{dir}/out'],
      /plan\.json: line 1, column 106: malformed JSON: nested more than 100 levels/,
    ],
  ])('100,000 nested brackets in %s are one located line', async (name, text, args, message) => {
    const run = await passes(`deep-${name}`, { files: { ...BASE, [name]: text }, args });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(message);
  });

  it("renders the text table of 1,000 targets' windows over 200 nights (200,000 rows)", () => {
    const rows = Array.from({ length: 200_000 }, (_, i) => [`Star-${i % 1000}`, String(i)]);
    const text = renderTable([{ header: 'target' }, { header: 'n', align: 'right' }], rows);
    expect(text.split('\n')).toHaveLength(200_002);
    expect(text.split('\n')[2]).toBe('Star-0         0');
  });
});
