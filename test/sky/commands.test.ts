// The built CLI (dist/cli/main.js) in-process: `npm test` builds first.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCliInProcess } from '../cli/run-cli.js';

const ROOT = path.join(import.meta.dirname, '..', '..');
const crest = (...args: string[]) => runCliInProcess(args, ROOT);

describe('crest nights', () => {
  it('prints a table in local time and one JSON document', async () => {
    const table = await crest('nights', '--site', 'la-silla', '--from', '2027-03-01', '--to', '2027-03-03');
    expect(table.status).toBe(0);
    expect(table.stdout).toMatch(/America\/Santiago/);
    expect(table.stdout.split('\n').filter((l) => l.startsWith('2027-03-0'))).toHaveLength(3);
    const json = JSON.parse((await crest('nights', '--site', 'la-silla', '--from', '2027-03-01', '--to', '2027-03-01', '--json', '--utc')).stdout);
    expect(json.nights[0].sunset).toMatch(/^2027-03-01T23:\d\d:\d\dZ$/);
  });

  it('takes a site file path and reports nights without darkness', async () => {
    const out = await crest('nights', '--site', 'test/fixtures/sites/high-arctic.json', '--from', '2027-06-20', '--to', '2027-06-20', '--csv');
    expect(out.status).toBe(0);
    expect(out.stdout).toMatch(/Sun never below -12 deg/);
  });

  it('rejects a bad date or level with one line and exit status 2', async () => {
    for (const args of [
      ['--from', '2027-02-30', '--to', '2027-03-01'],
      ['--from', '2027-03-02', '--to', '2027-03-01'],
      ['--from', '2027-03-01', '--to', '2027-03-01', '--twilight', 'dusky'],
    ]) {
      const out = await crest('nights', '--site', 'la-silla', ...args);
      expect(out.status).toBe(2);
      expect(out.stderr.trim().split('\n')).toHaveLength(1);
    }
  });
});

describe('crest visibility', () => {
  it('lists windows of the demo targets, as a table, JSON and CSV', async () => {
    const args = ['visibility', '--site', 'la-silla', '--targets', 'examples/demo/targets.csv', '--from', '2027-03-01', '--to', '2027-03-02'];
    const table = await crest(...args);
    expect(table.status).toBe(0);
    expect(table.stdout).toMatch(/SELVA-12/);
    const json = JSON.parse((await crest(...args, '--json')).stdout);
    // Each of the 13 targets' 2 nights has a window or is listed once, grouped by reason, without one.
    const withWindow = new Set((json.windows as { targetId: string; localDate: string }[]).map((w) => `${w.targetId} ${w.localDate}`));
    const without = (json.noWindow as { targetId: string; localDates: string[] }[]).flatMap((g) => g.localDates.map((d) => `${g.targetId} ${d}`));
    expect(new Set(without).size).toBe(without.length);
    expect(without.filter((k) => withWindow.has(k))).toEqual([]);
    expect(withWindow.size + without.length).toBe(13 * 2);
    const csv = await crest(...args, '--csv', '--max-airmass', '1.5');
    expect(csv.stdout.split('\r\n')[0]).toBe('localDate,targetId,start,end,hours,bestTime,minAirmass,moonSeparationDeg');
  });

  it('rejects a bad airmass with exit status 2', async () => {
    const out = await crest(
      'visibility',
      '--site',
      'la-silla',
      '--targets',
      'examples/demo/targets.csv',
      '--from',
      '2027-03-01',
      '--to',
      '2027-03-02',
      '--max-airmass',
      '0.5',
    );
    expect(out.status).toBe(2);
    expect(out.stderr).toMatch(/--max-airmass/);
  });
});
