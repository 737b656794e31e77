import { DateTime } from 'luxon';
import { z } from 'zod';

// Number and date schemas shared by readers and by the saved shapes (the plan's output, a fitted orbit), each with the
// one-line `allowed` text an input error quotes when a saved file breaks it.

/** Full BJD_TDB bounds (DEVELOPERS.md: `tcBjdTdb` is never a reduced BJD). */
export const MIN_BJD = 2.4e6;
export const MAX_BJD = 2.6e6;

export const num = z.number();
export const nonNegative = num.min(0, 'zero or more');
export const positive = num.positive('more than zero');
export const fraction = num.min(0, 'a fraction from 0 to 1').max(1, 'a fraction from 0 to 1');
/** A number from min to max where every failure, a value of the wrong type included, is told by the one phrase `allowed`. */
export const numberIn = (min: number, max: number, allowed: string) => z.number({ error: allowed }).min(min, allowed).max(max, allowed);
export const wholeNonNegative = num.int('a whole number').min(0, 'a whole number, 0 or more');
export const bjd = num.min(MIN_BJD, 'a full BJD_TDB, 2400000 to 2600000').max(MAX_BJD, 'a full BJD_TDB, 2400000 to 2600000');
export const isoInstant = z.iso.datetime({ offset: true, error: 'an ISO 8601 instant' });

/** Years a campaign may lie in: the command-line dates' range (src/cli/nights.ts). */
export const FIRST_YEAR = 1900;
export const LAST_YEAR = 2100;
const DATE_ALLOWED = `a date as YYYY-MM-DD, years ${FIRST_YEAR} to ${LAST_YEAR}`;

/** A calendar date, ISO 8601 (YAML may hand us a Date for an unquoted date). */
export const isoDate = z.preprocess(
  (v) => (v instanceof Date && !Number.isNaN(v.getTime()) ? v.toISOString().slice(0, 10) : v),
  z.string({ error: DATE_ALLOWED }).refine((s) => {
    const date = DateTime.fromISO(s);
    return /^\d{4}-\d{2}-\d{2}$/.test(s) && date.isValid && date.year >= FIRST_YEAR && date.year <= LAST_YEAR;
  }, DATE_ALLOWED),
);
