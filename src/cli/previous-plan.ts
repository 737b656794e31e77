import { existsSync } from 'node:fs';
import path from 'node:path';
import type { Plan } from '../model.js';
import { readPlan } from '../io/plan-json.js';

/**
 * The plan.json already in the --out folder, which the new plan replaces; undefined when there is
 * none. One that cannot be read is no error: one line on stderr, and undefined (plan.ics then
 * cancels nothing).
 */
export function readPreviousPlan(outDir: string): Plan | undefined {
  const file = path.join(outDir, 'plan.json');
  if (!existsSync(file)) return undefined;
  try {
    return readPlan(file);
  } catch (err) {
    console.error(`crest: note: plan.ics marks no visit cancelled: the previous plan could not be read (${(err as Error).message})`);
    return undefined;
  }
}
