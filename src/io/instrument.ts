import { z } from 'zod';
import type { Instrument } from '../rv/instrument.js';
import { BANDS } from '../rv/bands.js';
import { readStructured } from './read-text.js';
import { issueToError } from './zod-issue.js';

const positive = (unit: string) => z.number().positive(`a positive number of ${unit}`);
const nonNegative = (unit: string) => z.number().min(0, `zero or more ${unit}`);
const between = (min: number, max: number, text: string) => z.number().min(min, text).max(max, text);

/** Fields whose numbers need a source note in `sources` (a published figure, "from memory", or "Crest's estimate"). */
export const SOURCED_FIELDS = [
  'apertureM',
  'resolvingPower',
  'coverageNm',
  'reference',
  'readNoiseE',
  'pixelsPerResolutionElement',
  'spatialPixels',
  'entrance',
  'skyMagPerArcsec2',
  'floorMps',
  'overheads',
  'exposureLimits',
  'extinctionMagPerAirmass',
] as const;

const entrance = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('fibre'), diameterArcsec: positive('arcsec') }),
    z.strictObject({ kind: z.literal('slit'), widthArcsec: positive('arcsec') }),
  ],
  { error: 'an entrance {"kind": "fibre", "diameterArcsec"} or {"kind": "slit", "widthArcsec"}' },
);

/** Instrument profile schema (sites/instruments/*.json). */
export const instrumentSchema = z
  .strictObject({
    id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'lower-case letters, digits and hyphens'),
    name: z.string().min(1, 'a non-empty name'),
    apertureM: between(0.1, 50, 'metres from 0.1 to 50'),
    resolvingPower: between(5000, 300000, 'a resolving power R = λ/Δλ from 5000 to 300000'),
    band: z.enum(BANDS, { error: `one of ${BANDS.join(', ')}` }),
    wavelengthNm: between(300, 2500, 'nm from 300 to 2500'),
    coverageNm: z.tuple([positive('nm'), positive('nm')]).refine(([a, b]) => a < b, 'shortest then longest wavelength, nm'),
    spectralRegion: z.enum(['optical', 'near-infrared'], { error: 'optical or near-infrared' }),
    reference: z.strictObject({
      photonSigmaMps: between(0.01, 1000, 'm/s from 0.01 to 1000'),
      mag: between(-2, 20, 'a magnitude from -2 to 20'),
      exposureSec: between(1, 1e5, 'seconds from 1 to 100000'),
      airmass: between(1, 3, 'an airmass from 1 to 3'),
      seeingArcsec: between(0.2, 5, 'arcsec from 0.2 to 5'),
      snrPerPixel: positive('(S/N per pixel)'),
      teffK: between(2500, 10000, 'kelvin from 2500 to 10000'),
      vsiniKms: nonNegative('km/s'),
    }),
    readNoiseE: nonNegative('electrons'),
    pixelsPerResolutionElement: between(1, 20, 'pixels from 1 to 20'),
    spatialPixels: between(1, 100, 'pixels from 1 to 100'),
    entrance,
    skyMagPerArcsec2: between(10, 25, 'mag/arcsec^2 from 10 to 25'),
    floorMps: nonNegative('m/s'),
    readoutSec: nonNegative('seconds'),
    acquisitionSec: nonNegative('seconds'),
    minExposureSec: between(1, 1e5, 'seconds from 1 to 100000'),
    maxExposureSec: between(1, 1e5, 'seconds from 1 to 100000'),
    extinctionMagPerAirmass: between(0, 1, 'mag per airmass from 0 to 1'),
    teffFactors: z
      .array(z.tuple([z.number(), positive('(factor)')]))
      .min(2, 'at least two [teffK, factor] pairs')
      .optional(),
    sources: z.record(z.string(), z.string().min(1, 'a non-empty source note')),
    sourceNote: z.string().min(1, 'where the figures come from, or "typical, from memory"'),
  })
  .refine((v) => v.minExposureSec <= v.maxExposureSec, {
    path: ['maxExposureSec'],
    message: 'at least minExposureSec',
  })
  .superRefine((v, ctx) => {
    for (const field of SOURCED_FIELDS) {
      if (!v.sources[field])
        ctx.addIssue({
          code: 'custom',
          path: ['sources', field],
          message: 'where this number comes from: a published figure, "from memory" or "Crest\'s estimate"',
        });
    }
  });

export function parseInstrument(data: unknown, file: string): Instrument {
  const result = instrumentSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  const value = result.data;
  const teffFactors = value.teffFactors?.map(([t, f]) => [t, f] as [number, number]).sort((a, b) => a[0] - b[0]);
  return { ...value, coverageNm: [value.coverageNm[0], value.coverageNm[1]], teffFactors, file };
}

export function readInstrument(file: string): Instrument {
  return parseInstrument(readStructured(file, 'instrument profile'), file);
}
