import path from 'node:path';
import type { Command } from 'commander';
import { inputError } from '../errors.js';
import type { Campaign } from '../model.js';
import { readCampaign } from '../io/campaign.js';
import { DEMO_CAMPAIGN } from '../io/paths.js';
import { checkOutFolder } from '../io/out-folder.js';
import { writeOutputSet } from '../io/output-set.js';
import { slug } from '../io/slug.js';
import { buildPlan } from '../plan/build-plan.js';
import { renderReportHtml } from '../report/html/report-html.js';
import { renderPlanCsv } from '../report/plan-csv.js';
import { withIcsSequences } from '../report/ics-sequence.js';
import { renderPlanIcs } from '../report/plan-ics.js';
import { renderPlanJson } from '../report/plan-json.js';
import { renderPlanMarkdown } from '../report/plan-markdown.js';
import { renderPlanText } from '../report/plan-terminal.js';
import { numberFlag } from './options.js';
import { readPreviousPlan } from './previous-plan.js';
import { sourceDateEpochMs } from './source-date-epoch.js';

/** The files `crest plan` writes. */
const PLAN_FILES = ['plan.md', 'plan.csv', 'plan.json', 'plan.ics', 'report.html'];

interface PlanFlags {
  out?: string;
  nights?: number;
  json?: boolean;
  seed?: number;
}

/** The campaign with its number of nights to choose replaced; only choose-nights campaigns choose nights. */
function withNights(campaign: Campaign, nights: number | undefined): Campaign {
  if (nights === undefined) return campaign;
  if (campaign.time.mode !== 'choose-nights') {
    throw inputError({ file: 'command line', field: '--nights', value: String(nights), allowed: `only for campaigns with time.mode choose-nights (${campaign.file} has ${campaign.time.mode})` });
  }
  return { ...campaign, time: { mode: 'choose-nights', nights } };
}

export function registerPlan(program: Command): Command {
  return program
    .command('plan')
    .description('plan an observing campaign and write plan.md, plan.csv, plan.json, plan.ics and report.html (no argument: the bundled demo)')
    .argument('[campaign]', 'campaign file (YAML or JSON)')
    .option('--out <dir>', 'output folder (default: ./crest-out/<campaign name>/)')
    .option('--seed <n>', "override the campaign's seed", numberFlag('--seed', 'a whole number, 0 or more', 0, Number.MAX_SAFE_INTEGER, { integer: true }))
    .option('--nights <n>', 'choose this many nights instead of the campaign\'s number (choose-nights campaigns: how many nights to ask for?)', numberFlag('--nights', 'a whole number of nights from 1 to 366', 1, 366, { integer: true }))
    .option('--json', 'print plan.json on stdout instead of the summary')
    .action(async (file: string | undefined, opts: PlanFlags) => {
      const campaignFile = file ?? path.relative(process.cwd(), DEMO_CAMPAIGN);
      const campaign = withNights(readCampaign(campaignFile), opts.nights);
      const outDir = opts.out ?? path.join('crest-out', slug(campaign.name));
      const inputs = [campaignFile, campaign.targetsFile, campaign.site.file, campaign.instrument.file];
      checkOutFolder(outDir, PLAN_FILES, inputs);
      const stampMs = sourceDateEpochMs(process.env.SOURCE_DATE_EPOCH);
      const previous = readPreviousPlan(outDir);
      const plan = withIcsSequences(buildPlan(campaign, { seed: opts.seed }), previous);
      const json = renderPlanJson(plan);
      const ics = renderPlanIcs(plan, { previous, stampMs });
      const written = writeOutputSet(
        outDir,
        { 'plan.md': renderPlanMarkdown(plan), 'plan.csv': renderPlanCsv(plan), 'plan.json': json, 'plan.ics': ics, 'report.html': await renderReportHtml(plan) },
        inputs,
      );
      if (opts.json) return void process.stdout.write(json);
      console.log(renderPlanText(plan));
      console.log(`\nWrote ${written.join(', ')}`);
    });
}
