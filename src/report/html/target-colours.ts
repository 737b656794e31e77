import type { Plan } from '../../model.js';
import { CATEGORY_COLOURS } from './palette.js';

/** Each target's colour, fixed by its place in the campaign's target list so it is the same in every chart. */
export function targetColours(plan: Plan, ids: string[]): Map<string, string> {
  const order = new Map(plan.campaign.targets.map((t, i) => [t.id, i]));
  return new Map(ids.map((id) => [id, CATEGORY_COLOURS[(order.get(id) ?? 0) % CATEGORY_COLOURS.length]!]));
}
