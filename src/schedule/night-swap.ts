// Night swaps (choose-nights mode): give up chosen nights for nights left out. Single swaps close
// one chosen night and open the best of a few candidate nights; if none helps, double swaps close
// the two least useful chosen nights of a handful and open two candidates together, which can
// start an ephemeris target that needs two nights before its first visit is worth anything.
// Candidates are the closed nights with the largest ranking value given the plan.
import type { Rng } from '../rv/random.js';
import { fillNight, nightValue } from './greedy.js';
import { improves, openNightList, shuffled } from './moves.js';
import type { PlanState } from './state.js';

/** Double swaps pair the DOUBLE_OUT least useful chosen nights with the DOUBLE_IN best candidates. */
const DOUBLE_OUT = 4;
const DOUBLE_IN = 6;

function fill(state: PlanState, n: number): number[] {
  return fillNight(state, n).added;
}

function unfill(state: PlanState, n: number, added: number[]): void {
  for (const j of added) state.remove(j);
  state.closeNight(n);
}

function restore(state: PlanState, n: number, visits: number[]): void {
  state.openNight(n);
  for (const j of visits) state.add(j);
}

/** Utility after closing `out` and filling `into` (both lists of nights); the plan is left unchanged. */
function swapValue(state: PlanState, out: number[], into: number[]): number {
  const removed = out.map((n) => state.closeNight(n));
  const added = into.map((n) => fill(state, n));
  const value = state.utility;
  for (let i = into.length - 1; i >= 0; i--) unfill(state, into[i]!, added[i]!);
  for (let i = out.length - 1; i >= 0; i--) restore(state, out[i]!, removed[i]!);
  return value;
}

function pairs(items: number[]): [number, number][] {
  return items.flatMap((a, i) => items.slice(i + 1).map((b): [number, number] => [a, b]));
}

function apply(state: PlanState, out: number[], into: number[]): void {
  for (const n of out) state.closeNight(n);
  for (const n of into) fill(state, n);
}

/** One pass of night swaps; returns whether any was kept. */
export function nightSwapPass(state: PlanState, candidateCount: number, rng: Rng, onProgress?: (utility: number, step: string) => void): boolean {
  const c = state.c;
  const closed: number[] = [];
  for (let n = 0; n < c.nightCount; n++) if (!state.nightOpen[n] && c.nightTo[n]! > c.nightFrom[n]!) closed.push(n);
  const candidates = closed
    .map((n) => ({ n, value: nightValue(state, n).ranking }))
    .sort((x, y) => y.value - x.value || x.n - y.n)
    .slice(0, candidateCount)
    .map((x) => x.n);
  let improved = false;
  for (const out of shuffled(openNightList(state), rng)) {
    let best = -1;
    let bestUtility = state.utility;
    for (const n of candidates) {
      if (state.nightOpen[n]) continue;
      const u = swapValue(state, [out], [n]);
      if (improves(bestUtility, u)) [best, bestUtility] = [n, u];
    }
    if (best < 0) continue;
    apply(state, [out], [best]);
    candidates[candidates.indexOf(best)] = out;
    improved = true;
    onProgress?.(state.utility, 'night swap');
  }
  if (improved) return true;

  const before = state.utility;
  const weakest = openNightList(state)
    .map((n) => ({ n, loss: before - swapValue(state, [n], []) }))
    .sort((x, y) => x.loss - y.loss || x.n - y.n)
    .slice(0, DOUBLE_OUT)
    .map((x) => x.n);
  let best: [number[], number[]] | null = null;
  let bestUtility = before;
  for (const out of pairs(weakest)) {
    for (const into of pairs(candidates.slice(0, DOUBLE_IN))) {
      const u = swapValue(state, out, into);
      if (improves(bestUtility, u)) [best, bestUtility] = [[out, into], u];
    }
  }
  if (!best) return false;
  apply(state, best[0], best[1]);
  onProgress?.(state.utility, 'double night swap');
  return true;
}
