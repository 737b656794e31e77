import { z } from 'zod';
import type { Instrument } from '../model.js';
import { readStructured } from './read-text.js';
import { issueToError } from './zod-issue.js';

/** A number in [min, max] (a physical range: tiny or huge values would overflow the precision model). */
const between = (min: number, max: number, unit: string) => z.number().min(min, `${min} to ${max} ${unit}`).max(max, `${min} to ${max} ${unit}`);
const seconds = between(1, 1e5, 'seconds');

/** Instrument profile schema (sites/instruments/*.json). */
export const instrumentSchema = z
  .strictObject({
    id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'lower-case letters, digits and hyphens'),
    name: z.string().min(1, 'a non-empty name'),
    apertureM: between(0.1, 50, 'metres'),
    reference: z.strictObject({
      sigmaMps: between(0.01, 1000, 'm/s'),
      vmag: z.number().min(-2, 'a V magnitude from -2 to 20').max(20, 'a V magnitude from -2 to 20'),
      exposureSec: seconds,
      teffK: z.number().min(2500, 'kelvin from 2500 to 10000').max(10000, 'kelvin from 2500 to 10000'),
      vsiniKms: between(0, 300, 'km/s'),
    }),
    floorMps: between(0, 1000, 'm/s'),
    readoutSec: between(0, 3600, 'seconds'),
    acquisitionSec: between(0, 3600, 'seconds'),
    minExposureSec: seconds,
    maxExposureSec: seconds,
    extinctionMagPerAirmass: z.number().min(0, 'mag per airmass from 0 to 1').max(1, 'mag per airmass from 0 to 1').default(0.15),
    lineWidthKms: between(0.1, 100, 'km/s').default(5),
    teffFactors: z.array(z.tuple([between(2300, 12000, 'kelvin'), between(0.01, 100, '(a factor)')])).min(2, 'at least two [teffK, factor] pairs').optional(),
    sourceNote: z.string().min(1, 'where the figures come from, or "typical, from memory"'),
  })
  .refine((v) => v.minExposureSec <= v.maxExposureSec, {
    path: ['maxExposureSec'],
    message: 'at least minExposureSec',
  });

export function parseInstrument(data: unknown, file: string): Instrument {
  const result = instrumentSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  const value = result.data;
  const teffFactors = value.teffFactors?.map(([t, f]) => [t, f] as [number, number]).sort((a, b) => a[0] - b[0]);
  return { ...value, teffFactors, file };
}

export function readInstrument(file: string): Instrument {
  return parseInstrument(readStructured(file, 'instrument profile'), file);
}
