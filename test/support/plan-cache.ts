// Plans that more than one test file builds (random campaigns 0 to 7: random-plans-0.test.ts and
// replan.test.ts), built once per test run. The two workers may ask for them at the same moment:
// each key is claimed by the first worker to take its claim file (an exclusive create) and
// built there; the other worker builds the keys nobody has claimed, then waits for the rest. A
// plan goes to the run's folder (plan-cache-setup.ts) as v8.serialize bytes (the structured clone:
// Dates and every number exactly) and stays in the worker's memory (test files share a worker's
// modules, isolate: false). Each call returns fresh copies, so no test sees what another changed.
import { closeSync, existsSync, openSync, readFileSync, renameSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { deserialize, serialize } from 'node:v8';
import { inject } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';

declare module 'vitest' {
  export interface ProvidedContext {
    planCacheDir: string;
  }
}

const inWorker = new Map<string, Buffer>();
const POLL_MS = 50;

const fileOf = (key: string) => path.join(inject('planCacheDir'), `${key}.v8`);
const claimOf = (key: string) => `${fileOf(key)}.claim`;

/** The finished plan's bytes, from memory or the run's folder; undefined while none is written. */
function finished(key: string): Buffer | undefined {
  const bytes = inWorker.get(key) ?? (existsSync(fileOf(key)) ? readFileSync(fileOf(key)) : undefined);
  if (bytes) inWorker.set(key, bytes);
  return bytes;
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** Takes the key's claim file, unless a live worker holds it (a claim of this worker's failed build, or of a dead worker's, is taken over). */
function claim(key: string): boolean {
  const file = claimOf(key);
  try {
    const fd = openSync(file, 'wx');
    writeSync(fd, String(process.pid));
    closeSync(fd);
    return true;
  } catch {
    // An empty claim is one being written: its owner is alive.
    const owner = Number(readFileSync(file, 'utf8'));
    if (owner !== process.pid && (!(owner > 0) || alive(owner))) return false;
    writeFileSync(file, String(process.pid));
    return true;
  }
}

function buildAndKeep(key: string, build: () => Plan): void {
  let bytes: Buffer;
  try {
    bytes = serialize(build());
  } catch (error) {
    // Nobody waits for a build that failed: the next asker builds it again (and fails the same way).
    rmSync(claimOf(key), { force: true });
    throw error;
  }
  // Written whole, then renamed: a reader finds no file or all of it.
  const staging = `${fileOf(key)}.${process.pid}`;
  writeFileSync(staging, bytes);
  renameSync(staging, fileOf(key));
  inWorker.set(key, bytes);
}

export interface PlanToShare {
  /** Names the plan in the run's folder (a file name). */
  key: string;
  build: () => Plan;
}

/** The plans of the given builds, in their order, each built once per test run. */
export async function sharedPlans(plans: PlanToShare[]): Promise<Plan[]> {
  for (;;) {
    let waiting = false;
    for (const { key, build } of plans) {
      if (finished(key)) continue;
      if (claim(key)) buildAndKeep(key, build);
      else waiting = true;
    }
    if (!waiting) break;
    await sleep(POLL_MS);
  }
  return plans.map(({ key }) => deserialize(finished(key)!) as Plan);
}
