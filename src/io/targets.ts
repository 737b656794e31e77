import { z } from 'zod';
import { inputError } from '../errors.js';
import type { Target } from '../model.js';
import type { BandId } from '../rv/bands.js';
import { dwarfColour } from '../rv/dwarf-colours.js';
import { defaultJitter } from '../rv/jitter.js';
import { DEFAULT_VSINI_KMS, massFromTeffSun } from '../rv/star-defaults.js';
import { parseCsvTable } from './csv-records.js';
import { parseDecimal } from './decimal.js';
import { numberField } from './number-cell.js';
import { readText } from './read-text.js';
import { parseDecDeg, parseRaDeg } from './sexagesimal.js';
import { slug } from './slug.js';

type Cell = string | undefined;

function angleField(parse: (text: string) => number, allowed: string, min: number, max: number) {
  return z.preprocess(
    (cell: Cell) => (cell === undefined || cell.trim() === '' ? undefined : parse(cell)),
    z
      .number({ error: allowed })
      .refine((v) => Number.isFinite(v) && v >= min && v <= max, allowed)
      .optional(),
  );
}

/** Columns of a target list (docs/design.md, "Input files"); header names are case-insensitive. */
const rowSchema = z.strictObject({
  id: z.string({ error: 'required: a star or planet name' }).trim().min(1, 'required: a star or planet name'),
  star: z.preprocess((cell: Cell) => (cell === undefined || cell.trim() === '' ? undefined : cell.trim()), z.string().optional()),
  ra: angleField(parseRaDeg, 'right ascension as degrees 0 to 360 or hh:mm:ss.s (0h to 24h)', 0, 360),
  dec: angleField(parseDecDeg, 'declination as degrees -90 to +90 or ±dd:mm:ss', -90, 90),
  pmramasyr: numberField('proper motion in RA*cos(dec), mas/yr, -20000 to 20000', -20000, 20000),
  pmdecmasyr: numberField('proper motion in Dec, mas/yr, -20000 to 20000', -20000, 20000),
  epochyear: numberField('epoch of the coordinates as a year, 1900 to 2100', 1900, 2100),
  vmag: numberField('V magnitude from -2 to 20', -2, 20),
  rmag: numberField('R magnitude (Cousins) from -2 to 20', -2, 20),
  imag: numberField('I magnitude (Cousins) from -2 to 20', -2, 20),
  jmag: numberField('J magnitude from -4 to 20', -4, 20),
  hmag: numberField('H magnitude from -4 to 20', -4, 20),
  gmag: numberField('Gaia G magnitude from -2 to 21', -2, 21),
  logrhk: numberField("chromospheric activity log R'HK from -6 to -3.5", -6, -3.5),
  logg: numberField('surface gravity log g (cgs) from 0 to 6', 0, 6),
  exposuresec: numberField('exposure time in seconds, more than 0 and at most 100000', 0, 1e5, { exclusiveMin: true }),
  visitsigmamps: numberField('sigma per visit in m/s (photon and floor), more than 0 and at most 10000', 0, 1e4, { exclusiveMin: true }),
  teffk: numberField('effective temperature in kelvin, 2300 to 12000', 2300, 12000),
  masssun: numberField('stellar mass in solar masses, more than 0.05 and at most 10', 0.05, 10, { exclusiveMin: true }),
  vsinikms: numberField('projected rotation in km/s, 0 to 300', 0, 300),
  jittermps: numberField('stellar jitter in m/s, 0 to 1000', 0, 1000),
  nightlyjitterfraction: numberField('fraction of the jitter variance shared within a night, 0 to 1', 0, 1),
  rotationdays: numberField('stellar rotation period in days, more than 0.1 and at most 1000', 0.1, 1000, { exclusiveMin: true }),
  activitymps: numberField('activity amplitude in m/s, 0 to 1000', 0, 1000),
  activitycoherencedays: numberField('activity coherence time in days, more than 0.1 and at most 10000', 0.1, 1e4, { exclusiveMin: true }),
  visitspernight: numberField('visits of the star in one night, a whole number from 1 to 12', 1, 12),
  maxvisits: numberField('most visits of the star this campaign plans, a whole number from 1 to 100000', 1, 1e5),
  maxhours: numberField('most hours of visit blocks of the star this campaign plans, more than 0 and at most 10000', 0, 1e4, { exclusiveMin: true }),
  priority: numberField('a priority weight, more than 0 and at most 100', 0, 100, { exclusiveMin: true }),
  goalsignificance: numberField('K/sigma_K to reach, more than 0 and at most 100', 0, 100, { exclusiveMin: true }),
  perioddays: numberField('orbital period in days, more than 0 and at most 100000', 0, 1e5, { exclusiveMin: true }),
  perioderrdays: numberField('period uncertainty in days, 0 or more (below the period)', 0, 1e5),
  tcbjdtdb: numberField('mid-transit time as a full BJD_TDB, 2400000 to 2600000', 2.4e6, 2.6e6),
  tcerrdays: numberField('uncertainty of Tc in days, 0 to 100', 0, 100),
  transitdurationhours: numberField('transit duration in hours, more than 0 and at most 48', 0, 48, { exclusiveMin: true }),
  planetmsiniearth: numberField('planet m sin i in Earth masses, more than 0 and at most 30000', 0, 3e4, { exclusiveMin: true }),
  planetkmps: numberField('semi-amplitude K in m/s, more than 0 and at most 10000', 0, 1e4, { exclusiveMin: true }),
  ecc: z.preprocess(
    (cell: Cell) => (cell === undefined || cell.trim() === '' ? undefined : parseDecimal(cell)),
    z
      .number({ error: 'eccentricity from 0 to 0.99' })
      .min(0, 'eccentricity from 0 to 0.99')
      .max(0.99, 'eccentricity from 0 to 0.99 (e >= 1 is not a bound orbit)')
      .optional(),
  ),
  omegadeg: numberField('argument of periastron in degrees, 0 to 360', 0, 360),
  eccsigma: numberField('prior width on e cos(omega) and e sin(omega) when e is fitted, more than 0 and at most 1', 0, 1, { exclusiveMin: true }),
  searchperiodmindays: numberField('shortest search period in days, more than 0.1 and at most 100000', 0.1, 1e5, { exclusiveMin: true }),
  searchperiodmaxdays: numberField('longest search period in days, more than 0.1 and at most 100000', 0.1, 1e5, { exclusiveMin: true }),
  searchmsiniearth: numberField('search m sin i in Earth masses, more than 0', 0, 3e4, { exclusiveMin: true }),
});

type Row = z.infer<typeof rowSchema>;
const COLUMNS = Object.keys(rowSchema.shape);
const CANONICAL: Record<string, string> = {
  pmramasyr: 'pmRaMasYr',
  pmdecmasyr: 'pmDecMasYr',
  epochyear: 'epochYear',
  teffk: 'teffK',
  masssun: 'massSun',
  vsinikms: 'vsiniKms',
  jittermps: 'jitterMps',
  goalsignificance: 'goalSignificance',
  perioddays: 'periodDays',
  perioderrdays: 'periodErrDays',
  tcbjdtdb: 'tcBjdTdb',
  tcerrdays: 'tcErrDays',
  transitdurationhours: 'transitDurationHours',
  planetmsiniearth: 'planetMsiniEarth',
  planetkmps: 'planetKMps',
  omegadeg: 'omegaDeg',
  searchperiodmindays: 'searchPeriodMinDays',
  searchperiodmaxdays: 'searchPeriodMaxDays',
  searchmsiniearth: 'searchMsiniEarth',
  nightlyjitterfraction: 'nightlyJitterFraction',
  rotationdays: 'rotationDays',
  activitymps: 'activityMps',
  activitycoherencedays: 'activityCoherenceDays',
  eccsigma: 'eccSigma',
  rmag: 'rmag',
  imag: 'imag',
  jmag: 'jmag',
  hmag: 'hmag',
  gmag: 'gmag',
  logrhk: 'logRhk',
  exposuresec: 'exposureSec',
  visitsigmamps: 'visitSigmaMps',
  visitspernight: 'visitsPerNight',
  maxvisits: 'maxVisits',
  maxhours: 'maxHours',
};
/** Magnitude columns other than V, by band. */
const BAND_COLUMNS: [BandId, 'rmag' | 'imag' | 'jmag' | 'hmag' | 'gmag'][] = [
  ['R', 'rmag'],
  ['I', 'imag'],
  ['J', 'jmag'],
  ['H', 'hmag'],
  ['G', 'gmag'],
];
const display = (column: string) => CANONICAL[column] ?? column;
const REQUIRED = ['id', 'ra', 'dec', 'vmag', 'teffk'];
/** Star fields: given once per star (on any of its rows) or repeated identically. */
const STAR_COLUMNS = [
  'ra',
  'dec',
  'pmramasyr',
  'pmdecmasyr',
  'epochyear',
  'vmag',
  'teffk',
  'masssun',
  'vsinikms',
  'jittermps',
  'nightlyjitterfraction',
  'rotationdays',
  'activitymps',
  'activitycoherencedays',
  'rmag',
  'imag',
  'jmag',
  'hmag',
  'gmag',
  'logrhk',
  'logg',
  'exposuresec',
  'visitsigmamps',
  'visitspernight',
  'maxvisits',
  'maxhours',
] as const;

interface Place {
  file: string;
  where: string;
  raw: Record<string, string>;
}

function fail(place: Place, column: string, allowed: string): never {
  throw inputError({ file: place.file, where: place.where, field: display(column), value: place.raw[column] ?? '', allowed });
}

/** Cross-field rules: what goes with what. */
function buildTarget(row: Row, place: Place): Target {
  const estimated: string[] = [];
  const need = (column: keyof Row, allowed: string) => {
    if (row[column] === undefined) fail(place, column, allowed);
  };
  need('ra', 'required on one row of the star: right ascension');
  need('dec', 'required on one row of the star: declination');
  need('teffk', 'required on one row of the star: effective temperature in kelvin');
  const teffK = row.teffk!;
  const mags: Partial<Record<BandId, number>> = {};
  for (const [band, column] of BAND_COLUMNS) if (row[column] !== undefined) mags[band] = row[column];
  const firstBand = BAND_COLUMNS.find(([band]) => mags[band] !== undefined)?.[0];
  if (row.vmag === undefined && firstBand === undefined)
    fail(place, 'vmag', 'required: V magnitude from -2 to 20, or a magnitude in another band (rmag, imag, jmag, hmag, gmag)');
  if (row.visitspernight !== undefined && !Number.isInteger(row.visitspernight))
    fail(place, 'visitspernight', 'visits of the star in one night, a whole number from 1 to 12');
  if (row.maxvisits !== undefined && !Number.isInteger(row.maxvisits))
    fail(place, 'maxvisits', 'most visits of the star this campaign plans, a whole number from 1 to 100000');
  if (row.exposuresec !== undefined && row.visitsigmamps !== undefined) fail(place, 'visitsigmamps', 'give exposureSec or visitSigmaMps, not both');
  const withDefault = <T>(value: T | undefined, name: string, fallback: T): T => {
    if (value !== undefined) return value;
    estimated.push(name);
    return fallback;
  };

  const hasPeriod = row.perioddays !== undefined;
  for (const c of ['tcbjdtdb', 'planetmsiniearth', 'planetkmps', 'perioderrdays', 'tcerrdays', 'transitdurationhours', 'eccsigma'] as const) {
    if (!hasPeriod && row[c] !== undefined) fail(place, c, 'needs periodDays in the same row');
  }
  if (hasPeriod && row.tcbjdtdb === undefined) fail(place, 'tcbjdtdb', 'required with periodDays: mid-transit time as a full BJD_TDB');
  if (row.planetmsiniearth !== undefined && row.planetkmps !== undefined) {
    fail(place, 'planetkmps', 'give planetMsiniEarth or planetKMps, not both');
  }
  if (hasPeriod && row.perioderrdays !== undefined && row.perioderrdays >= row.perioddays!) {
    fail(place, 'perioderrdays', 'period uncertainty in days, smaller than the period');
  }
  const search = [row.searchperiodmindays, row.searchperiodmaxdays, row.searchmsiniearth];
  const searchGiven = search.filter((v) => v !== undefined).length;
  if (searchGiven > 0 && searchGiven < 3) {
    const missing = (['searchperiodmindays', 'searchperiodmaxdays', 'searchmsiniearth'] as const).find((c) => row[c] === undefined)!;
    fail(place, missing, 'the three search columns go together: searchPeriodMinDays, searchPeriodMaxDays, searchMsiniEarth');
  }
  if (searchGiven === 3 && row.searchperiodmindays! >= row.searchperiodmaxdays!) {
    fail(place, 'searchperiodmaxdays', 'longer than searchPeriodMinDays');
  }

  const jitter = defaultJitter({ teffK, vsiniKms: row.vsinikms, logRhk: row.logrhk, logg: row.logg });
  const target: Target = {
    id: row.id,
    starId: row.star ?? row.id,
    raDeg: row.ra!,
    decDeg: row.dec!,
    pmRaMasYr: row.pmramasyr ?? 0,
    pmDecMasYr: row.pmdecmasyr ?? 0,
    epochYear: row.epochyear ?? 2000,
    // V from the first other band and the dwarf colours when not given [PecautMamajek2013].
    vmag: withDefault(row.vmag, 'vmag', firstBand === undefined ? NaN : mags[firstBand]! + dwarfColour(firstBand, teffK)),
    teffK,
    massSun: withDefault(row.masssun, 'massSun', massFromTeffSun(teffK)),
    vsiniKms: withDefault(row.vsinikms, 'vsiniKms', DEFAULT_VSINI_KMS),
    jitterMps: withDefault(row.jittermps, 'jitterMps', jitter.jitterMps),
    jitterSource: row.jittermps === undefined ? jitter.source : 'as given',
    priority: row.priority ?? 1,
    goalSignificance: row.goalsignificance,
    estimated,
    source: `${place.file} ${place.where}`,
  };
  const optional = {
    nightlyJitterFraction: row.nightlyjitterfraction,
    rotationDays: row.rotationdays,
    activityMps: row.activitymps,
    activityCoherenceDays: row.activitycoherencedays,
  };
  for (const [key, value] of Object.entries(optional)) if (value !== undefined) Object.assign(target, { [key]: value });
  if (Object.keys(mags).length > 0) target.mags = mags;
  for (const [key, value] of [
    ['logRhk', row.logrhk],
    ['logg', row.logg],
    ['exposureSec', row.exposuresec],
    ['visitSigmaMps', row.visitsigmamps],
    ['visitsPerNight', row.visitspernight],
    ['maxVisits', row.maxvisits],
    ['maxHours', row.maxhours],
  ] as const) {
    if (value !== undefined) target[key] = value;
  }
  if (hasPeriod) {
    target.ephemeris = {
      periodDays: row.perioddays!,
      periodErrDays: withDefault(row.perioderrdays, 'periodErrDays', 0),
      tcBjdTdb: row.tcbjdtdb!,
      tcErrDays: withDefault(row.tcerrdays, 'tcErrDays', 0),
    };
    if (row.transitdurationhours !== undefined) target.ephemeris.transitDurationHours = row.transitdurationhours;
    if (row.planetmsiniearth !== undefined || row.planetkmps !== undefined) {
      target.planet = {
        msiniEarth: row.planetmsiniearth,
        kMps: row.planetkmps,
        ecc: row.ecc ?? 0,
        omegaDeg: row.omegadeg ?? 90,
      };
      if (row.eccsigma !== undefined) target.planet.eccPriorSigma = row.eccsigma;
    }
  }
  if (searchGiven === 3) {
    target.search = {
      periodMinDays: row.searchperiodmindays!,
      periodMaxDays: row.searchperiodmaxdays!,
      msiniEarth: row.searchmsiniearth!,
    };
  }
  return target;
}

/** Parses a target list (CSV, RFC 4180, header row). `file` names it in messages. */
export function parseTargets(text: string, file: string): Target[] {
  const table = parseCsvTable(text, file, 'a header row and one row per target');
  const columns = table.header.map((name) => name.trim().toLowerCase());
  columns.forEach((column, i) => {
    if (!COLUMNS.includes(column)) {
      throw inputError({
        file,
        where: `header column ${i + 1}`,
        field: 'column',
        value: table.header[i],
        allowed: `unknown column; known: ${COLUMNS.map(display).join(', ')}`,
      });
    }
    if (columns.indexOf(column) !== i)
      throw inputError({ file, where: `header column ${i + 1}`, field: 'column', value: table.header[i], allowed: 'each column once' });
  });
  for (const column of REQUIRED.filter((c) => c !== 'vmag' && c !== 'teffk')) {
    if (!columns.includes(column))
      throw inputError({
        file,
        where: 'header',
        field: display(column),
        value: undefined,
        allowed: `required column missing; the header has: ${table.header.join(', ')}`,
      });
  }
  if (table.rows.length === 0) throw inputError({ file, field: '(file)', value: '', allowed: 'no target rows after the header' });

  const parsed = table.rows.map(({ cells, line }, index) => {
    const raw = Object.fromEntries(columns.map((c, i) => [c, cells[i] ?? '']));
    const place: Place = { file, where: `row ${index + 1} (line ${line})`, raw };
    const result = rowSchema.safeParse(raw);
    if (!result.success) {
      const issue = result.error.issues[0]!;
      const column = String(issue.path[0]);
      fail(place, column, issue.message.startsWith('Invalid input') ? 'a valid value' : issue.message);
    }
    return { row: result.data, place };
  });
  // Ids name output files (map-<id>.svg), so two ids may not differ only in case or punctuation.
  const seen = new Map<string, Place>();
  const bySlug = new Map<string, string>();
  for (const { row, place } of parsed) {
    if (seen.has(row.id)) fail(place, 'id', `each id once (also on ${seen.get(row.id)!.where})`);
    const earlier = bySlug.get(slug(row.id));
    if (earlier !== undefined)
      fail(place, 'id', `an id that differs from ${JSON.stringify(earlier)} in more than case or punctuation (both would be written to the same file names)`);
    seen.set(row.id, place);
    bySlug.set(slug(row.id), row.id);
  }
  return [...groupStars(parsed, seen).values()].flatMap((group) => group.map(({ row, place }) => buildTarget(row, place)));
}

/**
 * Rows grouped by star (the star column, else the row's own id), in the order stars first
 * appear; each star field is taken from the first row that gives it and copied to the others.
 * A different value on another row of the star, a second search row, or a star named like a row
 * of another star is one clear error.
 */
function groupStars(parsed: { row: Row; place: Place }[], ids: Map<string, Place>): Map<string, { row: Row; place: Place }[]> {
  const stars = new Map<string, { row: Row; place: Place }[]>();
  const rowAt = new Map(parsed.map(({ row, place }) => [place, row]));
  for (const entry of parsed) {
    const starId = entry.row.star ?? entry.row.id;
    const rowOfId = ids.get(starId);
    if (rowOfId && (rowAt.get(rowOfId)!.star ?? starId) !== starId)
      fail(entry.place, 'star', `a star name that is not the id of a row of another star (${rowOfId.where})`);
    stars.set(starId, [...(stars.get(starId) ?? []), entry]);
  }
  for (const [starId, group] of stars) {
    const given: Partial<Record<(typeof STAR_COLUMNS)[number], { value: unknown; place: Place }>> = {};
    for (const { row, place } of group) {
      for (const column of STAR_COLUMNS) {
        const value = row[column];
        if (value === undefined) continue;
        const first = given[column];
        if (!first) given[column] = { value, place };
        else if (first.value !== value) fail(place, column, `the same value as on ${first.place.where} of star ${starId} (${String(first.value)}), or blank`);
      }
    }
    const searches = group.filter(({ row }) => row.searchperiodmindays !== undefined);
    if (searches.length > 1)
      fail(searches[1]!.place, 'searchperiodmindays', `one search range per star (star ${starId} has one on ${searches[0]!.place.where})`);
    for (const entry of group) for (const column of STAR_COLUMNS) if (given[column]) (entry.row as Record<string, unknown>)[column] = given[column]!.value;
  }
  return stars;
}

export function readTargets(file: string): Target[] {
  return parseTargets(readText(file, 'target list'), file);
}
