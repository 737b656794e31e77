import type { Command } from 'commander';
import { readCampaign } from '../io/campaign.js';
import { DEMO_CAMPAIGN } from '../io/paths.js';
import { targetKMps } from '../orbit/target-k.js';
import { fmt, renderTable } from '../report/table.js';
import { printJson } from './options.js';

export function registerPlan(program: Command): Command {
  return program
    .command('plan')
    .description('plan an observing campaign (with no argument: the bundled demo campaign)')
    .argument('[campaign]', 'campaign file (YAML or JSON)')
    .option('--json', 'print one JSON document')
    .action((file: string | undefined, opts: { json?: boolean }) => {
      const campaign = readCampaign(file ?? DEMO_CAMPAIGN);
      if (opts.json) return printJson(campaign);
      console.log(`Campaign: ${campaign.name}`);
      console.log(`Site: ${campaign.site.name}; instrument: ${campaign.instrument.name}; window ${campaign.window.start} to ${campaign.window.end}`);
      const rows = campaign.targets.map((t) => [t.id, fmt(t.vmag, 2), fmt(t.teffK, 0), fmt(t.massSun, 2), fmt(t.ephemeris?.periodDays, 4), fmt(targetKMps(t), 2)]);
      console.log(renderTable([{ header: 'target' }, { header: 'V', align: 'right' }, { header: 'Teff (K)', align: 'right' }, { header: 'M* (Msun)', align: 'right' }, { header: 'P (d)', align: 'right' }, { header: 'K (m/s)', align: 'right' }], rows));
      console.log('\nThe scheduler is not built yet: this lists the campaign targets only.');
    });
}
