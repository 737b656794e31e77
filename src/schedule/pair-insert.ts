// Pair insertion, a local-search move for stars with planets and fewer than two visits: one
// visit alone carries no information on K (the free offset absorbs it), so no single add or
// replace can start such a star. The move inserts two of its visits, one on each side of its
// first planet's signal (s > 0 and s < 0), taking out whatever chosen visits overlap them, and is
// kept if the total utility rises. Only the few best slots on each side (largest w s^2) are paired.
import type { Rng } from '../rv/random.js';
import { improves, shuffled } from './moves.js';
import type { PlanState } from './state.js';

/** Slots tried on each side of the signal. */
const SIDE = 6;

/** Chosen visits in slot b's night whose time overlaps b. */
function overlapping(state: PlanState, b: number): number[] {
  const c = state.c;
  return state.nightVisits[c.slotNight[b]!]!.filter((j) => c.startMs[j]! < c.endMs[b]! && c.startMs[b]! < c.endMs[j]!);
}

/** Adds b after taking out what overlaps it; returns the slots taken out, or null (plan unchanged) if b still does not fit. */
function insertWithEjection(state: PlanState, b: number): number[] | null {
  if (state.chosen[b] || !state.nightOpen[state.c.slotNight[b]!]) return null;
  const ejected = overlapping(state, b);
  for (const j of ejected) state.remove(j);
  if (state.canAdd(b)) {
    state.add(b);
    return ejected;
  }
  for (const j of ejected) state.add(j);
  return null;
}

function undoInsert(state: PlanState, b: number, ejected: number[]): void {
  state.remove(b);
  for (const j of ejected) state.add(j);
}

/** Utility after inserting b1 and b2 (with ejection), or -Infinity if they do not fit; the plan is left as it was. */
function pairValue(state: PlanState, b1: number, b2: number): number {
  const first = insertWithEjection(state, b1);
  if (!first) return -Infinity;
  const second = insertWithEjection(state, b2);
  const value = second ? state.utility : -Infinity;
  if (second) undoInsert(state, b2, second);
  undoInsert(state, b1, first);
  return value;
}

function bestSide(state: PlanState, slots: number[], positive: boolean): number[] {
  const c = state.c;
  return slots
    .filter((j) => c.signal[j]! >= 0 === positive)
    .sort((a, b) => c.weight[b]! * c.signal[b]! ** 2 - c.weight[a]! * c.signal[a]! ** 2 || a - b)
    .slice(0, SIDE);
}

/** Tries a pair insertion for every ephemeris target with fewer than two visits; returns whether any was kept. */
export function pairInsertPass(state: PlanState, rng: Rng, onProgress?: (utility: number, step: string) => void): boolean {
  const c = state.c;
  const targets: number[] = [];
  for (let t = 0; t < c.targetCount; t++) if (c.models[t] && state.targetVisits[t]!.length < 2) targets.push(t);
  let improved = false;
  for (const t of shuffled(targets, rng)) {
    const open = Array.from(c.targetSlots[t]!).filter((j) => state.nightOpen[c.slotNight[j]!] && !state.chosen[j]);
    const before = state.utility;
    let best: [number, number] | null = null;
    let bestUtility = before;
    for (const b1 of bestSide(state, open, true)) {
      for (const b2 of bestSide(state, open, false)) {
        const u = pairValue(state, b1, b2);
        if (improves(bestUtility, u)) {
          best = [b1, b2];
          bestUtility = u;
        }
      }
    }
    if (!best) continue;
    insertWithEjection(state, best[0]);
    insertWithEjection(state, best[1]);
    improved = true;
    onProgress?.(state.utility, 'pair insert');
  }
  return improved;
}
