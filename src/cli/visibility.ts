import type { Command } from 'commander';
import { DEFAULT_CONSTRAINTS } from '../io/campaign.js';
import { siteFromFlag } from '../io/site-list.js';
import { readTargets } from '../io/targets.js';
import type { Constraints, TwilightLevel } from '../model.js';
import { fmt, renderTable } from '../report/table.js';
import { clockTime, isoTime } from '../sky/local-time.js';
import { computeNights } from '../sky/nights.js';
import { groupNoWindow } from '../sky/no-window.js';
import { computeWindows } from '../sky/visibility.js';
import { checkRange, dateFlag, twilightFlag } from './nights.js';
import { numberFlag, printCsv, printJson } from './options.js';

interface VisibilityOptions {
  site: string;
  targets: string;
  from: string;
  to: string;
  maxAirmass: number;
  twilight: TwilightLevel;
  moonSep: number;
  minWindow: number;
  utc?: boolean;
  json?: boolean;
  csv?: boolean;
}

export function registerVisibility(program: Command): Command {
  return program
    .command('visibility')
    .description('when each target is observable in each night: altitude, airmass, horizon, hour angle and Moon limits')
    .requiredOption('--site <id|file>', 'a bundled site id (see `crest sites`) or a site file')
    .requiredOption('--targets <file>', 'target list (CSV)')
    .requiredOption('--from <date>', 'first evening, YYYY-MM-DD (local date at the site)', dateFlag('--from'))
    .requiredOption('--to <date>', 'last evening, YYYY-MM-DD', dateFlag('--to'))
    .option(
      '--max-airmass <x>',
      'largest airmass (Kasten & Young), 1 to 10',
      numberFlag('--max-airmass', 'an airmass from 1 to 10', 1, 10),
      DEFAULT_CONSTRAINTS.maxAirmass,
    )
    .option('--twilight <level>', 'twilight that bounds the dark span: civil, nautical or astronomical', twilightFlag, DEFAULT_CONSTRAINTS.twilight)
    .option(
      '--moon-sep <deg>',
      'separation from the Moon at full Moon (half of it at new Moon; no limit while the Moon is down), 0 to 180',
      numberFlag('--moon-sep', 'degrees from 0 to 180', 0, 180),
      DEFAULT_CONSTRAINTS.moonSeparationDeg,
    )
    .option(
      '--min-window <min>',
      'drop windows shorter than this, minutes, 0 to 1440',
      numberFlag('--min-window', 'minutes from 0 to 1440', 0, 1440),
      DEFAULT_CONSTRAINTS.minWindowMinutes,
    )
    .option('--utc', 'show times in UTC instead of the site time zone')
    .option('--json', 'print one JSON document')
    .option('--csv', 'print CSV (RFC 4180)')
    .action((opts: VisibilityOptions) => {
      const site = siteFromFlag(opts.site);
      const targets = readTargets(opts.targets);
      checkRange(opts.from, opts.to);
      const constraints: Constraints = {
        twilight: opts.twilight,
        maxAirmass: opts.maxAirmass,
        moonSeparationDeg: opts.moonSep,
        minSpacingHours: 0,
        sameNightSpacingHours: 0,
        minWindowMinutes: opts.minWindow,
      };
      const nights = computeNights(site, opts.from, opts.to, opts.twilight);
      const { windows, dropped } = computeWindows(site, targets, nights, constraints);
      const utc = Boolean(opts.utc);
      const iso = (d: Date) => isoTime(d, site.timeZone, utc)!;
      const hours = (s: Date, e: Date) => (e.getTime() - s.getTime()) / 3_600_000;
      if (opts.json) {
        return printJson({
          site: site.id,
          timeZone: utc ? 'UTC' : site.timeZone,
          constraints: { twilight: opts.twilight, maxAirmass: opts.maxAirmass, moonSeparationDeg: opts.moonSep, minWindowMinutes: opts.minWindow },
          windows: windows.map((w) => ({
            ...w,
            start: iso(w.start),
            end: iso(w.end),
            bestTime: iso(w.bestTime),
            hours: Number(hours(w.start, w.end).toFixed(3)),
            minAirmass: Number(w.minAirmass.toFixed(3)),
            moonSeparationDeg: Number(w.moonSeparationDeg.toFixed(1)),
          })),
          noWindow: groupNoWindow(dropped),
        });
      }
      if (opts.csv) {
        const rows = windows.map((w) => [
          w.localDate,
          w.targetId,
          iso(w.start),
          iso(w.end),
          hours(w.start, w.end).toFixed(3),
          iso(w.bestTime),
          w.minAirmass.toFixed(3),
          w.moonSeparationDeg.toFixed(1),
        ]);
        return printCsv(['localDate', 'targetId', 'start', 'end', 'hours', 'bestTime', 'minAirmass', 'moonSeparationDeg'], rows);
      }
      const hm = (d: Date) => clockTime(d, site.timeZone, utc);
      console.log(
        `${site.name}: ${targets.length} targets, nights ${opts.from} to ${opts.to}; ${opts.twilight} twilight, airmass <= ${opts.maxAirmass}, ` +
          `Moon >= ${opts.moonSep} deg at full Moon, windows >= ${opts.minWindow} min; times ${utc ? 'UTC' : `local (${site.timeZone})`}`,
      );
      const rows = windows.map((w) => [
        w.localDate,
        w.targetId,
        hm(w.start),
        hm(w.end),
        fmt(hours(w.start, w.end), 2),
        hm(w.bestTime),
        fmt(w.minAirmass, 2),
        fmt(w.moonSeparationDeg, 0),
      ]);
      console.log(
        renderTable(
          [
            { header: 'evening' },
            { header: 'target' },
            { header: 'from' },
            { header: 'to' },
            { header: 'hours', align: 'right' },
            { header: 'best' },
            { header: 'airmass', align: 'right' },
            { header: 'moon (deg)', align: 'right' },
          ],
          rows,
        ),
      );
      if (dropped.length) {
        console.log(`\nNo window (${dropped.length} target-nights):`);
        const dropRows = groupNoWindow(dropped).map((g) => [g.targetId, String(g.localDates.length), g.reason]);
        console.log(renderTable([{ header: 'target' }, { header: 'nights', align: 'right' }, { header: 'reason' }], dropRows));
      }
    });
}
