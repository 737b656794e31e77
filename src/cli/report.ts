import path from 'node:path';
import type { Command } from 'commander';
import { readPlan } from '../io/plan-json.js';
import { checkOutFolder } from '../io/out-folder.js';
import { writeOutputSet } from '../io/output-set.js';
import { renderReportHtml } from '../report/html/report-html.js';
import { savedMaps } from './map-report.js';
import { printJson } from './options.js';

export function registerReport(program: Command): Command {
  return program
    .command('report')
    .description('re-render report.html (charts and proposal summary) from a saved plan.json')
    .argument('<plan>', 'plan.json written by crest plan')
    .option('--out <dir>', "folder for report.html (default: the plan file's folder)")
    .option('--json', 'print one JSON document')
    .action(async (file: string, opts: { out?: string; json?: boolean }) => {
      const plan = readPlan(file);
      const outDir = opts.out ?? path.dirname(file);
      checkOutFolder(outDir, ['report.html'], [file]);
      // Detection maps saved by `crest map` beside the plan are kept in the page.
      const html = await renderReportHtml(plan, savedMaps(plan, path.dirname(file)));
      const [written] = writeOutputSet(outDir, { 'report.html': html }, [file]);
      if (opts.json) return printJson({ plan: file, written: [written], charts: (html.match(/<figure class="chart /g) ?? []).length });
      console.log(`Wrote ${written}`);
    });
}
