// Small helpers shared by the local-search moves.
import type { Rng } from '../rv/random.js';
import type { PlanState } from './state.js';

/** Shuffles in place and returns `items`: Fisher–Yates (Knuth, TAOCP vol. 2, Algorithm P). */
export function shuffled(items: number[], rng: Rng): number[] {
  for (let i = items.length - 1; i > 0; i--) {
    const k = Math.floor(rng.uniform() * (i + 1));
    [items[i], items[k]] = [items[k]!, items[i]!];
  }
  return items;
}

export function openNightList(state: PlanState): number[] {
  const out: number[] = [];
  for (let n = 0; n < state.c.nightCount; n++) if (state.nightOpen[n] && !state.c.nightGranted[n]) out.push(n);
  return out;
}

/**
 * Whether `after` beats `before` by more than rounding: moves must pass this to be kept. The
 * running sums collect rounding of about 1e-16 per add or remove, so a relative 1e-9 is far above it.
 */
export function improves(before: number, after: number): boolean {
  return after > before + 1e-9 * Math.max(1, Math.abs(before));
}
