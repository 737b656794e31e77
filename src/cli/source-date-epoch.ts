import { inputError } from '../errors.js';

/** The largest instant a JavaScript Date holds, in seconds since 1970. */
const MAX_SECONDS = 8.64e12;

/**
 * SOURCE_DATE_EPOCH (reproducible-builds.org convention): whole seconds since 1970-01-01 UTC,
 * digits only, as `date +%s` prints them. Unset or empty: undefined. Anything else is an input
 * error, as the convention asks a malformed value to fail the run. Returns milliseconds.
 */
export function sourceDateEpochMs(value: string | undefined): number | undefined {
  if (value === undefined || value === '') return undefined;
  if (!/^\d+$/.test(value) || Number(value) > MAX_SECONDS) {
    throw inputError({
      file: 'environment',
      field: 'SOURCE_DATE_EPOCH',
      value,
      allowed: 'whole seconds since 1970-01-01 UTC (digits only, as `date +%s` prints)',
    });
  }
  return Number(value) * 1000;
}
