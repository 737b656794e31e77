// Worker-thread entry of the parallel injection–recovery (injection-worker-pool.ts). It receives
// the map's input as workerData, prepares the shared periodogram kernel once, then answers each
// message `cell` (index i · masses + j) with that cell's detection probability. Cells carry their
// own seeded streams, so the answer does not depend on which worker computes it.
import { parentPort, workerData } from 'node:worker_threads';
import { detectionProbability, prepareInjection, type InjectionInput } from './injection.js';

export interface CellResult {
  cell: number;
  probability: number;
}

const port = parentPort;
if (port) {
  const setup = prepareInjection(workerData as InjectionInput);
  const masses = setup.input.msinisEarth.length;
  port.on('message', (cell: number) => {
    const result: CellResult = { cell, probability: detectionProbability(setup, Math.floor(cell / masses), cell % masses) };
    port.postMessage(result);
  });
}
