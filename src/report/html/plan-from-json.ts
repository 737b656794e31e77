import { IANAZone } from 'luxon';
import { z } from 'zod';
import { inputError } from '../../errors.js';
import { issueToError } from '../../io/zod-issue.js';
import type { Plan } from '../../model.js';

// The parts of a saved plan.json the report reads, checked so that a file that is not a Crest
// plan gives one clear line. Objects are loose: fields the report does not read pass through.

const NOT_A_PLAN = 'a Crest plan (the plan.json written by crest plan, schemaVersion 1)';
const isoInstant = z.iso.datetime({ offset: true }).transform((s) => new Date(s));
const instant = isoInstant.nullable();
const num = z.number();
/** Optional numbers: JSON writes a missing value as an absent key, a non-finite one as null. */
const optNum = num.nullish().transform((v) => v ?? undefined);
const localDate = z.iso.date();

const targetSchema = z.looseObject({
  id: z.string(),
  starId: z.string(),
  raDeg: num,
  decDeg: num,
  pmRaMasYr: num,
  pmDecMasYr: num,
  epochYear: num,
  vmag: num,
  massSun: num,
  search: z.looseObject({ periodMinDays: num, periodMaxDays: num, massEarth: num }).optional(),
});

const campaignSchema = z.looseObject({
  name: z.string(),
  site: z.looseObject({
    name: z.string(),
    latitudeDeg: num,
    longitudeDeg: num,
    elevationM: num,
    timeZone: z.string().refine((zone) => IANAZone.isValidZone(zone), 'an IANA time-zone name'),
    minAltitudeDeg: num,
    clearFraction: z.union([num, z.array(num)]),
  }),
  instrument: z.looseObject({ name: z.string() }),
  targets: z.array(targetSchema),
  window: z.looseObject({ start: localDate, end: localDate }),
  noise: z.looseObject({ nightlyJitterFraction: num }),
  time: z.looseObject({ mode: z.enum(['choose-nights', 'given-nights', 'hours']) }),
  constraints: z.looseObject({ twilight: z.string(), maxAirmass: num, moonSeparationDeg: num }),
  goals: z.looseObject({ significance: num }),
});

const edges = z.object({ dusk: instant, dawn: instant });
const nightSchema = z.looseObject({
  localDate,
  sunset: instant,
  sunrise: instant,
  civil: edges,
  nautical: edges,
  astronomical: edges,
  darkStart: instant,
  darkEnd: instant,
  darkHours: num,
  moon: z.looseObject({ illumination: num, rise: instant, set: instant, upDuringDark: z.boolean() }),
});

const visitSchema = z.looseObject({
  starId: z.string(),
  localDate,
  startUtc: z.iso.datetime({ offset: true }),
  startLocal: z.string(),
  midBjdTdb: num,
  exposureSec: num,
  durationSec: num,
  airmass: num,
  moonSeparationDeg: num,
  phases: z.array(z.looseObject({ targetId: z.string(), phase: num, phaseErr: num })),
  sigmaMps: num,
  sigmaEffMps: num.positive(),
  sigmaWhiteMps: num.positive(),
  snrPerPixel: num,
});

const summarySchema = z.looseObject({
  targetId: z.string(),
  starId: z.string(),
  kind: z.enum(['ephemeris', 'search', 'monitor']),
  priority: num,
  kMps: optNum,
  visits: num,
  hours: num,
  sigmaKMps: optNum,
  kOverSigmaK: optNum,
  goal: optNum,
  goalProbability: optNum,
  informationEfficiency: optNum,
  phaseErrAtEnd: optNum,
  warnings: z.array(z.string()),
});

const planSchema = z.looseObject({
  schemaVersion: z.literal(1, { error: NOT_A_PLAN }),
  generator: z.string(),
  campaign: campaignSchema,
  nights: z.array(nightSchema),
  plannedDates: z.array(localDate),
  backups: z.array(z.looseObject({ localDate, rank: num, utilityGain: num })),
  visits: z.array(visitSchema),
  targets: z.array(summarySchema),
  totals: z.looseObject({ nights: num, visits: num, exposureHours: num, overheadHours: num, totalHours: num, utility: num }),
  warnings: z.array(z.string()),
});

/**
 * A Plan from the parsed text of a saved plan.json: checks what the report reads and turns ISO
 * strings back into Dates where the model has a Date. Anything else is an input error naming
 * the file and the first bad key.
 */
export function planFromJson(data: unknown, file: string): Plan {
  if (data === null || typeof data !== 'object' || Array.isArray(data)) {
    throw inputError({ file, field: '(file)', value: Array.isArray(data) ? '[...]' : data, allowed: NOT_A_PLAN });
  }
  const result = planSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  return result.data as unknown as Plan;
}
