import type { Plan } from '../plan/plan-schema.js';

/** plan.json: the whole plan with every input resolved; Dates become ISO 8601 UTC strings. */
export function renderPlanJson(plan: Plan): string {
  return `${JSON.stringify(plan, null, 2)}\n`;
}
