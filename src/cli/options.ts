import { inputError } from '../errors.js';
import { parseDecimal } from '../io/decimal.js';
import { jsonChunks } from '../report/json-chunks.js';

/** A commander argument parser for a number flag in [min, max]; bad values are input errors. */
export function numberFlag(flag: string, allowed: string, min: number, max: number, opts: { exclusiveMin?: boolean; integer?: boolean } = {}) {
  return (text: string): number => {
    const value = parseDecimal(text);
    const ok =
      Number.isFinite(value) &&
      (opts.exclusiveMin ? value > min : value >= min) &&
      value <= max &&
      (!opts.integer || Number.isInteger(value));
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

/** Prints one JSON document on stdout, in pieces (a document may be longer than a string can be). */
export function printJson(value: unknown): void {
  for (const piece of jsonChunks(value)) process.stdout.write(piece);
  process.stdout.write('\n');
}
