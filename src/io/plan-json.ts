import { z } from 'zod';
import { inputError } from '../errors.js';
import { bjd, fraction, isoDate, isoInstant, nonNegative, num, positive } from '../field-schemas.js';
import { type Campaign, DEFAULT_SEARCH_COMPLETENESS } from '../plan/campaign.js';
import {
  backupNightSchema,
  observedVisitSchema,
  plannedVisitSchema,
  plannedHalfSchema,
  planTotalsSchema,
  replanSchema,
  sweepRowSchema,
  targetSummarySchema,
  type Plan,
} from '../plan/plan-schema.js';
import { constraintsSchema, timeSchema } from '../constraints.js';
import { recoverBeforeReading } from './output-set.js';
import { readJson } from './read-text.js';
import { siteSchema } from '../site.js';
import { slug } from './slug.js';
import { issueToError } from './zod-issue.js';

// The one reader of a saved plan.json (`crest report`, `crest map`): every field of the Plan is
// checked, so a damaged file is one input-error line naming its key path, never a silent result.
// Keys the model does not have are dropped, so a newer plan.json with added fields still reads.

const NOT_A_PLAN = 'a Crest plan (the plan.json written by crest plan, schemaVersion 1)';
/** Optional numbers: JSON writes a missing value as an absent key, a non-finite one as null. */
const optional = <T extends z.ZodType<number>>(schema: T) => schema.nullish().transform((v) => v ?? undefined);
/** The plan's output parts (src/plan/plan-schema.ts) have no null field: a null there is a number JSON could not write. */
const withoutNulls = <T extends z.ZodType>(schema: T) => z.preprocess(dropNullKeys, schema);
const instant = isoInstant.transform((s) => new Date(s));
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
  visitSigmaMps: optional(positive),
  maxVisits: optional(positive),
  maxHours: optional(positive),
  jitterSource: z.string().optional(),
  priority: positive,
  goalSignificance: optional(positive),
  ephemeris: z
    .object({ periodDays: positive, periodErrDays: nonNegative, tcBjdTdb: bjd, tcErrDays: nonNegative, transitDurationHours: optional(positive) })
    .optional(),
  planet: z
    .object({
      msiniEarth: optional(positive),
      kMps: optional(positive),
      ecc: num.min(0, 'from 0 to 0.99').max(0.99, 'from 0 to 0.99'),
      omegaDeg: num,
      eccPriorSigma: optional(positive),
    })
    .optional(),
  search: z
    .object({ periodMinDays: positive, periodMaxDays: positive, msiniEarth: positive })
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
  goals: z.object({ significance: positive, probability: fraction.default(0.9), searchCompleteness: positive.max(1).default(DEFAULT_SEARCH_COMPLETENESS) }),
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

const planSchema = z
  .object({
    schemaVersion: z.literal(1, { error: NOT_A_PLAN }),
    generator: z.string(),
    replan: replanSchema.optional(),
    observed: z.array(withoutNulls(observedVisitSchema)).optional(),
    campaign: campaignSchema,
    nights: z.array(nightSchema),
    plannedDates: z.array(localDate),
    plannedHalves: z.array(plannedHalfSchema).optional(),
    backups: z.array(backupNightSchema),
    visits: z.array(withoutNulls(plannedVisitSchema)),
    targets: z.array(withoutNulls(targetSummarySchema)),
    totals: withoutNulls(planTotalsSchema),
    nightsSweep: z.array(sweepRowSchema).optional(),
    warnings: z.array(z.string()),
  })
  .superRefine((plan, ctx) => {
    const ids = new Set(plan.campaign.targets.map((t) => t.id));
    // Ids name output files (map-<id>.svg): two may not differ only in case or punctuation.
    const bySlug = new Map<string, string>();
    plan.campaign.targets.forEach((t, i) => {
      const earlier = bySlug.get(slug(t.id));
      if (earlier !== undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['campaign', 'targets', i, 'id'],
          message: `an id that differs from ${JSON.stringify(earlier)} in more than case or punctuation`,
        });
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
  // Every part is typed by its schema but the campaign, whose instrument and observed rows are
  // checked only for what names them (the report and map read no other field): the one cast.
  const { campaign, ...rest } = result.data;
  return { ...rest, campaign: campaign as unknown as Campaign };
}

/** A copy of `value` with every null-valued key removed, at every depth (arrays kept as they are, their items cleaned). */
function dropNullKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(dropNullKeys);
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) if (v !== null) out[key] = dropNullKeys(v);
  return out;
}

/** Reads and checks a plan.json written by `crest plan`. */
export function readPlan(file: string): Plan {
  recoverBeforeReading(file);
  return planFromJson(readJson(file, 'plan file'), file);
}
