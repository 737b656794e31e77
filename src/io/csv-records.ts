import { parse as parseCsv, CsvError } from 'csv-parse/sync';
import { InputError, inputError } from '../errors.js';

/** One data row of a CSV file: its cells and the line it ends on. */
export interface CsvRow {
  cells: string[];
  line: number;
}

/** A parsed CSV file: the header cells and the data rows. */
export interface CsvTable {
  header: string[];
  rows: CsvRow[];
}

/**
 * Parses CSV text (RFC 4180; `#` starts a comment line; blank lines skipped; cells trimmed).
 * Every fault is one input-error line naming the file and the line: a malformed record, or a
 * file with no header row (empty, blank or only comments). `expected` says what the file holds.
 */
export function parseCsvTable(text: string, file: string, expected: string): CsvTable {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parseCsv(text, { bom: true, info: true, skip_empty_lines: true, trim: true, comment: '#', comment_no_infix: true }) as unknown as typeof records;
  } catch (err) {
    if (!(err instanceof CsvError)) throw err;
    const line = (err as CsvError & { lines?: number }).lines ?? lineCount(text);
    throw new InputError(`${file}: line ${line}: malformed CSV: ${err.message.replace(/^Invalid Record Length: /, '')}`);
  }
  const [header, ...rows] = records;
  if (!header) throw inputError({ file, field: '(file)', value: text.trim() === '' ? '' : '(only comments)', allowed: `no header row; expected ${expected}` });
  return { header: header.record, rows: rows.map(({ record, info }) => ({ cells: record, line: info.lines })) };
}

function lineCount(text: string): number {
  let lines = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < text.length - 1; i = text.indexOf('\n', i + 1)) lines++;
  return lines;
}
