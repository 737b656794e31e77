// `crest instruments`: the bundled instrument profiles, their key figures and where each comes from.
import type { Command } from 'commander';
import { readBundledInstruments } from '../io/site-list.js';
import { fmt, renderTable } from '../report/table.js';
import { printJson } from './options.js';

export function registerInstruments(program: Command): Command {
  return program
    .command('instruments')
    .description('list the bundled instrument profiles with their key figures and sources')
    .option('--json', 'print one JSON document (every field, with the source of each number)')
    .action((opts: { json?: boolean }) => {
      const instruments = readBundledInstruments();
      if (opts.json) return printJson(instruments.map(({ file: _file, ...instrument }) => instrument));
      const rows = instruments.map((i) => [
        i.id,
        fmt(i.apertureM, 1),
        fmt(i.resolvingPower, 0),
        `${i.spectralRegion}, ${fmt(i.coverageNm[0], 0)}-${fmt(i.coverageNm[1], 0)}`,
        `${fmt(i.reference.photonSigmaMps, 2)} at ${i.band} = ${fmt(i.reference.mag, 1)}, ${fmt(i.reference.exposureSec, 0)} s`,
        fmt(i.floorMps, 2),
        fmt(i.readoutSec + i.acquisitionSec, 0),
        `${fmt(i.minExposureSec, 0)}-${fmt(i.maxExposureSec, 0)}`,
      ]);
      const table = renderTable(
        [
          { header: 'id' },
          { header: 'aperture (m)', align: 'right' },
          { header: 'R', align: 'right' },
          { header: 'region, nm' },
          { header: 'photon sigma (m/s) at reference' },
          { header: 'floor (m/s)', align: 'right' },
          { header: 'overheads (s)', align: 'right' },
          { header: 'exposure (s)' },
        ],
        rows,
      );
      const notes = instruments.map((i) => `${i.id}: ${i.name}. ${i.sourceNote}`);
      console.log([table, '', ...notes, '', 'Each number with its source: crest instruments --json ("sources"); references in docs/references.md.'].join('\n'));
    });
}
