// The demo plan of the global setup (demo-plan-setup.ts): the two `crest plan` runs and the Plan
// read back from the plan.json they wrote.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { inject } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { planFromJson } from '../../src/io/plan-json.js';
import type { CliResult } from '../cli/run-cli.js';

export interface DemoRun {
  /** The --out folder of the run. */
  dir: string;
  result: CliResult;
}

/** `crest plan --out summary` and `crest plan --out json --json`, run side by side. */
export interface DemoRuns {
  summary: DemoRun;
  json: DemoRun;
}

declare module 'vitest' {
  export interface ProvidedContext {
    demoRuns: DemoRuns;
  }
}

export function demoRuns(): DemoRuns {
  return inject('demoRuns');
}

/** The demo Plan as `crest plan` wrote it (plan.json of the --json run, Dates restored). */
export function demoPlan(): Plan {
  const file = path.join(demoRuns().json.dir, 'plan.json');
  return planFromJson(JSON.parse(readFileSync(file, 'utf8')), file);
}
