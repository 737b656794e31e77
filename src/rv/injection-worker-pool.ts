// Injection–recovery over worker_threads. Every worker rebuilds the same setup from the input and
// pulls cells one at a time (a worker that finishes early takes the next cell), so the load
// balances itself; since each cell has its own seeded stream, the map is identical for any number
// of threads and equal to `injectionRecovery(input)` computed in one thread.
import { Worker } from 'node:worker_threads';
import { injectionMapFromCells, prepareInjection, type InjectionInput, type InjectionMap } from './injection.js';
import type { CellResult } from './injection-worker.js';

/** The worker script beside this module (dist/rv/injection-worker.js once built). */
const WORKER_URL = new URL('./injection-worker.js', import.meta.url);

export interface ParallelOptions {
  /** Worker threads (at most one per cell); the CLI passes the machine's core count (the core never reads it). */
  threads: number;
  /** Called after every finished cell with (cells done, cells in all). */
  onProgress?: (done: number, total: number) => void;
}

/**
 * The detection probabilities of the given cells of `input`'s map (cell = period index · masses +
 * mass index), in the order given, computed by worker threads (see the file comment).
 */
export async function injectionCellsParallel(input: InjectionInput, cells: number[], options: ParallelOptions): Promise<number[]> {
  // Validates the input before any thread starts.
  prepareInjection(input);
  return cellsOnWorkers(input, cells, options);
}

/** injectionCellsParallel on an input already validated. */
async function cellsOnWorkers(input: InjectionInput, cells: number[], options: ParallelOptions): Promise<number[]> {
  const total = cells.length;
  const out = new Array<number>(total);
  if (total === 0) return out;
  const threads = Math.max(1, Math.min(options.threads, total));
  const position = new Map(cells.map((cell, k) => [cell, k]));
  let next = 0;
  let done = 0;
  const workers: Worker[] = [];
  try {
    await new Promise<void>((resolve, reject) => {
      const feed = (worker: Worker) => {
        if (next < total) worker.postMessage(cells[next++]);
      };
      for (let k = 0; k < threads; k++) {
        // execArgv [] : a compute thread needs none of the parent's flags or module hooks.
        const worker = new Worker(WORKER_URL, { workerData: input, execArgv: [] });
        workers.push(worker);
        worker.on('message', ({ cell, probability }: CellResult) => {
          out[position.get(cell)!] = probability;
          done += 1; // not inside the optional call below: `?.` would skip it without a callback
          options.onProgress?.(done, total);
          if (done === total) resolve();
          else feed(worker);
        });
        worker.on('error', reject);
        worker.on('exit', (code) => {
          if (done < total) reject(new Error(`injection worker stopped with code ${code} before the map was done`));
        });
        feed(worker); // queued until the worker's listener is attached
      }
    });
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return out;
}

/** The injection–recovery map of `input`, every cell computed by worker threads. */
export async function injectionRecoveryParallel(input: InjectionInput, options: ParallelOptions): Promise<InjectionMap> {
  const setup = prepareInjection(input);
  const { periodsDays, msinisEarth } = input;
  const flat = await cellsOnWorkers(
    input,
    Array.from({ length: periodsDays.length * msinisEarth.length }, (_, cell) => cell),
    options,
  );
  return injectionMapFromCells(setup, flat);
}
