import { z } from 'zod';
import { inputError } from '../errors.js';
import type { ObservedRow } from '../plan/campaign.js';
import { parseCsvTable } from './csv-records.js';
import { isoInstantMs } from './iso-instant.js';
import { numberField } from './number-cell.js';
import { readText } from './read-text.js';

export type { ObservedRow };

type Cell = string | undefined;
const blankToUndefined = (cell: Cell) => (cell === undefined || cell.trim() === '' ? undefined : cell.trim());
const ID_ALLOWED = 'required: a star or planet id of the target list';
const INSTRUMENT_ALLOWED = 'required: an instrument id of letters, digits and hyphens';
const UTC_ALLOWED = 'mid-exposure as ISO 8601 date and time with Z or an offset, e.g. 2027-03-14T02:10:00Z';

/** Columns of an observed-visits file (lower-case keys; header names are case-insensitive). */
const rowSchema = z.strictObject({
  target: z.preprocess(blankToUndefined, z.string({ error: ID_ALLOWED })),
  midbjdtdb: numberField('mid-exposure as a full BJD_TDB in days, 2400000 to 2600000', 2.4e6, 2.6e6),
  midutc: z.preprocess(
    blankToUndefined,
    z
      .string()
      .refine((text) => Number.isFinite(isoInstantMs(text)), UTC_ALLOWED)
      .optional(),
  ),
  instrument: z.preprocess(blankToUndefined, z.string({ error: INSTRUMENT_ALLOWED }).regex(/^[A-Za-z0-9-]+$/, INSTRUMENT_ALLOWED)),
  rvmps: numberField('measured radial velocity in m/s, -1e6 to 1e6', -1e6, 1e6),
  // Below 1 mm/s the weights 1/sigma^2 of a fit leave the range of a double (as for an RV series).
  rverrormps: numberField('1-sigma RV uncertainty in m/s, 0.001 to 10000', 1e-3, 1e4),
});
type Row = z.infer<typeof rowSchema>;

const COLUMNS = Object.keys(rowSchema.shape);
const CANONICAL: Record<string, string> = {
  target: 'target',
  midbjdtdb: 'midBjdTdb',
  midutc: 'midUtc',
  instrument: 'instrument',
  rvmps: 'rvMps',
  rverrormps: 'rvErrorMps',
};
const display = (column: string) => CANONICAL[column] ?? column;
const EXPECTED = 'the header target,midBjdTdb or midUtc,instrument (rvMps,rvErrorMps optional) and one row per visit made';

/** Refuses unknown, repeated and missing columns; returns the lower-case column names. */
function checkHeader(header: string[], file: string): string[] {
  const columns = header.map((name) => name.trim().toLowerCase());
  const unknown = header.filter((_, i) => !COLUMNS.includes(columns[i]!));
  if (unknown.length > 0) {
    throw inputError({
      file,
      where: 'header',
      field: 'columns',
      value: unknown.join(','),
      allowed: `unknown column(s); allowed: ${COLUMNS.map(display).join(', ')}`,
    });
  }
  columns.forEach((column, i) => {
    if (columns.indexOf(column) !== i)
      throw inputError({ file, where: `header column ${i + 1}`, field: 'column', value: header[i], allowed: 'each column once' });
  });
  for (const column of ['target', 'instrument']) {
    if (!columns.includes(column))
      throw inputError({ file, where: 'header', field: column, value: undefined, allowed: `required column missing; the header has: ${header.join(', ')}` });
  }
  if (!columns.includes('midbjdtdb') && !columns.includes('midutc')) {
    throw inputError({
      file,
      where: 'header',
      field: 'midBjdTdb',
      value: undefined,
      allowed: `a column midBjdTdb or midUtc is required; the header has: ${header.join(', ')}`,
    });
  }
  return columns;
}

/** Cross-field rules of one row: exactly one time, RV and its error together, a known id. */
function buildRow(
  data: Row,
  raw: Record<string, string>,
  knownIds: ReadonlySet<string>,
  fail: (column: string, allowed: string) => never,
): Omit<ObservedRow, 'row' | 'line'> {
  if (!knownIds.has(data.target)) fail('target', 'a star or planet id of the target list (this id is not in it)');
  const hasBjd = data.midbjdtdb !== undefined;
  const hasUtc = data.midutc !== undefined;
  if (hasBjd && hasUtc) fail('midutc', 'give midBjdTdb or midUtc, not both');
  if (!hasBjd && !hasUtc) fail('midbjdtdb', 'required: midBjdTdb (full BJD_TDB) or midUtc (ISO 8601 with Z or an offset)');
  if ((data.rvmps === undefined) !== (data.rverrormps === undefined)) {
    fail(data.rvmps === undefined ? 'rvmps' : 'rverrormps', 'rvMps and rvErrorMps go together: both or neither');
  }
  const out: Omit<ObservedRow, 'row' | 'line'> = { targetId: data.target, instrument: data.instrument };
  if (hasBjd) out.midBjdTdb = data.midbjdtdb;
  if (hasUtc) out.midUtc = new Date(isoInstantMs(raw.midutc!)).toISOString();
  if (data.rvmps !== undefined) {
    out.rvMps = data.rvmps;
    out.rvErrorMps = data.rverrormps;
  }
  return out;
}

/**
 * Parses an observed-visits file (CSV, RFC 4180, header row; `#` starts a comment line). A file
 * with only its header is allowed: no visits made yet. `knownIds` are the target list's star and
 * planet ids. Every fault is one input-error line with file, row, field, value and what is allowed.
 */
export function parseObserved(text: string, file: string, knownIds: ReadonlySet<string>): ObservedRow[] {
  const table = parseCsvTable(text, file, EXPECTED);
  const columns = checkHeader(table.header, file);
  return table.rows.map(({ cells, line }, index) => {
    const raw = Object.fromEntries(columns.map((c, i) => [c, cells[i] ?? '']));
    const where = `row ${index + 1} (line ${line})`;
    const fail = (column: string, allowed: string): never => {
      throw inputError({ file, where, field: display(column), value: raw[column] ?? '', allowed });
    };
    const result = rowSchema.safeParse(raw);
    if (!result.success) {
      const issue = result.error.issues[0]!;
      fail(String(issue.path[0]), issue.message.startsWith('Invalid input') ? 'a valid value' : issue.message);
    }
    return { ...buildRow(result.data!, raw, knownIds, fail), row: index + 1, line };
  });
}

export function readObserved(file: string, knownIds: ReadonlySet<string>): ObservedRow[] {
  return parseObserved(readText(file, 'observed-visits file'), file, knownIds);
}
