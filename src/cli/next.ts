// `crest next`: for the observer at the telescope, which star to start now and the order of the
// rest of the night, from the campaign and the visits it has observed so far.
import path from 'node:path';
import type { Command } from 'commander';
import { readCampaign } from '../io/campaign.js';
import { DEMO_CAMPAIGN } from '../io/paths.js';
import type { NextAnswer } from '../plan/next-visits.js';
import { nextVisits } from '../plan/next-visits.js';
import { ADVISORY, clock } from '../report/plan-rows.js';
import { fmt, renderTable } from '../report/table.js';
import { instantFlag, numberFlag, printJson } from './options.js';

interface NextFlags {
  at: Date;
  show: number;
  json?: boolean;
}

function renderNext(answer: NextAnswer, zone: string, show: number): string {
  const at = new Date(answer.atMs);
  const out = [`Night of ${answer.localDate}, at ${clock(at, zone)} local (${clock(at, 'UTC')} UTC)`, ''];
  if (answer.now.length === 0) {
    out.push('Nothing can start now: no star of the campaign is inside its window (twilight, airmass, Moon and horizon limits) in the next 10 minutes.');
  } else {
    out.push('Start now, most K/sigma_K per hour first:');
    const columns = ['star', 'start', 'airmass', 'window left (min)', 'K/sigma_K now -> after', 'gain per hour'].map((header, i) => ({
      header,
      align: i >= 2 ? ('right' as const) : undefined,
    }));
    const rows = answer.now
      .slice(0, show)
      .map((c) => [
        c.starId,
        clock(new Date(c.startMs), zone),
        fmt(c.airmass, 2),
        fmt(c.windowLeftMin, 0),
        c.effects.map((e) => `${e.before.toFixed(1)} -> ${e.after.toFixed(1)}`).join('; '),
        c.gainPerHour.toPrecision(3),
      ]);
    out.push(renderTable(columns, rows), '', 'Why:');
    for (const c of answer.now.slice(0, show)) out.push(`- ${c.starId}: ${c.why.join('; ')}`);
  }
  out.push('', 'Rest of the night, as planned from now:');
  out.push(
    answer.tonight.length
      ? answer.tonight.map((v) => `  ${clock(new Date(v.startMs), zone)}  ${v.starId} (${fmt(v.durationSec / 60, 0)} min)`).join('\n')
      : '  (nothing)',
  );
  out.push('', ADVISORY);
  return out.join('\n');
}

export function registerNext(program: Command): Command {
  return program
    .command('next')
    .description('which star to start now, and the order of the rest of the night (no argument: the bundled demo)')
    .argument('[campaign]', 'campaign file (YAML or JSON); its observed file holds the visits made so far')
    .requiredOption('--at <time>', 'the instant: ISO 8601 with zone, or "now"', instantFlag('--at'))
    .option('--show <n>', 'how many stars to list', numberFlag('--show', 'a whole number from 1 to 100', 1, 100, { integer: true }), 5)
    .option('--json', 'print the answer as JSON')
    .action((file: string | undefined, opts: NextFlags) => {
      const campaign = readCampaign(file ?? path.relative(process.cwd(), DEMO_CAMPAIGN));
      const answer = nextVisits(campaign, opts.at);
      if (opts.json) return printJson(answer);
      console.log(renderNext(answer, campaign.site.timeZone, opts.show));
    });
}
