import path from 'node:path';
import v8 from 'node:v8';
import type { Command } from 'commander';
import { inputError } from '../errors.js';
import type { Campaign } from '../plan/campaign.js';
import { readCampaign } from '../io/campaign.js';
import { DEMO_CAMPAIGN } from '../io/paths.js';
import { checkOutFolder } from '../io/out-folder.js';
import { writeOutputSet } from '../io/output-set.js';
import { planWithPathsFrom } from '../io/plan-paths.js';
import { slug } from '../io/slug.js';
import { buildPlan } from '../plan/build-plan.js';
import { PLAN_STAGES } from '../plan/plan-stages.js';
import { nightsSweep, withNightCount } from '../plan/nights-sweep.js';
import { type Progress, stderrProgress } from './progress.js';
import { renderReportHtml } from '../report/html/report-html.js';
import { renderPlanCsv } from '../report/plan-csv.js';
import { withIcsSequences } from '../report/ics-sequence.js';
import { renderPlanIcs } from '../report/plan-ics.js';
import { renderPlanJson } from '../report/plan-json.js';
import { renderPlanMarkdown } from '../report/plan-markdown.js';
import { renderPlanText } from '../report/plan-terminal.js';
import { datesFlag, instantFlag, numberFlag } from './options.js';
import { previousPlan } from './previous-plan.js';
import { sourceDateEpochMs } from './source-date-epoch.js';

/** The files `crest plan` writes. */
const PLAN_FILES = ['plan.md', 'plan.csv', 'plan.json', 'plan.ics', 'report.html'];

interface PlanFlags {
  out?: string;
  nights?: number;
  halfNights?: boolean;
  json?: boolean;
  seed?: number;
  now?: Date;
  lost?: string[];
  sweepNights?: [number, number];
  quiet?: boolean;
}

/** What a plan run reports as it goes: the plan's own stages, then the files. */
const RUN_STAGES = [...PLAN_STAGES, 'report', 'files'] as const;

/** The campaign with the command line's lost nights added to its own. */
function withLost(campaign: Campaign, lost: string[] | undefined): Campaign {
  if (!lost) return campaign;
  return { ...campaign, lostDates: [...new Set([...campaign.lostDates, ...lost])].sort() };
}

/** Refuses a night-count flag for a campaign that does not choose its nights. */
function checkChoosesNights(campaign: Campaign, flag: string, value: string): void {
  if (campaign.time.mode === 'choose-nights') return;
  const allowed = `only for campaigns with time.mode choose-nights (${campaign.file} has ${campaign.time.mode})`;
  throw inputError({ file: 'command line', field: flag, value, allowed });
}

/** The campaign choosing half nights when the flag asks; only choose-nights campaigns choose nights. */
function withHalves(campaign: Campaign, halfNights: boolean | undefined): Campaign {
  if (!halfNights || campaign.time.mode !== 'choose-nights') {
    if (halfNights) checkChoosesNights(campaign, '--half-nights', 'true');
    return campaign;
  }
  return { ...campaign, time: { ...campaign.time, halfNights: true } };
}

/** The campaign with its number of nights to choose replaced: whole nights, or halves with half nights. */
function withNights(campaign: Campaign, nights: number | undefined): Campaign {
  if (nights === undefined) return campaign;
  checkChoosesNights(campaign, '--nights', String(nights));
  const halves = campaign.time.mode === 'choose-nights' && campaign.time.halfNights;
  if (!Number.isInteger(nights * (halves ? 2 : 1))) {
    const allowed = halves ? 'a multiple of 0.5 nights from 1 to 366' : 'a whole number of nights from 1 to 366 (halves with --half-nights)';
    throw inputError({ file: 'command line', field: '--nights', value: String(nights), allowed });
  }
  return withNightCount(campaign, nights);
}

/** Most night counts one sweep plans (each is a whole plan). */
const MAX_SWEEP_COUNTS = 40;

/** `--sweep-nights A:B`: whole numbers 1 <= A < B <= 366, at most MAX_SWEEP_COUNTS counts. */
function sweepFlag(text: string): [number, number] {
  const allowed = `A:B, night counts with 1 <= A < B <= 366 and at most ${MAX_SWEEP_COUNTS} counts (B - A < ${MAX_SWEEP_COUNTS})`;
  const m = /^(\d+):(\d+)$/.exec(text.trim());
  const [a, b] = m ? [Number(m[1]), Number(m[2])] : [0, 0];
  if (!(a >= 1 && a < b && b <= 366 && b - a < MAX_SWEEP_COUNTS)) throw inputError({ file: 'command line', field: '--sweep-nights', value: text, allowed });
  return [a, b];
}

export function registerPlan(program: Command): Command {
  return program
    .command('plan')
    .description('plan an observing campaign and write plan.md, plan.csv, plan.json, plan.ics and report.html (no argument: the bundled demo)')
    .argument('[campaign]', 'campaign file (YAML or JSON)')
    .option('--out <dir>', 'output folder (default: ./crest-out/<campaign name>/)')
    .option('--seed <n>', "override the campaign's seed", numberFlag('--seed', 'a whole number, 0 or more', 0, Number.MAX_SAFE_INTEGER, { integer: true }))
    .option(
      '--nights <n>',
      "choose this many nights instead of the campaign's number (choose-nights campaigns: how many nights to ask for?)",
      numberFlag('--nights', 'a number of nights from 1 to 366', 1, 366),
    )
    .option('--half-nights', 'choose half nights (the first or second half of the dark time) rather than whole ones; two halves make a night')
    .option(
      '--now <time>',
      're-plan from this instant (ISO 8601 with zone, or "now"): visits before it stay as planned in the --out folder\'s plan.json or as observed',
      instantFlag('--now'),
    )
    .option('--lost <dates>', "nights lost to weather or faults, YYYY-MM-DD,... (added to the campaign's lost list)", datesFlag('--lost'))
    .option(
      '--sweep-nights <A:B>',
      'also plan every night count from A to B (choose-nights campaigns) and give, per count, each P(goal), P(all goals) and idle dark hours',
      sweepFlag,
    )
    .option('--json', 'print plan.json on stdout instead of the summary')
    .option('--quiet', 'no progress line on stderr (it is shown only on a terminal)')
    .action(async (file: string | undefined, opts: PlanFlags) => {
      // The stage line is cleared however the run ends, so an error message starts its own line.
      const stages = stderrProgress({ unit: 'stages', quiet: opts.quiet, showAfterMs: 0 });
      try {
        await runPlan(file, opts, stages);
      } finally {
        stages.end();
      }
    });
}

/** Reads the campaign, plans it (and the sweep, when asked), writes the files and prints the summary or plan.json. */
async function runPlan(file: string | undefined, opts: PlanFlags, stages: Progress): Promise<void> {
  const campaignFile = file ?? path.relative(process.cwd(), DEMO_CAMPAIGN);
  const campaign = withLost(withNights(withHalves(readCampaign(campaignFile), opts.halfNights), opts.nights), opts.lost);
  if (opts.sweepNights) checkChoosesNights(campaign, '--sweep-nights', opts.sweepNights.join(':'));
  const outDir = opts.out ?? path.join('crest-out', slug(campaign.name));
  const inputs = [campaignFile, campaign.targetsFile, campaign.site.file, campaign.instrument.file, ...(campaign.observed ? [campaign.observed.file] : [])];
  checkOutFolder(outDir, PLAN_FILES, inputs);
  const stampMs = sourceDateEpochMs(process.env.SOURCE_DATE_EPOCH);
  // The plan the folder holds: its visits before --now are kept, and plan.ics cancels what it no longer has.
  const previous = previousPlan(outDir, campaign.name, (line) => console.error(line));
  const replan = opts.now ? { now: opts.now, ...(previous ? { previous } : {}) } : {};
  // The heap limit bounds the campaign's size (src/plan/visit-budget.ts).
  const planOptions = { seed: opts.seed, heapLimitBytes: v8.getHeapStatistics().heap_size_limit, ...replan };
  const stage = (name: (typeof RUN_STAGES)[number]) => stages.update(`crest plan: ${name}`, RUN_STAGES.indexOf(name), RUN_STAGES.length);
  const plan = withIcsSequences(buildPlan(campaign, { ...planOptions, onStage: stage }), previous);
  if (opts.sweepNights && campaign.time.mode === 'choose-nights') {
    const [from, to] = opts.sweepNights;
    const counts = Array.from({ length: to - from + 1 }, (_, i) => from + i);
    stages.end();
    const progress = stderrProgress({ unit: 'plans', quiet: opts.quiet });
    plan.nightsSweep = nightsSweep(campaign, counts, planOptions, new Map([[campaign.time.nights, plan]]), (done, total) =>
      progress.update('nights sweep', done, total),
    );
    progress.end();
  }
  // The files name their inputs from the folder they are written to; the terminal from here.
  const saved = planWithPathsFrom(plan, outDir);
  stage('report');
  const json = renderPlanJson(saved);
  const ics = renderPlanIcs(saved, { previous, stampMs });
  const files = {
    'plan.md': renderPlanMarkdown(saved),
    'plan.csv': renderPlanCsv(saved),
    'plan.json': json,
    'plan.ics': ics,
    'report.html': await renderReportHtml(saved),
  };
  stage('files');
  const written = writeOutputSet(outDir, files, inputs);
  stages.end();
  if (opts.json) return void process.stdout.write(json);
  console.log(renderPlanText(plan));
  console.log(`\nWrote ${written.join(', ')}`);
}
