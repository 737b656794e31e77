import type { Plan } from '../../plan/plan-schema.js';
import { distinctColours } from './palette.js';

/**
 * One colour per star of a chart, none repeated: the stars are taken in the campaign's target
 * order, so the colour-blind-safe colours go first and the same stars always get the same colours.
 */
export function targetColours(plan: Plan, starIds: string[]): Map<string, string> {
  const order = new Map(plan.campaign.targets.map((t, i) => [t.starId, i]));
  const sorted = [...new Set(starIds)].sort((a, b) => (order.get(a) ?? Infinity) - (order.get(b) ?? Infinity));
  const colours = distinctColours(sorted.length);
  return new Map(sorted.map((id, i) => [id, colours[i]!]));
}
