import { z } from 'zod';
import type { Instrument } from '../model.js';
import { readStructured } from './read-text.js';
import { issueToError } from './zod-issue.js';

const positive = (unit: string) => z.number().positive(`a positive number of ${unit}`);
const nonNegative = (unit: string) => z.number().min(0, `zero or more ${unit}`);

/** Instrument profile schema (sites/instruments/*.json). */
export const instrumentSchema = z
  .strictObject({
    id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'lower-case letters, digits and hyphens'),
    name: z.string().min(1, 'a non-empty name'),
    apertureM: positive('metres'),
    reference: z.strictObject({
      sigmaMps: positive('m/s'),
      vmag: z.number().min(-2, 'a V magnitude from -2 to 20').max(20, 'a V magnitude from -2 to 20'),
      exposureSec: positive('seconds'),
      teffK: z.number().min(2500, 'kelvin from 2500 to 10000').max(10000, 'kelvin from 2500 to 10000'),
      vsiniKms: nonNegative('km/s'),
    }),
    floorMps: nonNegative('m/s'),
    readoutSec: nonNegative('seconds'),
    acquisitionSec: nonNegative('seconds'),
    minExposureSec: positive('seconds'),
    maxExposureSec: positive('seconds'),
    extinctionMagPerAirmass: z.number().min(0, 'mag per airmass from 0 to 1').max(1, 'mag per airmass from 0 to 1').default(0.15),
    lineWidthKms: positive('km/s').default(5),
    teffFactors: z.array(z.tuple([z.number(), positive('(factor)')])).min(2, 'at least two [teffK, factor] pairs').optional(),
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
