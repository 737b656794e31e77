import type { Plan } from '../../plan/plan-schema.js';
import { CATEGORY_COLOURS } from './palette.js';

const DASHES: readonly number[][] = [
  [1, 0],
  [6, 3],
  [2, 2],
];

/**
 * Each target's colour and line dash, fixed by its place in the campaign's target list so they are
 * the same in every chart; after the eight colours the dash changes, so no two targets look alike.
 */
export function targetStyles(plan: Plan, ids: string[]): Map<string, { colour: string; dash: number[] }> {
  const order = new Map(plan.campaign.targets.map((t, i) => [t.id, i]));
  return new Map(
    ids.map((id) => {
      const i = order.get(id) ?? 0;
      const n = CATEGORY_COLOURS.length;
      return [id, { colour: CATEGORY_COLOURS[i % n]!, dash: DASHES[Math.floor(i / n) % DASHES.length]! }];
    }),
  );
}
