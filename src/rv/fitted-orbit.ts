import { z } from 'zod';
import { bjd, nonNegative, positive, num } from '../field-schemas.js';

/** A planet's K and ephemeris as fitted to RVs, with 1-sigma errors (shared by the fit and the plan). */
export const fittedOrbitSchema = z.object({
  kMps: num,
  kErrMps: nonNegative,
  tcBjdTdb: bjd,
  tcErrDays: nonNegative,
  periodDays: positive,
  periodErrDays: nonNegative,
});

export type FittedOrbit = z.output<typeof fittedOrbitSchema>;
