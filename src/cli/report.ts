import path from 'node:path';
import type { Command } from 'commander';
import { InputError } from '../errors.js';
import { readText } from '../io/read-text.js';
import { writeOutputs } from '../io/write-outputs.js';
import { planFromJson } from '../report/html/plan-from-json.js';
import { renderReportHtml } from '../report/html/report-html.js';
import { savedMaps } from './map-report.js';
import { printJson } from './options.js';

/** Parses plan.json text; a syntax error is one input-error line. */
function parsePlanText(file: string): unknown {
  const text = readText(file, 'plan file');
  try {
    return JSON.parse(text);
  } catch (err) {
    throw new InputError(`${file}: malformed JSON: ${(err as Error).message.split('\n')[0]}; expected a plan.json written by crest plan`);
  }
}

export function registerReport(program: Command): Command {
  return program
    .command('report')
    .description('re-render report.html (charts and proposal summary) from a saved plan.json')
    .argument('<plan>', 'plan.json written by crest plan')
    .option('--out <dir>', 'folder for report.html (default: the plan file\'s folder)')
    .option('--json', 'print one JSON document')
    .action(async (file: string, opts: { out?: string; json?: boolean }) => {
      const plan = planFromJson(parsePlanText(file), file);
      // Detection maps saved by `crest map` beside the plan are kept in the page.
      const html = await renderReportHtml(plan, savedMaps(plan, path.dirname(file)));
      const [written] = writeOutputs(opts.out ?? path.dirname(file), { 'report.html': html }, [file]);
      if (opts.json) return printJson({ plan: file, written: [written], charts: (html.match(/<figure class="chart /g) ?? []).length });
      console.log(`Wrote ${written}`);
    });
}
