// Random small campaigns for the plan's property tests: bundled sites in both hemispheres (and the
// masked test site), bundled instruments, invented targets (transiting planets with ephemerides,
// and a few blind-search stars), windows of 5 to 30 nights, all three time models. Seeded; every
// star and value is invented. Kept small (2 or 3 targets) so 50 plans build in seconds.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DateTime } from 'luxon';
import { readInstrument } from '../../src/io/instrument.js';
import { INSTRUMENTS_DIR, SITES_DIR } from '../../src/io/paths.js';
import { readSite } from '../../src/io/site.js';
import type { Site, Target, TimeModel, TwilightLevel } from '../../src/model.js';
import type { Campaign } from '../../src/plan/campaign.js';
import { createRng, type Rng } from '../../src/rv/random.js';

const SOUTH = ['la-silla', 'paranal', 'cerro-tololo', 'siding-spring', 'sutherland'];
const NORTH = ['calar-alto', 'haute-provence', 'kitt-peak', 'lick', 'mauna-kea', 'mcdonald', 'roque-muchachos'];
const MASKED_SITE = fileURLToPath(new URL('../fixtures/sites/masked-south.json', import.meta.url));
const INSTRUMENTS = ['compact-1m', 'stable-2m', 'stable-4m'];
const TWILIGHTS: TwilightLevel[] = ['civil', 'nautical', 'astronomical'];

const between = (rng: Rng, lo: number, hi: number) => lo + (hi - lo) * rng.uniform();
const pick = <T>(rng: Rng, items: readonly T[]): T => items[Math.floor(rng.uniform() * items.length)]!;
const whole = (rng: Rng, lo: number, hi: number) => lo + Math.floor(rng.uniform() * (hi - lo + 1));

/** Right ascension on the meridian at local midnight: the Sun's RA + 180 deg (Sun's RA from the day of the year, approximate, common practice). */
function midnightRaDeg(localDate: string): number {
  const dayOfYear = DateTime.fromISO(localDate, { zone: 'utc' }).ordinal;
  return ((((360 * (dayOfYear - 80)) / 365.25 + 180) % 360) + 360) % 360;
}

function star(rng: Rng, id: string, site: Site, windowStart: string): Target {
  // Mostly near the night-time meridian and within reach of the site's latitude; a few anywhere.
  const anywhere = rng.uniform() < 0.15;
  const raDeg = anywhere ? between(rng, 0, 360) : (midnightRaDeg(windowStart) + between(rng, -75, 75) + 360) % 360;
  const decDeg = anywhere ? between(rng, -89, 89) : Math.max(-89, Math.min(89, site.latitudeDeg + between(rng, -45, 45)));
  const teffK = between(rng, 3800, 6300);
  return {
    id,
    starId: id,
    raDeg,
    decDeg,
    pmRaMasYr: 100 * rng.normal(),
    pmDecMasYr: 100 * rng.normal(),
    epochYear: 2016,
    vmag: between(rng, 7, 11.5),
    teffK,
    massSun: 0.5 + (teffK - 3800) / 4000,
    vsiniKms: between(rng, 1, 6),
    jitterMps: between(rng, 1, 3),
    priority: pick(rng, [0.5, 1, 1, 2]),
    estimated: [],
    source: `random ${id}`,
  };
}

function ephemerisTarget(rng: Rng, id: string, site: Site, windowStartJd: number, windowStart: string): Target {
  const target = star(rng, id, site, windowStart);
  const periodDays = Math.exp(between(rng, Math.log(0.8), Math.log(25)));
  target.ephemeris = {
    periodDays,
    periodErrDays: periodDays * Math.exp(between(rng, Math.log(1e-6), Math.log(3e-4))),
    tcBjdTdb: windowStartJd - between(rng, 10, 400),
    tcErrDays: between(rng, 0.0005, 0.005),
  };
  target.planet = rng.uniform() < 0.7 ? { msiniEarth: between(rng, 5, 150), ecc: 0, omegaDeg: 90 } : { kMps: between(rng, 2, 30), ecc: 0, omegaDeg: 90 };
  return target;
}

function searchTarget(rng: Rng, id: string, site: Site, windowStart: string): Target {
  const target = star(rng, id, site, windowStart);
  target.search = { periodMinDays: between(rng, 1, 4), periodMaxDays: between(rng, 8, 60), msiniEarth: between(rng, 5, 30) };
  return target;
}

function timeModel(rng: Rng, window: { start: string; end: string }, nights: number): TimeModel {
  const mode = pick(rng, ['choose-nights', 'given-nights', 'hours'] as const);
  if (mode === 'choose-nights') return { mode, nights: whole(rng, 1, Math.min(5, nights)) };
  if (mode === 'hours') return { mode, hours: between(rng, 2, 14) };
  const start = DateTime.fromISO(window.start, { zone: 'utc' });
  const dates = new Set<string>();
  const count = whole(rng, 1, Math.min(5, nights));
  while (dates.size < count) dates.add(start.plus({ days: whole(rng, 0, nights - 1) }).toISODate()!);
  return { mode, dates: [...dates] };
}

/** The index-th random campaign (same index, same campaign). */
/** The goal probability varies with the significance (no draw of its own, so the campaigns' other draws stay as they were). */
const goalsOf = (significance: number) => ({
  significance,
  probability: ({ 3: 0.8, 5: 0.9, 8: 0.95 } as Record<number, number>)[significance]!,
  searchCompleteness: 0.5,
});

export function randomCampaign(index: number): Campaign {
  const rng = createRng(7_200_000 + index);
  const siteFile = index % 10 === 9 ? MASKED_SITE : path.join(SITES_DIR, `${pick(rng, index % 2 === 0 ? SOUTH : NORTH)}.json`);
  const site = readSite(siteFile);
  const instrument = readInstrument(path.join(INSTRUMENTS_DIR, `${pick(rng, INSTRUMENTS)}.json`));
  const nights = whole(rng, 5, 30);
  const first = DateTime.fromISO('2025-01-01', { zone: 'utc' }).plus({ days: whole(rng, 0, 3 * 365) });
  const window = { start: first.toISODate()!, end: first.plus({ days: nights - 1 }).toISODate()! };
  // Julian Date of the window's first day, 0 h UT (JD 2440587.5 is 1970-01-01 0 h, common practice).
  const startJd = 2440587.5 + first.toMillis() / 86_400_000;
  const time = timeModel(rng, window, nights);
  // Choosing nights for a search target costs the optimiser's restarts seconds per plan (reported
  // to the scheduler's owner), so search targets come with given nights and hours only.
  const searchFraction = time.mode === 'choose-nights' ? 0 : 0.3;
  const count = whole(rng, 2, 3);
  const targets: Target[] = [];
  for (let k = 0; k < count; k++) {
    const id = `Rv${index}-${String.fromCharCode(97 + k)}`;
    const target = k > 0 && rng.uniform() < searchFraction ? searchTarget(rng, id, site, window.start) : ephemerisTarget(rng, id, site, startJd, window.start);
    // One in four later rows is a second planet of the star before it (at most two per star): the same star fields, its own orbit.
    const previous = targets[k - 1];
    const single = previous !== undefined && targets.filter((t) => t.starId === previous.starId).length === 1;
    if (previous && single && previous.ephemeris && target.ephemeris && rng.uniform() < 0.25)
      targets.push({
        ...previous,
        id,
        starId: previous.starId,
        ephemeris: target.ephemeris,
        planet: target.planet!,
        search: undefined,
        source: `random ${id}`,
      } as Target);
    else targets.push(target);
  }
  return {
    name: `random campaign ${index}`,
    file: `random-${index}.yaml`,
    site,
    instrument,
    targets,
    targetsFile: `random-${index}.csv`,
    window,
    time,
    constraints: {
      twilight: pick(rng, TWILIGHTS),
      maxAirmass: between(rng, 1.5, 2.5),
      moonSeparationDeg: pick(rng, [0, 30, 45]),
      minSpacingHours: pick(rng, [0, 1, 3, 20]),
      sameNightSpacingHours: 2,
      minWindowMinutes: 20,
    },
    goals: goalsOf(pick(rng, [3, 5, 8])),
    noise: { nightlyJitterFraction: pick(rng, [0, 0.5, 0.8]) },
    transits: { confidence: 0.95, maxOrbitFraction: 0.2 },
    seed: index,
    lostDates: [],
  };
}
