import type { Command } from 'commander';
import { DateTime } from 'luxon';
import { inputError } from '../errors.js';
import { siteFromFlag } from '../io/site-list.js';
import type { Night, Site, TwilightLevel } from '../model.js';
import { fmt, renderTable } from '../report/table.js';
import { clockTime, isoTime, localDateRange } from '../sky/local-time.js';
import { computeNights } from '../sky/nights.js';
import { choiceFlag, printCsv, printJson } from './options.js';

export const TWILIGHT_LEVELS = ['civil', 'nautical', 'astronomical'] as const;
export const twilightFlag = choiceFlag<TwilightLevel>('--twilight', TWILIGHT_LEVELS);
const MAX_NIGHTS = 1000;

/** A `--from`/`--to` local date (YYYY-MM-DD). */
export function dateFlag(flag: string) {
  return (text: string): string => {
    const date = DateTime.fromFormat(text, 'yyyy-MM-dd', { zone: 'UTC' });
    if (!date.isValid || date.year < 1900 || date.year > 2100) {
      throw inputError({ file: 'command line', field: flag, value: text, allowed: 'a date YYYY-MM-DD between 1900 and 2100' });
    }
    return text;
  };
}

/** Checks the date range of a command: `to` not before `from`, at most MAX_NIGHTS nights. */
export function checkRange(from: string, to: string): void {
  const count = localDateRange(from, to).length;
  if (count === 0) throw inputError({ file: 'command line', field: '--to', value: to, allowed: `a date on or after --from ${from}` });
  if (count > MAX_NIGHTS) throw inputError({ file: 'command line', field: '--to', value: to, allowed: `at most ${MAX_NIGHTS} nights after --from ${from}` });
}

/** A night as plain JSON: instants in ISO 8601 (UTC, or the site's zone). */
export function nightJson(n: Night, site: Site, utc: boolean) {
  const t = (d: Date | null) => isoTime(d, site.timeZone, utc);
  return {
    localDate: n.localDate,
    sunset: t(n.sunset),
    sunrise: t(n.sunrise),
    civil: { dusk: t(n.civil.dusk), dawn: t(n.civil.dawn) },
    nautical: { dusk: t(n.nautical.dusk), dawn: t(n.nautical.dawn) },
    astronomical: { dusk: t(n.astronomical.dusk), dawn: t(n.astronomical.dawn) },
    darkStart: t(n.darkStart),
    darkEnd: t(n.darkEnd),
    darkHours: Number(n.darkHours.toFixed(3)),
    moon: { illumination: Number(n.moon.illumination.toFixed(3)), rise: t(n.moon.rise), set: t(n.moon.set), upDuringDark: n.moon.upDuringDark },
    ...(n.note ? { note: n.note } : {}),
  };
}

interface NightsOptions {
  site: string;
  from: string;
  to: string;
  twilight: TwilightLevel;
  utc?: boolean;
  json?: boolean;
  csv?: boolean;
}

export function registerNights(program: Command): Command {
  return program
    .command('nights')
    .description('sunset, twilights, the dark span and the Moon for each night at a site (local dates name the evenings)')
    .requiredOption('--site <id|file>', 'a bundled site id (see `crest sites`) or a site file')
    .requiredOption('--from <date>', 'first evening, YYYY-MM-DD (local date at the site)', dateFlag('--from'))
    .requiredOption('--to <date>', 'last evening, YYYY-MM-DD', dateFlag('--to'))
    .option('--twilight <level>', 'twilight that bounds the dark span: civil, nautical or astronomical', twilightFlag, 'nautical')
    .option('--utc', 'show times in UTC instead of the site time zone')
    .option('--json', 'print one JSON document')
    .option('--csv', 'print CSV (RFC 4180)')
    .action((opts: NightsOptions) => {
      const site = siteFromFlag(opts.site);
      checkRange(opts.from, opts.to);
      const nights = computeNights(site, opts.from, opts.to, opts.twilight);
      const utc = Boolean(opts.utc);
      const zone = utc ? 'UTC' : site.timeZone;
      if (opts.json) return printJson({ site: site.id, timeZone: zone, twilight: opts.twilight, nights: nights.map((n) => nightJson(n, site, utc)) });
      const iso = (d: Date | null) => isoTime(d, site.timeZone, utc) ?? '';
      if (opts.csv) {
        const header = [
          'localDate',
          'sunset',
          'civilDusk',
          'nauticalDusk',
          'astronomicalDusk',
          'darkStart',
          'darkEnd',
          'astronomicalDawn',
          'nauticalDawn',
          'civilDawn',
          'sunrise',
          'darkHours',
          'moonIllumination',
          'moonRise',
          'moonSet',
          'moonUpDuringDark',
          'note',
        ];
        const rows = nights.map((n) => [
          n.localDate,
          iso(n.sunset),
          iso(n.civil.dusk),
          iso(n.nautical.dusk),
          iso(n.astronomical.dusk),
          iso(n.darkStart),
          iso(n.darkEnd),
          iso(n.astronomical.dawn),
          iso(n.nautical.dawn),
          iso(n.civil.dawn),
          iso(n.sunrise),
          n.darkHours.toFixed(3),
          n.moon.illumination.toFixed(3),
          iso(n.moon.rise),
          iso(n.moon.set),
          String(n.moon.upDuringDark),
          n.note ?? '',
        ]);
        return printCsv(header, rows);
      }
      const hm = (d: Date | null) => clockTime(d, site.timeZone, utc);
      console.log(`${site.name}: nights ${opts.from} to ${opts.to}, dark span = ${opts.twilight} twilight; times ${utc ? 'UTC' : `local (${site.timeZone})`}`);
      const rows = nights.map((n) => [
        n.localDate,
        hm(n.sunset),
        hm(n.darkStart),
        hm(n.darkEnd),
        hm(n.sunrise),
        fmt(n.darkHours, 2),
        fmt(n.moon.illumination * 100, 0),
        hm(n.moon.rise),
        hm(n.moon.set),
        n.moon.upDuringDark ? 'yes' : 'no',
        n.note ?? '',
      ]);
      console.log(
        renderTable(
          [
            { header: 'evening' },
            { header: 'sunset' },
            { header: 'dark from' },
            { header: 'dark to' },
            { header: 'sunrise' },
            { header: 'dark (h)', align: 'right' },
            { header: 'moon (%)', align: 'right' },
            { header: 'moonrise' },
            { header: 'moonset' },
            { header: 'moon in dark' },
            { header: 'note' },
          ],
          rows,
        ),
      );
    });
}
