import path from 'node:path';
import { z } from 'zod';
import { DateTime } from 'luxon';
import { constraintsSchema, eachDateOnce, timeSchema } from '../constraints.js';
import { FIRST_YEAR, isoDate, LAST_YEAR, numberIn } from '../field-schemas.js';
import { inputError } from '../errors.js';
import type { Constraints, Target } from '../model.js';
import { type Campaign, DEFAULT_SEARCH_COMPLETENESS } from '../plan/campaign.js';
import { readInstrument } from './instrument.js';
import { INSTRUMENTS_DIR, SITES_DIR } from './paths.js';
import { readStructured } from './read-text.js';
import { existingFile, resolveRef } from './resolve.js';
import { readSite } from './site.js';
import { semesterWindow } from './semester.js';
import { readObserved } from './observed.js';
import { readTargets } from './targets.js';
import { issueToError } from './zod-issue.js';
import { DEFAULT_NIGHTLY_JITTER_FRACTION } from '../rv/star-noise.js';

/** The constraints a campaign gets when it gives none; commands that take them as flags share these. */
export const DEFAULT_CONSTRAINTS: Constraints = constraintsSchema.parse({});

/** Campaign file schema (docs/design.md, "Input files"). Paths are relative to the campaign file. */
export const campaignSchema = z.strictObject({
  name: z.string({ error: 'a campaign name' }).min(1, 'a campaign name'),
  site: z.string({ error: 'a site id or a path to a site file' }).min(1, 'a site id or a path to a site file'),
  instrument: z.string({ error: 'an instrument id or a path to an instrument profile' }).min(1, 'an instrument id or a path'),
  targets: z.string({ error: 'a path to a target list (CSV)' }).min(1, 'a path to a target list (CSV)'),
  window: z.union(
    [
      z
        .strictObject({ start: isoDate, end: isoDate })
        .refine((w) => w.start <= w.end, { path: ['end'], message: 'on or after window.start' })
        .refine((w) => DateTime.fromISO(w.end).diff(DateTime.fromISO(w.start), 'days').days <= 731, {
          path: ['end'],
          message: 'at most two years after window.start',
        }),
      z.strictObject({ semester: z.string().regex(/^(19\d\d|20\d\d|2100)[AB]$/, `a semester such as 2027A or 2027B, years ${FIRST_YEAR} to ${LAST_YEAR}`) }),
    ],
    { error: '{ start: YYYY-MM-DD, end: YYYY-MM-DD } or { semester: 2027A }' },
  ),
  time: timeSchema,
  constraints: constraintsSchema.default(DEFAULT_CONSTRAINTS),
  goals: z
    .strictObject({
      significance: z.number().positive('a positive K/sigma_K').max(100, 'at most 100').default(5),
      probability: numberIn(0.5, 0.99, 'a probability from 0.5 to 0.99').default(0.9),
      searchCompleteness: z
        .number({ error: 'a completeness above 0 and at most 1' })
        .gt(0, 'a completeness above 0 and at most 1')
        .max(1, 'a completeness above 0 and at most 1')
        .default(DEFAULT_SEARCH_COMPLETENESS),
    })
    .default({ significance: 5, probability: 0.9, searchCompleteness: DEFAULT_SEARCH_COMPLETENESS }),
  noise: z
    .strictObject({
      nightlyJitterFraction: numberIn(0, 1, 'a fraction from 0 to 1').default(DEFAULT_NIGHTLY_JITTER_FRACTION),
    })
    .default({ nightlyJitterFraction: DEFAULT_NIGHTLY_JITTER_FRACTION }),
  transits: z
    .strictObject({
      confidence: numberIn(0.5, 0.9999, 'a probability from 0.5 to 0.9999').default(0.95),
      maxOrbitFraction: numberIn(0, 0.5, 'a fraction of the orbit from 0 to 0.5').default(0.2),
    })
    .default({ confidence: 0.95, maxOrbitFraction: 0.2 }),
  seed: z.number().int('a whole number').min(0, 'a whole number, 0 or more').default(1),
  observed: z.string({ error: 'a path to the observed-visits file (CSV)' }).min(1, 'a path to the observed-visits file (CSV)').optional(),
  lost: z.array(isoDate).superRefine(eachDateOnce).default([]),
});

export function readCampaign(file: string): Campaign {
  const data = readStructured(file, 'campaign file');
  const result = campaignSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  const c = result.data;
  const baseDir = path.dirname(path.resolve(file));
  const sitePath = resolveRef(c.site, SITES_DIR, 'site', { file, field: 'site', baseDir });
  const instrumentPath = resolveRef(c.instrument, INSTRUMENTS_DIR, 'instrument', { file, field: 'instrument', baseDir });
  const targetsFile = existingFile(path.resolve(baseDir, c.targets), c.targets, 'target list', { file, field: 'targets' });
  const shown = (p: string) => path.relative(process.cwd(), p) || p;
  const site = readSite(shown(sitePath));
  const window = 'semester' in c.window ? semesterWindow(c.window.semester, site.semesters) : c.window;
  if (c.time.mode === 'given-nights') {
    c.time.dates.forEach((date, i) => {
      if (date < window.start || date > window.end) {
        throw inputError({ file, field: `time.dates[${i}]`, value: date, allowed: `a date inside the window ${window.start} to ${window.end}` });
      }
    });
  }
  const targets = readTargets(shown(targetsFile));
  const observedFile =
    c.observed === undefined
      ? undefined
      : shown(existingFile(path.resolve(baseDir, c.observed), c.observed, 'observed-visits file', { file, field: 'observed' }));
  return {
    name: c.name,
    file,
    site,
    instrument: readInstrument(shown(instrumentPath)),
    targets,
    targetsFile: shown(targetsFile),
    window,
    time: c.time,
    constraints: c.constraints,
    goals: c.goals,
    noise: c.noise,
    transits: c.transits,
    seed: c.seed,
    ...(observedFile ? { observed: { file: observedFile, rows: readObserved(observedFile, knownIds(targets)) } } : {}),
    lostDates: [...c.lost].sort(),
  };
}

/** The ids an observed row may name: every star and every row of the target list. */
function knownIds(targets: Target[]): Set<string> {
  return new Set(targets.flatMap((t) => [t.id, t.starId]));
}
