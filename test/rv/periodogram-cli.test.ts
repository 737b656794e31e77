import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseRvSeries } from '../../src/io/rv-series.js';
import { runCliInProcess } from '../cli/run-cli.js';

const EXAMPLE = 'examples/rv/invented-star.csv';
const crest = (...args: string[]) => runCliInProcess(args);

describe('RV series reader', () => {
  it('reads a series with comments and any header case and order', () => {
    const text = '# a comment\nRVERRORMPS,BJDtdb,RvMps\n1.5,2461000.1,3\n2,2461001.2,-1\n1,2461003.3,0\n1,2461004.4,2\n1,2461007.5,1\n';
    const s = parseRvSeries(text, 's.csv');
    expect(s.timesBjdTdb).toEqual([2461000.1, 2461001.2, 2461003.3, 2461004.4, 2461007.5]);
    expect(s.rvMps[1]).toBe(-1);
    expect(s.rvErrorsMps[0]).toBe(1.5);
  });

  it.each([
    ['reduced BJD', 'bjdTdb,rvMps,rvErrorMps\n61000.1,1,1\n', /s\.csv: row 1 \(line 2\): bjdTdb = "61000\.1": a full BJD_TDB/],
    ['zero sigma', 'bjdTdb,rvMps,rvErrorMps\n2461000.1,1,0\n', /row 1 \(line 2\): rvErrorMps = "0": uncertainty in m\/s/],
    ['unknown column', 'bjdTdb,rv,rvErrorMps\n2461000.1,1,1\n', /header: columns = "bjdTdb,rv,rvErrorMps"/],
    ['too few rows', 'bjdTdb,rvMps,rvErrorMps\n2461000.1,1,1\n2461001.1,1,1\n', /rows = 2: at least 5 visits/],
  ])('names the place of bad input: %s', (_name, text, pattern) => {
    expect(() => parseRvSeries(text, 's.csv')).toThrow(pattern);
  });
});

describe('crest periodogram', () => {
  it('finds the invented 11.3-day signal of the example file, with a small FAP', async () => {
    const run = await crest('periodogram', EXAMPLE, '--json', '--top', '4');
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout);
    expect(out.visits).toBe(30);
    expect(out.peaks).toHaveLength(4);
    const best = out.peaks[0];
    // The file was generated with P = 11.3 d, K = 4 m/s (examples/rv/make-invented-star.mjs): the best
    // peak lies within one resolution element 1/T (common practice), with a fitted K near 4 m/s.
    expect(Math.abs(best.freqPerDay - 1 / 11.3)).toBeLessThan(1 / out.baselineDays);
    expect(best.amplitudeMps).toBeGreaterThan(2.5);
    expect(best.amplitudeMps).toBeLessThan(5.5);
    expect(best.fapBaluev).toBeLessThan(0.01);
    expect(best.power).toBeGreaterThan(out.fapLevels.find((l: { fap: number }) => l.fap === 0.01).power);
    for (const p of out.peaks.slice(1)) expect(p.fapBaluev).toBeGreaterThan(best.fapBaluev);
  });

  it('prints a table with the data summary', async () => {
    const r = await crest('periodogram', EXAMPLE, '--top', '3');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/30 visits over 88\.1 days/);
    expect(r.stdout).toMatch(/rank\s+period \(d\)/);
    expect(
      r.stdout
        .trim()
        .split('\n')
        .filter((l) => /^\s+[123]\s/.test(l)),
    ).toHaveLength(3);
  });

  it('exits 2 with one line for a bad row and for a bad flag', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crest-pg-'));
    const file = join(dir, 'bad.csv');
    writeFileSync(file, 'bjdTdb,rvMps,rvErrorMps\n2461000.1,3,1\n2461001.1,fast,1\n');
    const bad = await crest('periodogram', file);
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
    expect(bad.stderr).toMatch(/bad\.csv: row 2 \(line 3\): rvMps = "fast"/);
    const flag = await crest('periodogram', EXAMPLE, '--max-period', '1');
    expect(flag.status).toBe(2);
    expect(flag.stderr).toMatch(/--max-period = 1: longer than the shortest period/);
  });
});
