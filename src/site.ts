import { DateTime, IANAZone } from 'luxon';
import { z } from 'zod';
import { fraction } from './field-schemas.js';

// An observing site: the site file's schema (sites/*.json, read by src/io/site.ts) and the type
// inferred from it. Units are in the names.

/** An IANA zone name; luxon would also take fixed offsets such as `UTC+25`, which are no zone. */
const isZone = (name: string) => IANAZone.isValidZone(name);

const monthDay = z
  .string({ error: 'a month and day as MM-DD' })
  .refine((s) => /^\d{2}-\d{2}$/.test(s) && DateTime.fromISO(`2000-${s}`).isValid, 'a month and day as MM-DD');
const semesterBounds = z.strictObject({ start: monthDay, end: monthDay });

const horizonPointSchema = z.strictObject({
  azimuthDeg: z.number().min(0, 'degrees from 0 to 360').max(360, 'degrees from 0 to 360'),
  altitudeDeg: z.number().min(-10, 'degrees from -10 to 90').max(90, 'degrees from -10 to 90'),
});

/** Site file schema (sites/*.json). */
export const siteSchema = z.strictObject({
  id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'lower-case letters, digits and hyphens'),
  name: z.string().min(1, 'a non-empty name'),
  latitudeDeg: z.number().min(-90, 'degrees from -90 to +90').max(90, 'degrees from -90 to +90'),
  longitudeDeg: z.number().min(-180, 'degrees from -180 to +180, east positive').max(180, 'degrees from -180 to +180, east positive'),
  elevationM: z.number().min(-500, 'metres from -500 to 9000').max(9000, 'metres from -500 to 9000'),
  timeZone: z.string().refine(isZone, 'an IANA time-zone name such as America/Santiago'),
  minAltitudeDeg: z.number().min(0, 'degrees from 0 to 80').max(80, 'degrees from 0 to 80').default(20),
  horizon: z.array(horizonPointSchema).min(2, 'at least two points').optional(),
  hourAngleLimitsHours: z
    .strictObject({
      east: z.number().min(-12, 'hours from -12 to 0').max(0, 'hours from -12 to 0'),
      west: z.number().min(0, 'hours from 0 to 12').max(12, 'hours from 0 to 12'),
    })
    .optional(),
  clearFraction: z.union([fraction, z.array(fraction).length(12, 'twelve monthly values')], {
    error: 'a fraction from 0 to 1, or twelve monthly fractions',
  }),
  medianSeeingArcsec: z.number().min(0.2, 'arcsec from 0.2 to 5').max(5, 'arcsec from 0.2 to 5').optional(),
  semesters: z.strictObject({ A: semesterBounds, B: semesterBounds }).optional(),
  sourceNote: z.string().min(1, 'where the coordinates come from, or "from memory"'),
});

/** A point of the local horizon; altitude is interpolated linearly in azimuth (north = 0, east = 90). */
export type HorizonPoint = z.output<typeof horizonPointSchema>;

/**
 * A site as read: east-positive longitude, an IANA zone, the telescope's hour-angle limits (east
 * negative), the fraction of clear nights (one number or twelve monthly values, January first),
 * the median zenith seeing FWHM (omitted: each instrument's reference seeing), semester bounds as
 * `MM-DD` pairs (B may end in the next year), and the path of the file it came from.
 */
export type Site = z.output<typeof siteSchema> & { file: string };
