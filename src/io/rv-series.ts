import { z } from 'zod';
import { inputError } from '../errors.js';
import { extent } from '../extent.js';
import { parseCsvTable } from './csv-records.js';
import { parseDecimal } from './decimal.js';
import { readText } from './read-text.js';

/** A radial-velocity time series as read from a user's CSV file. */
export interface RvSeries {
  file: string;
  /** Times, BJD_TDB (days). */
  timesBjdTdb: number[];
  rvMps: number[];
  rvErrorsMps: number[];
}

/** Fewest rows accepted: the FAP of a floating-offset sinusoid needs N − 4 ≥ 1. */
export const MIN_RV_POINTS = 5;

const cell = (allowed: string, ok: (v: number) => boolean) =>
  z.preprocess(
    (text: string | undefined) => (text === undefined || text.trim() === '' ? undefined : parseDecimal(text)),
    z.number({ error: (issue) => (issue.input === undefined ? `required: ${allowed}` : allowed) }).refine((v) => Number.isFinite(v) && ok(v), allowed),
  );

/** Columns `bjdTdb,rvMps,rvErrorMps` (header names case-insensitive); keys are the lower-case names. */
const rowSchema = z.strictObject({
  bjdtdb: cell('a full BJD_TDB in days, 2400000 to 2600000', (v) => v >= 2.4e6 && v <= 2.6e6),
  rvmps: cell('radial velocity in m/s, -1e6 to 1e6', (v) => Math.abs(v) <= 1e6),
  // Below 1 mm/s the weights 1/sigma^2 of the periodogram and its FAP leave the range of a double.
  rverrormps: cell('uncertainty in m/s, from 0.001 to 10000', (v) => v >= 1e-3 && v <= 1e4),
});
const HEADER: Record<string, string> = { bjdtdb: 'bjdTdb', rvmps: 'rvMps', rverrormps: 'rvErrorMps' };

/** Parses an RV series (CSV, RFC 4180, header `bjdTdb,rvMps,rvErrorMps`; `#` starts a comment line). */
export function parseRvSeries(text: string, file: string): RvSeries {
  const table = parseCsvTable(text, file, 'the header bjdTdb,rvMps,rvErrorMps and one row per visit');
  const columns = table.header.map((name) => name.trim().toLowerCase());
  const expected = Object.keys(HEADER);
  if (columns.length !== expected.length || !expected.every((c) => columns.includes(c))) {
    throw inputError({
      file,
      where: 'header',
      field: 'columns',
      value: table.header.join(','),
      allowed: 'exactly the columns bjdTdb, rvMps, rvErrorMps (any order, any case)',
    });
  }
  const series: RvSeries = { file, timesBjdTdb: [], rvMps: [], rvErrorsMps: [] };
  const { rows } = table;
  rows.forEach(({ cells, line }, index) => {
    const raw = Object.fromEntries(columns.map((c, i) => [c, cells[i]]));
    const result = rowSchema.safeParse(raw);
    if (!result.success) {
      const column = String(result.error.issues[0]!.path[0]);
      throw inputError({
        file,
        where: `row ${index + 1} (line ${line})`,
        field: HEADER[column] ?? column,
        value: raw[column],
        allowed: result.error.issues[0]!.message,
      });
    }
    series.timesBjdTdb.push(result.data.bjdtdb);
    series.rvMps.push(result.data.rvmps);
    series.rvErrorsMps.push(result.data.rverrormps);
  });
  if (rows.length < MIN_RV_POINTS) {
    throw inputError({
      file,
      field: 'rows',
      value: rows.length,
      allowed: `at least ${MIN_RV_POINTS} visits for a periodogram and its false-alarm probability`,
    });
  }
  const times = extent(series.timesBjdTdb);
  if (times.min === times.max) {
    throw inputError({ file, field: 'bjdTdb', value: series.timesBjdTdb[0], allowed: 'visits at two or more distinct times' });
  }
  return series;
}

export function readRvSeries(file: string): RvSeries {
  return parseRvSeries(readText(file, 'RV series'), file);
}
