// Injection–recovery bench: a 20 × 20 (period × m sin i) map with 200 trials a cell on an invented
// schedule (40 visits on random nights over 180 days, σ_eff 1.5–3 m/s), once on one worker thread
// and once on the default count; trials per second of each, the speedup, and the machine's load
// average before the runs (other processes on the machine lower the speedup).
import { availableParallelism, loadavg } from 'node:os';
import type { InjectionInput } from '../src/rv/injection.js';
import { logSpaced } from '../src/rv/injection-map.js';
import { injectionRecoveryParallel } from '../src/rv/injection-worker-pool.js';
import { createRng } from '../src/rv/random.js';
import type { BenchModule } from './types.js';

function benchInput(): InjectionInput {
  const rng = createRng(2027);
  const nights = new Set<number>();
  while (nights.size < 40) nights.add(Math.floor(180 * rng.uniform()));
  const timesBjdTdb = [...nights].sort((a, b) => a - b).map((n) => 2_461_400.6 + n + 0.25 * rng.uniform());
  return {
    timesBjdTdb,
    rvErrorsMps: timesBjdTdb.map(() => 1.5 + 1.5 * rng.uniform()),
    periodsDays: logSpaced(2, 100, 20),
    msinisEarth: logSpaced(2, 60, 20),
    starMassSun: 0.9,
    trialsPerCell: 200,
    seed: 1,
  };
}

async function timedMap(input: InjectionInput, threads: number): Promise<number> {
  const t0 = process.hrtime.bigint();
  await injectionRecoveryParallel(input, { threads });
  return Number(process.hrtime.bigint() - t0) / 1e9;
}

async function run(): Promise<Record<string, unknown>> {
  const input = benchInput();
  const trials = input.periodsDays.length * input.msinisEarth.length * input.trialsPerCell;
  const threads = Math.min(availableParallelism(), input.periodsDays.length * input.msinisEarth.length);
  const loadAvg1 = loadavg()[0]!;
  const sec1 = await timedMap(input, 1);
  const secN = await timedMap(input, threads);
  return {
    case: '20 x 20 map, 200 trials a cell, 40 visits over 180 days',
    trialsPerSec1: Math.round(trials / sec1),
    trialsPerSecN: Math.round(trials / secN),
    threadSpeedup: Number((sec1 / secN).toFixed(2)),
    threads,
    map20x20Sec1: Number(sec1.toFixed(2)),
    map20x20SecN: Number(secN.toFixed(2)),
    cores: availableParallelism(),
    loadAvg1BeforeRun: Number(loadAvg1.toFixed(2)),
  };
}

export const injectionBench: BenchModule = { name: 'injection', run };
