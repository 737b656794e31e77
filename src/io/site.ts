import { z } from 'zod';
import { DateTime, IANAZone } from 'luxon';
import type { Site } from '../model.js';
import { readStructured } from './read-text.js';
import { issueToError } from './zod-issue.js';

/** An IANA zone name; luxon would also take fixed offsets such as `UTC+25`, which are no zone. */
const isZone = (name: string) => IANAZone.isValidZone(name);
const fraction = z.number().min(0, 'a fraction from 0 to 1').max(1, 'a fraction from 0 to 1');

const monthDay = z
  .string({ error: 'a month and day as MM-DD' })
  .refine((s) => /^\d{2}-\d{2}$/.test(s) && DateTime.fromISO(`2000-${s}`).isValid, 'a month and day as MM-DD');
const semesterBounds = z.strictObject({ start: monthDay, end: monthDay });

/** Site file schema (sites/*.json). */
export const siteSchema = z.strictObject({
  id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'lower-case letters, digits and hyphens'),
  name: z.string().min(1, 'a non-empty name'),
  latitudeDeg: z.number().min(-90, 'degrees from -90 to +90').max(90, 'degrees from -90 to +90'),
  longitudeDeg: z.number().min(-180, 'degrees from -180 to +180, east positive').max(180, 'degrees from -180 to +180, east positive'),
  elevationM: z.number().min(-500, 'metres from -500 to 9000').max(9000, 'metres from -500 to 9000'),
  timeZone: z.string().refine(isZone, 'an IANA time-zone name such as America/Santiago'),
  minAltitudeDeg: z.number().min(0, 'degrees from 0 to 80').max(80, 'degrees from 0 to 80').default(20),
  horizon: z
    .array(
      z.strictObject({
        azimuthDeg: z.number().min(0, 'degrees from 0 to 360').max(360, 'degrees from 0 to 360'),
        altitudeDeg: z.number().min(-10, 'degrees from -10 to 90').max(90, 'degrees from -10 to 90'),
      }),
    )
    .min(2, 'at least two points')
    .optional(),
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
  semesters: z
    .strictObject({ A: semesterBounds, B: semesterBounds })
    .optional(),
  sourceNote: z.string().min(1, 'where the coordinates come from, or "from memory"'),
});

export function parseSite(data: unknown, file: string): Site {
  const result = siteSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  const site = result.data;
  return { ...site, horizon: site.horizon?.slice().sort((a, b) => a.azimuthDeg - b.azimuthDeg), file };
}

export function readSite(file: string): Site {
  return parseSite(readStructured(file, 'site file'), file);
}
