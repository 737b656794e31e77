import { stringify } from 'csv-stringify/sync';

/** RFC 4180 CSV with a header row, CRLF line ends as the RFC asks. */
export function toCsv(header: string[], rows: (string | number | null | undefined)[][]): string {
  return stringify([header, ...rows], { record_delimiter: 'windows' });
}
