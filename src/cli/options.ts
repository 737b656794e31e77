import { DateTime } from 'luxon';
import { inputError } from '../errors.js';
import { parseDecimal } from '../io/decimal.js';
import { csvChunks } from '../report/csv.js';
import { jsonChunks } from '../report/json-chunks.js';

/** A commander argument parser for a number flag in [min, max]; bad values are input errors. */
export function numberFlag(flag: string, allowed: string, min: number, max: number, opts: { exclusiveMin?: boolean; integer?: boolean } = {}) {
  return (text: string): number => {
    const value = parseDecimal(text);
    const ok = Number.isFinite(value) && (opts.exclusiveMin ? value > min : value >= min) && value <= max && (!opts.integer || Number.isInteger(value));
    if (!ok) throw inputError({ file: 'command line', field: flag, value: text, allowed });
    return value;
  };
}

/** A commander argument parser for one of a fixed set of words. */
export function choiceFlag<T extends string>(flag: string, choices: readonly T[]) {
  return (text: string): T => {
    if (!(choices as readonly string[]).includes(text)) {
      throw inputError({ file: 'command line', field: flag, value: text, allowed: `one of ${choices.join(', ')}` });
    }
    return text as T;
  };
}

/** Prints a CSV table on stdout, in pieces of rows (csvChunks). */
export function printCsv(header: string[], rows: (string | number | null | undefined)[][]): void {
  for (const piece of csvChunks(header, rows)) process.stdout.write(piece);
}

/** Prints one JSON document on stdout, in pieces (a document may be longer than a string can be). */
export function printJson(value: unknown): void {
  for (const piece of jsonChunks(value)) process.stdout.write(piece);
  process.stdout.write('\n');
}

/**
 * A commander parser for an instant: ISO 8601 with a zone (Z or an offset), or the word `now`
 * for the current time, read here at the edge (the core never reads the clock).
 */
export function instantFlag(flag: string) {
  return (text: string): Date => {
    if (text === 'now') return new Date();
    const date = DateTime.fromISO(text, { setZone: true });
    if (!date.isValid || !/(Z|[+-]\d{2}(:?\d{2})?)$/.test(text)) {
      throw inputError({
        file: 'command line',
        field: flag,
        value: text,
        allowed: 'an ISO 8601 time with its zone, such as 2027-03-20T02:10:00Z or 2027-03-19T23:10:00-03:00, or now',
      });
    }
    return date.toJSDate();
  };
}

/** A commander parser for a comma-separated list of dates (YYYY-MM-DD), each once. */
export function datesFlag(flag: string) {
  return (text: string): string[] => {
    const dates = text.split(',').map((d) => d.trim());
    dates.forEach((d, i) => {
      if (!/^\d{4}-\d{2}-\d{2}$/.test(d) || !DateTime.fromISO(d).isValid)
        throw inputError({ file: 'command line', field: flag, value: d, allowed: 'dates as YYYY-MM-DD, separated by commas' });
      if (dates.indexOf(d) !== i) throw inputError({ file: 'command line', field: flag, value: d, allowed: 'each date once' });
    });
    return dates;
  };
}
