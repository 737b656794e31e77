import type { Command } from 'commander';
import { extent } from '../extent.js';
import { readBundledSites } from '../io/site-list.js';
import { fmt, renderTable } from '../report/table.js';
import { printJson } from './options.js';

function clearText(clear: number | number[]): string {
  if (typeof clear === 'number') return clear.toFixed(2);
  const { min, max } = extent(clear);
  return `${min.toFixed(2)}-${max.toFixed(2)} by month`;
}

export function registerSites(program: Command): Command {
  return program
    .command('sites')
    .description('list the bundled observatory site files')
    .option('--json', 'print one JSON document')
    .action((opts: { json?: boolean }) => {
      const sites = readBundledSites();
      if (opts.json) return printJson(sites.map(({ file: _file, ...site }) => site));
      const rows = sites.map((s) => [
        s.id,
        s.name,
        fmt(s.latitudeDeg, 4),
        fmt(s.longitudeDeg, 4),
        fmt(s.elevationM, 0),
        s.timeZone,
        clearText(s.clearFraction),
        fmt(s.medianSeeingArcsec, 2),
      ]);
      console.log(
        renderTable(
          [
            { header: 'id' },
            { header: 'name' },
            { header: 'lat (deg)', align: 'right' },
            { header: 'lon E (deg)', align: 'right' },
            { header: 'elev (m)', align: 'right' },
            { header: 'time zone' },
            { header: 'clear nights' },
            { header: 'seeing (arcsec)', align: 'right' },
          ],
          rows,
        ),
      );
    });
}
