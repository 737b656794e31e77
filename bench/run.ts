// `npm run bench`: runs every bench module and prints one JSON line for each.
// To add a bench, write bench/<name>.ts exporting a BenchModule and list it below.
import type { BenchModule } from './types.js';
import { visibilityBench } from './visibility.js';
import { scheduleBenches } from './schedule.js';
import { injectionBench } from './injection.js';
import { nextBench } from './next.js';
import { planE2eBenches } from './plan-e2e.js';

const BENCHES: BenchModule[] = [visibilityBench, ...scheduleBenches, ...planE2eBenches(), injectionBench, nextBench];

/** Runs the benches named on the command line (all when none), one JSON line each on stdout. */
async function main(names: string[]): Promise<void> {
  for (const bench of BENCHES.filter((b) => names.length === 0 || names.includes(b.name))) {
    const figures = await bench.run();
    process.stdout.write(`${JSON.stringify({ bench: bench.name, ...figures })}\n`);
  }
}

await main(process.argv.slice(2));
