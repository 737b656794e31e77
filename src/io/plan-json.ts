import { z } from 'zod';
import { inputError } from '../errors.js';
import type { Plan } from '../model.js';
import { constraintsSchema, isoDate, timeSchema } from './campaign.js';
import { recoverBeforeReading } from './output-set.js';
import { readJson } from './read-text.js';
import { siteSchema } from './site.js';
import { slug } from './slug.js';
import { issueToError } from './zod-issue.js';

// The one reader of a saved plan.json (`crest report`, `crest map`): every field of the Plan is
// checked, so a damaged file is one input-error line naming its key path, never a silent result.
// Keys the model does not have are dropped, so a newer plan.json with added fields still reads.

const NOT_A_PLAN = 'a Crest plan (the plan.json written by crest plan, schemaVersion 1)';
const MIN_BJD = 2.4e6;
const MAX_BJD = 2.6e6;

const num = z.number();
const nonNegative = num.min(0, 'zero or more');
const positive = num.positive('more than zero');
const fraction = num.min(0, 'a fraction from 0 to 1').max(1, 'a fraction from 0 to 1');
const bjd = num.min(MIN_BJD, 'a full BJD_TDB, 2400000 to 2600000').max(MAX_BJD, 'a full BJD_TDB, 2400000 to 2600000');
/** Optional numbers: JSON writes a missing value as an absent key, a non-finite one as null. */
const optional = <T extends z.ZodType<number>>(schema: T) => schema.nullish().transform((v) => v ?? undefined);
const instant = z.iso.datetime({ offset: true, error: 'an ISO 8601 instant' }).transform((s) => new Date(s));
const instantOrNull = instant.nullable();
const localDate = isoDate;

const targetSchema = z.object({
  id: z.string().min(1, 'a target id'),
  starId: z.string().min(1, 'a star id'),
  raDeg: num.min(0, 'degrees from 0 to 360').max(360, 'degrees from 0 to 360'),
  decDeg: num.min(-90, 'degrees from -90 to +90').max(90, 'degrees from -90 to +90'),
  pmRaMasYr: num,
  pmDecMasYr: num,
  epochYear: num.min(1900, 'a year, 1900 to 2100').max(2100, 'a year, 1900 to 2100'),
  vmag: num.min(-2, 'a V magnitude from -2 to 20').max(20, 'a V magnitude from -2 to 20'),
  teffK: num.min(2300, 'kelvin from 2300 to 12000').max(12000, 'kelvin from 2300 to 12000'),
  massSun: positive,
  vsiniKms: nonNegative,
  jitterMps: nonNegative,
  nightlyJitterFraction: optional(fraction),
  rotationDays: optional(positive),
  activityMps: optional(nonNegative),
  activityCoherenceDays: optional(positive),
  mags: z.record(z.enum(['V', 'R', 'I', 'J', 'H', 'G']), num).optional(),
  logRhk: optional(num),
  logg: optional(num),
  exposureSec: optional(positive),
  sigmaMps: optional(positive),
  jitterSource: z.string().optional(),
  priority: positive,
  goalSignificance: optional(positive),
  ephemeris: z
    .object({ periodDays: positive, periodErrDays: nonNegative, tcBjdTdb: bjd, tcErrDays: nonNegative, transitDurationHours: optional(positive) })
    .optional(),
  planet: z.object({ massEarth: optional(positive), kMps: optional(positive), ecc: num.min(0, 'from 0 to 0.99').max(0.99, 'from 0 to 0.99'), omegaDeg: num, eccPriorSigma: optional(positive) }).optional(),
  search: z
    .object({ periodMinDays: positive, periodMaxDays: positive, massEarth: positive })
    .refine((s) => s.periodMinDays < s.periodMaxDays, { path: ['periodMaxDays'], message: 'longer than periodMinDays' })
    .optional(),
  estimated: z.array(z.string()),
  source: z.string(),
});

const campaignSchema = z.object({
  name: z.string(),
  file: z.string(),
  site: siteSchema.extend({ file: z.string() }),
  // The instrument as read (readInstrument fills and converts the file's fields): checked for what names it.
  instrument: z.looseObject({ id: z.string(), name: z.string(), file: z.string() }),
  targets: z.array(targetSchema).min(1, 'at least one target'),
  targetsFile: z.string(),
  window: z.object({ start: localDate, end: localDate }),
  time: timeSchema,
  constraints: constraintsSchema,
  goals: z.object({ significance: positive }),
  noise: z.object({ nightlyJitterFraction: fraction }),
  transits: z.object({ confidence: fraction, maxOrbitFraction: fraction }),
  seed: num.int('a whole number').min(0, 'a whole number, 0 or more'),
  observed: z.object({ file: z.string(), rows: z.array(z.looseObject({ targetId: z.string(), instrument: z.string() })) }).optional(),
  lostDates: z.array(localDate).default([]),
});

const edges = z.object({ dusk: instantOrNull, dawn: instantOrNull });
const nightSchema = z.object({
  localDate,
  sunset: instantOrNull,
  sunrise: instantOrNull,
  civil: edges,
  nautical: edges,
  astronomical: edges,
  darkStart: instantOrNull,
  darkEnd: instantOrNull,
  darkHours: num.min(0, 'hours from 0 to 24').max(24, 'hours from 0 to 24'),
  note: z.string().optional(),
  moon: z.object({ illumination: fraction, rise: instantOrNull, set: instantOrNull, upDuringDark: z.boolean() }),
});

const visitSchema = z.object({
  starId: z.string(),
  localDate,
  startUtc: z.iso.datetime({ offset: true, error: 'an ISO 8601 instant' }),
  startLocal: z.string(),
  midBjdTdb: bjd,
  exposureSec: positive,
  durationSec: positive,
  airmass: num.min(1, 'an airmass of 1 or more'),
  moonSeparationDeg: num.min(0, 'degrees from 0 to 180').max(180, 'degrees from 0 to 180'),
  phases: z.array(z.object({ targetId: z.string(), phase: num, phaseErr: nonNegative })),
  sigmaMps: positive,
  sigmaEffMps: positive,
  sigmaWhiteMps: positive,
  snrPerPixel: positive,
  kept: z.literal(true).optional(),
  icsSequence: num.int('a whole number').min(0, 'a whole number, 0 or more').optional(),
});

const observedSchema = z.object({
  targetId: z.string(),
  starId: z.string(),
  midBjdTdb: bjd,
  midUtc: z.iso.datetime({ offset: true, error: 'an ISO 8601 instant' }),
  localDate,
  instrument: z.string(),
  rvMps: optional(num),
  rvErrMps: optional(positive),
  sigmaWhiteMps: positive,
  source: z.string(),
});

const orbitUpdateSchema = z.object({
  points: nonNegative,
  kMps: num,
  kErrMps: nonNegative,
  tcBjdTdb: bjd,
  tcErrDays: nonNegative,
  periodDays: positive,
  periodErrDays: nonNegative,
  catalogue: z.object({ kMps: optional(num), tcBjdTdb: bjd, tcErrDays: nonNegative, periodDays: positive, periodErrDays: nonNegative }),
});

const summarySchema = z.object({
  targetId: z.string(),
  starId: z.string(),
  kind: z.enum(['ephemeris', 'search', 'monitor']),
  priority: positive,
  kMps: optional(nonNegative),
  visits: num.int('a whole number').min(0, 'zero or more'),
  hours: nonNegative,
  sigmaKMps: optional(nonNegative),
  kOverSigmaK: optional(nonNegative),
  goal: optional(positive),
  goalProbability: optional(fraction),
  informationEfficiency: optional(nonNegative),
  phaseErrAtEnd: optional(nonNegative),
  priorVisits: optional(nonNegative),
  priorKOverSigmaK: optional(nonNegative),
  fit: orbitUpdateSchema.optional(),
  peak: z.object({ periodDays: positive, kMps: nonNegative, fap: fraction, significant: z.boolean() }).optional(),
  warnings: z.array(z.string()),
});

const planSchema = z
  .object({
    schemaVersion: z.literal(1, { error: NOT_A_PLAN }),
    generator: z.string(),
    replan: z.object({ nowUtc: z.iso.datetime({ offset: true, error: 'an ISO 8601 instant' }), lostDates: z.array(localDate) }).optional(),
    observed: z.array(observedSchema).optional(),
    campaign: campaignSchema,
    nights: z.array(nightSchema),
    plannedDates: z.array(localDate),
    backups: z.array(z.object({ localDate, rank: num, utilityGain: num })),
    visits: z.array(visitSchema),
    targets: z.array(summarySchema),
    totals: z.object({ nights: nonNegative, visits: nonNegative, exposureHours: nonNegative, overheadHours: nonNegative, totalHours: nonNegative, utility: num }),
    warnings: z.array(z.string()),
  })
  .superRefine((plan, ctx) => {
    const ids = new Set(plan.campaign.targets.map((t) => t.id));
    // Ids name output files (map-<id>.svg): two may not differ only in case or punctuation.
    const bySlug = new Map<string, string>();
    plan.campaign.targets.forEach((t, i) => {
      const earlier = bySlug.get(slug(t.id));
      if (earlier !== undefined) ctx.addIssue({ code: 'custom', path: ['campaign', 'targets', i, 'id'], message: `an id that differs from ${JSON.stringify(earlier)} in more than case or punctuation` });
      bySlug.set(slug(t.id), t.id);
    });
    const known = `a target id of campaign.targets`;
    const stars = new Set(plan.campaign.targets.map((t) => t.starId));
    plan.visits.forEach((v, i) => {
      if (!stars.has(v.starId)) ctx.addIssue({ code: 'custom', path: ['visits', i, 'starId'], message: 'a star of campaign.targets' });
      v.phases.forEach((p, k) => {
        if (!ids.has(p.targetId)) ctx.addIssue({ code: 'custom', path: ['visits', i, 'phases', k, 'targetId'], message: known });
      });
    });
    plan.targets.forEach((s, i) => {
      if (!ids.has(s.targetId)) ctx.addIssue({ code: 'custom', path: ['targets', i, 'targetId'], message: known });
    });
  });

/**
 * A Plan from the parsed content of a saved plan.json: checks every field and turns ISO strings
 * back into Dates where the model has a Date. Anything else is an input error naming the file
 * and the first bad key path.
 */
export function planFromJson(data: unknown, file: string): Plan {
  if (data === null || typeof data !== 'object' || Array.isArray(data)) {
    throw inputError({ file, field: '(file)', value: Array.isArray(data) ? '[...]' : data, allowed: NOT_A_PLAN });
  }
  const result = planSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  return result.data as unknown as Plan;
}

/** Reads and checks a plan.json written by `crest plan`. */
export function readPlan(file: string): Plan {
  recoverBeforeReading(file);
  return planFromJson(readJson(file, 'plan file'), file);
}
