import { z } from 'zod';
import { isoDate, numberIn } from './field-schemas.js';

// A campaign's observing constraints and time model: the campaign file's schemas (read by
// src/io/campaign.ts) and the types inferred from them. Units are in the names.

export const constraintsSchema = z.strictObject({
  twilight: z.enum(['civil', 'nautical', 'astronomical'], { error: 'one of civil, nautical, astronomical' }).default('nautical'),
  maxAirmass: numberIn(1, 5, 'an airmass from 1 to 5').default(2),
  moonSeparationDeg: numberIn(0, 180, 'degrees from 0 to 180').default(30),
  /** Minimum spacing between two visits of one target (hours). */
  minSpacingHours: z
    .number({ error: 'hours, 0 or more' })
    .min(0, 'hours, 0 or more')
    .max(24 * 365, 'hours, at most a year')
    .default(20),
  /**
   * When visits are one a night (minSpacingHours >= 12): least spacing of a star's visits within one night, start to start,
   * for stars with visitsPerNight > 1 (hours).
   */
  sameNightSpacingHours: numberIn(0, 12, 'hours from 0 to 12').default(2),
  /** Defaults for every star without its own maxVisits / maxHours column: caps on the visits and hours planned for it. */
  maxVisitsPerStar: z
    .number({ error: 'a whole number of visits from 1 to 100000' })
    .int('a whole number of visits')
    .min(1, 'at least 1 visit')
    .max(1e5, 'at most 100000 visits')
    .optional(),
  maxHoursPerStar: z.number({ error: 'hours, more than 0 and at most 10000' }).positive('more than 0 hours').max(1e4, 'at most 10000 hours').optional(),
  /** Windows shorter than this are dropped (minutes). */
  minWindowMinutes: z.number({ error: 'minutes, 0 or more' }).min(0, 'minutes, 0 or more').max(600, 'minutes, at most 600').default(20),
});
export type Constraints = z.output<typeof constraintsSchema>;
export type TwilightLevel = Constraints['twilight'];

export const timeSchema = z.discriminatedUnion(
  'mode',
  [
    z
      .strictObject({
        mode: z.literal('choose-nights'),
        nights: z.number({ error: 'a whole number of nights, 1 to 366 (halves with halfNights)' }).min(1, 'at least 1 night').max(366, 'at most 366 nights'),
        /** The planner chooses half nights (first or second half of the dark time), two to a night. */
        halfNights: z.boolean({ error: 'true or false' }).optional(),
      })
      .superRefine((time, ctx) => {
        const step = time.halfNights ? 0.5 : 1;
        if (!Number.isInteger(time.nights / step))
          ctx.addIssue({
            code: 'custom',
            path: ['nights'],
            message: time.halfNights ? 'a multiple of 0.5 nights' : 'a whole number of nights (or set halfNights: true)',
          });
      }),
    z.strictObject({ mode: z.literal('given-nights'), dates: z.array(isoDate).min(1, 'at least one date').superRefine(eachDateOnce) }),
    z.strictObject({
      mode: z.literal('hours'),
      hours: z.number({ error: 'a positive number of hours, at most 5000' }).positive('a positive number of hours').max(5000, 'at most 5000 hours'),
    }),
  ],
  { error: 'mode is one of choose-nights, given-nights, hours' },
);

/** Given nights are a set: a date listed twice would be counted twice. */
export function eachDateOnce(dates: string[], ctx: z.RefinementCtx): void {
  dates.forEach((date, i) => {
    const first = dates.indexOf(date);
    if (first !== i) ctx.addIssue({ code: 'custom', path: [i], message: `each date once (already given as dates[${first}])` });
  });
}
export type TimeModel = z.output<typeof timeSchema>;
