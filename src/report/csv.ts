import { stringify } from 'csv-stringify/sync';

type Cell = string | number | null | undefined;

/** Rows per piece of csvChunks: a few megabytes of text at most. */
const ROWS_PER_PIECE = 10_000;

/**
 * RFC 4180 CSV with a header row, CRLF line ends as the RFC asks, in pieces of at most
 * ROWS_PER_PIECE rows, so a very long table is written without being one string.
 */
export function* csvChunks(header: string[], rows: Cell[][]): Generator<string> {
  yield stringify([header], { record_delimiter: 'windows' });
  for (let i = 0; i < rows.length; i += ROWS_PER_PIECE) yield stringify(rows.slice(i, i + ROWS_PER_PIECE), { record_delimiter: 'windows' });
}

/** The whole CSV as one string (for files of modest size). */
export function toCsv(header: string[], rows: Cell[][]): string {
  return [...csvChunks(header, rows)].join('');
}
