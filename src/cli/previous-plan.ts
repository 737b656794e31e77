// The plan an --out folder already holds, for re-planning: read when it is a plan of the same
// campaign; a damaged one is reported in one line and left out, never an error (it is replaced).
import fs from 'node:fs';
import path from 'node:path';
import { CrestError } from '../errors.js';
import { readPlan } from '../io/plan-json.js';
import type { Plan } from '../plan/plan-schema.js';

export function previousPlan(outDir: string, campaignName: string, warn: (line: string) => void): Plan | undefined {
  const file = path.join(outDir, 'plan.json');
  if (!fs.existsSync(file)) return undefined;
  try {
    const plan = readPlan(file);
    return plan.campaign.name === campaignName ? plan : undefined;
  } catch (err) {
    if (!(err instanceof CrestError)) throw err;
    warn(`crest: note: the earlier plan.json in ${outDir} cannot be read (${err.message}): nothing is kept from it and plan.ics marks no visit cancelled`);
    return undefined;
  }
}
