import type { Command } from 'commander';
import { readCampaign } from '../io/campaign.js';
import { DEMO_CAMPAIGN } from '../io/paths.js';
import { targetKMps } from '../orbit/target-k.js';
import { fmt, renderTable } from '../report/table.js';
import { TYPICAL_AIRMASS, targetDetectability } from '../rv/target-detect.js';
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
      const goal = campaign.goals.significance;
      const rows = campaign.targets.map((t) => {
        const d = targetDetectability(t, campaign.instrument, { significance: goal, airmass: TYPICAL_AIRMASS });
        const n = d.needed.find((v) => v.significance === goal)?.random;
        return [t.id, fmt(t.vmag, 2), fmt(t.teffK, 0), fmt(t.massSun, 2), fmt(t.ephemeris?.periodDays, 4), fmt(targetKMps(t) ?? d.planet?.kMps, 2), fmt(d.sigmaMps, 2), String(d.exposure.exposureSec), n === undefined ? '-' : String(n)];
      });
      console.log(renderTable([{ header: 'target' }, { header: 'V', align: 'right' }, { header: 'Teff (K)', align: 'right' }, { header: 'M* (Msun)', align: 'right' }, { header: 'P (d)', align: 'right' }, { header: 'K (m/s)', align: 'right' }, { header: 'sigma (m/s)', align: 'right' }, { header: 'exp (s)', align: 'right' }, { header: `N ${goal}sig`, align: 'right' }], rows));
      console.log(`sigma per visit with floor and jitter at airmass ${TYPICAL_AIRMASS}; N: visits for K/sigma_K = ${goal} at random phases; search targets: their search mass at the logarithmic middle of their period range (crest detect shows more).`);
      console.log('\nThe scheduler is not built yet: this lists the campaign targets only.');
    });
}
