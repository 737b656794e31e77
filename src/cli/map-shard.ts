// `crest map` split across machines. The costly part of a map run is injection–recovery: every
// trial of every blind-search cell is a periodogram. `--shard i/n` computes a deterministic share
// of those cells (all blind-search cells of the run in target then cell order, every n-th from the
// i-th) and writes them as one part file; `--merge` checks that the parts belong to one run and
// cover every cell once, and hands their detection probabilities back to the map command, which
// then writes what a single run writes. Each cell has its own seeded stream (src/rv/injection.ts),
// so a cell's value does not depend on which part computed it: the merged files equal one run's
// byte for byte. Known-phase maps (closed form and one linear fit per trial) are made at the merge.
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { inputError } from '../errors.js';
import { fileSha256, MAP_SHARD_NAME, type MapShard, mapShardFile, readMapShard, type ShardCell } from '../io/map-shard-file.js';
import { injectionCellsParallel } from '../rv/injection-worker-pool.js';
import type { Progress } from './progress.js';
import type { MapJob, MapSettings } from './map-targets.js';

/** Most parts a map may be split into. */
const MAX_SHARDS = 10_000;

export interface ShardSpec {
  index: number;
  count: number;
}

/** `--shard i/n`: part i (0-based, as a Slurm array task id) of n. */
export function shardFlag(text: string): ShardSpec {
  const allowed = `i/n: part i of n, whole numbers with 0 <= i < n <= ${MAX_SHARDS} (i counts from 0, as $SLURM_ARRAY_TASK_ID)`;
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  const [index, count] = m ? [Number(m[1]), Number(m[2])] : [-1, 0];
  if (!(index >= 0 && count >= 1 && index < count && count <= MAX_SHARDS)) throw inputError({ file: 'command line', field: '--shard', value: text, allowed });
  return { index, count };
}

/** What a part must agree on with the merge: the target asked for and every setting of the maps. */
export function requestText(targetId: string | undefined, s: MapSettings): string {
  return JSON.stringify({
    target: targetId ?? null,
    periods: s.periods ?? null,
    masses: s.masses ?? null,
    grid: s.grid,
    trialsPerCell: s.trialsPerCell,
    fapThreshold: s.fapThreshold,
    seed: s.seed,
    eccMax: s.eccMax ?? 0,
  });
}

interface JobCell {
  job: number;
  targetId: string;
  cell: number;
}

/** Every blind-search cell of the run, in target then cell order. */
function allCells(jobs: MapJob[]): JobCell[] {
  return jobs.flatMap((job, k) =>
    job.kind === 'search'
      ? Array.from({ length: job.input.periodsDays.length * job.input.msinisEarth.length }, (_, cell) => ({ job: k, targetId: job.targetId, cell }))
      : [],
  );
}

/** The cells of part `shard`: every shard.count-th of `all` from the shard.index-th. */
function cellsOfShard(all: JobCell[], shard: ShardSpec): JobCell[] {
  return all.filter((_, u) => u % shard.count === shard.index);
}

/** Computes part `shard` of the run: its cells' detection probabilities, target by target. */
export async function computeShard(jobs: MapJob[], shard: ShardSpec, threads: number, progress: Progress): Promise<ShardCell[]> {
  const mine = cellsOfShard(allCells(jobs), shard);
  const out: ShardCell[] = [];
  for (const [k, job] of jobs.entries()) {
    if (job.kind !== 'search') continue;
    const cells = mine.filter((c) => c.job === k).map((c) => c.cell);
    const detection = await injectionCellsParallel(job.input, cells, {
      threads,
      onProgress: (done, total) => progress.update(job.targetId, done, total),
    });
    progress.end();
    cells.forEach((cell, i) => {
      out.push({ targetId: job.targetId, cell, detection: detection[i]! });
    });
  }
  return out;
}

/** The part file of `shard` for a run of `planFile` with `request`. */
export function shardOf(planFile: string, request: string, shard: ShardSpec, cells: ShardCell[]): MapShard {
  return { crestMapShard: 1, shard, planSha256: fileSha256(planFile), request, cells };
}

/** The part files in `outDir`, all of one split into n parts, every part present. */
function partFiles(outDir: string): string[] {
  const names = existsSync(outDir) ? readdirSync(outDir).filter((n) => MAP_SHARD_NAME.test(n)) : [];
  const where = path.join(outDir, 'map-shard-<i>-of-<n>.json');
  if (!names.length)
    throw inputError({ file: 'command line', field: '--merge', value: where, allowed: 'map parts written by crest map --shard i/n into the --out folder' });
  const counts = [...new Set(names.map((n) => Number(MAP_SHARD_NAME.exec(n)![2])))].sort((a, b) => a - b);
  if (counts.length > 1) {
    const allowed = `the parts of one split; the folder holds splits into ${counts.join(' and ')} parts: remove the old ones`;
    throw inputError({ file: 'command line', field: '--merge', value: where, allowed });
  }
  const count = counts[0]!;
  const missing = Array.from({ length: count }, (_, i) => mapShardFile(i, count)).filter((n) => !names.includes(n));
  if (missing.length) throw inputError({ file: 'command line', field: '--merge', value: where, allowed: `all ${count} parts; missing ${missing.join(', ')}` });
  return Array.from({ length: count }, (_, i) => path.join(outDir, mapShardFile(i, count)));
}

/**
 * Reads and checks every part in `outDir` against this run (same plan bytes, same request, the
 * cells its index owns, in order) and returns each blind-search job's flat detection
 * probabilities (cell order), keyed by job index.
 */
export function mergeShards(outDir: string, planFile: string, request: string, jobs: MapJob[]): Map<number, number[]> {
  const planSha256 = fileSha256(planFile);
  const all = allCells(jobs);
  const flat = new Map<number, number[]>();
  for (const file of partFiles(outDir)) {
    const part = readMapShard(file);
    const [, index, count] = MAP_SHARD_NAME.exec(path.basename(file))!.map(Number);
    if (part.shard.index !== index || part.shard.count !== count)
      throw inputError({ file, field: 'shard', value: part.shard, allowed: `part ${index} of ${count}, as the file name says` });
    if (part.planSha256 !== planSha256)
      throw inputError({
        file,
        field: 'planSha256',
        value: part.planSha256,
        allowed: `the SHA-256 of ${planFile} (${planSha256}): the part was made from another plan`,
      });
    if (part.request !== request)
      throw inputError({ file, field: 'request', value: part.request, allowed: `the request of this merge, ${request}: give --merge the flags the parts had` });
    const expected = cellsOfShard(all, part.shard);
    const at = part.cells.findIndex((c, i) => c.targetId !== expected[i]?.targetId || c.cell !== expected[i]?.cell);
    if (at >= 0 || part.cells.length !== expected.length) {
      const k = at >= 0 ? at : Math.min(part.cells.length, expected.length);
      const want = expected[k] ? `${expected[k].targetId} cell ${expected[k].cell}` : 'no more cells';
      throw inputError({ file, field: `cells[${k}]`, value: part.cells[k] ?? null, allowed: `the cells part ${index} owns, in order: here ${want}` });
    }
    for (const [i, c] of part.cells.entries()) {
      const job = expected[i]!.job;
      if (!flat.has(job)) flat.set(job, []);
      flat.get(job)![c.cell] = c.detection;
    }
  }
  return flat;
}
