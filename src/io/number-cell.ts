import { z } from 'zod';
import { parseDecimal } from './decimal.js';

/**
 * An optional number cell of a CSV row; blank means "not given". `allowed` is what the error
 * line says is allowed; values outside [min, max] (or at min when exclusiveMin) are refused.
 */
export function numberField(allowed: string, min: number, max: number, opts: { exclusiveMin?: boolean } = {}) {
  return z.preprocess(
    (cell: string | undefined) => (cell === undefined || cell.trim() === '' ? undefined : parseDecimal(cell)),
    z
      .number({ error: allowed })
      .refine((v) => Number.isFinite(v) && (opts.exclusiveMin ? v > min : v >= min) && v <= max, allowed)
      .optional(),
  );
}
