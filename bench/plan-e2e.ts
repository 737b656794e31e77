// End-to-end bench: `crest plan` on invented campaigns (reference/invented-campaign.ts) of a few
// sizes, each in a child process (plan-child.ts): time per stage, total, peak resident memory;
// then the growth exponent of the time with the number of candidates. Sizes from
// CREST_BENCH_E2E (e.g. 100,1000,10000), by default 100 and 300.
import { fork } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { inventedCampaign } from '../reference/invented-campaign.js';
import type { ChildFigures } from './plan-child.js';
import type { BenchModule } from './types.js';

const DEFAULT_SIZES = [100, 300];
const SEED = 1;
const CHILD = path.join(path.dirname(fileURLToPath(import.meta.url)), 'plan-child.js');

/** CREST_BENCH_E2E as candidate counts; anything else is one line and exit 2. */
function sizes(text: string | undefined): number[] {
  if (text === undefined) return DEFAULT_SIZES;
  const counts = text.split(',').map((s) => Number(s.trim()));
  if (counts.length > 0 && counts.every((n) => Number.isInteger(n) && n >= 1)) return counts;
  process.stderr.write(`bench: CREST_BENCH_E2E = ${JSON.stringify(text)}: candidate counts separated by commas, e.g. 100,1000\n`);
  process.exit(2);
}

/** The child's figures and its wall time from spawn to exit. */
function runChild(campaignFile: string, outDir: string): Promise<ChildFigures & { processSec: number }> {
  const t0 = process.hrtime.bigint();
  const child = fork(CHILD, [campaignFile, outDir], { stdio: ['ignore', 'ignore', 'inherit', 'ipc'] });
  return new Promise((resolve, reject) => {
    let figures: ChildFigures | undefined;
    child.on('message', (m) => {
      figures = m as ChildFigures;
    });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      const processSec = Number((Number(process.hrtime.bigint() - t0) / 1e9).toFixed(2));
      if (figures) resolve({ ...figures, processSec });
      else reject(new Error(`the plan child ended with ${signal ?? `exit ${code}`} and no figures`));
    });
  });
}

async function runSize(candidates: number): Promise<Record<string, unknown> & { candidates: number; totalSec: number }> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'crest-bench-'));
  try {
    const { campaignYaml, targetsCsv } = inventedCampaign({ candidates, seed: SEED });
    writeFileSync(path.join(dir, 'campaign.yaml'), campaignYaml);
    writeFileSync(path.join(dir, 'targets.csv'), targetsCsv);
    const loadAverage1m = Number(os.loadavg()[0]!.toFixed(1));
    const f = await runChild(path.join(dir, 'campaign.yaml'), path.join(dir, 'out'));
    return {
      case: `crest plan end to end: ${candidates} candidates, 180 nights, choose 20`,
      candidates,
      status: f.status,
      ...(f.stderr ? { stderr: f.stderr } : {}),
      totalSec: f.totalSec,
      processSec: f.processSec,
      stageSec: f.stageSec,
      peakRssMb: f.peakRssMb,
      heapLimitMb: f.heapLimitMb,
      // The machine's load when the run started (other work shares the cores).
      loadAverage1m,
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Log-log slope of time against candidates between consecutive sizes: d ln t / d ln N. */
function growth(runs: { candidates: number; totalSec: number }[]): Record<string, unknown> {
  const pairs = runs.slice(1).map((b, i) => {
    const a = runs[i]!;
    return { from: a.candidates, to: b.candidates, exponent: Number((Math.log(b.totalSec / a.totalSec) / Math.log(b.candidates / a.candidates)).toFixed(2)) };
  });
  return { case: 'crest plan end to end: growth of time with candidates (log-log slope)', pairs };
}

/** One line per size, then the growth line (from the runs that finished). */
export function planE2eBenches(): BenchModule[] {
  const runs: { candidates: number; totalSec: number }[] = [];
  const counts = sizes(process.env.CREST_BENCH_E2E);
  const perSize: BenchModule[] = counts.map((n) => ({
    name: 'plan-e2e',
    run: async () => {
      const figures = await runSize(n);
      if (figures.status === 0) runs.push(figures);
      return figures;
    },
  }));
  return [...perSize, { name: 'plan-e2e', run: () => growth(runs) }];
}
