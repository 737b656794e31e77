// Local search after the greedy pass: moves that raise the total utility, tried in a seeded
// order, until a whole pass finds none (a local optimum) or the pass limit is reached.
//  - add:     greedy fill of whatever still fits in the open nights;
//  - pair insert: start an ephemeris target with two visits at once (pair-insert.ts);
//  - replace: take one visit out and put the best other slot in (covers "move", the same target
//             at another time, and "swap", another target in the freed time);
//  - split: for a star allowed several visits a night, take one visit out and put the best pair of
//             that star's slots of the same night in (a replace cannot reach a pair that the one
//             visit's start blocks by the same-night spacing);
//  - night swap (choose-nights): close one or two chosen nights, open others instead (night-swap.ts).
// A move is kept only if it raises the utility by more than rounding (moves.ts), so the utility
// never decreases and the search ends.
import type { Rng } from '../rv/random.js';
import { improves, openNightList, shuffled } from './moves.js';
import { greedyFill, nightSlots } from './greedy.js';
import { nightSwapPass } from './night-swap.js';
import { pairInsertPass } from './pair-insert.js';
import type { PlanState } from './state.js';

export interface LocalSearchSettings {
  chooseNights: boolean;
  maxPasses: number;
  /** Closed nights tried as replacements for each chosen night. */
  nightCandidates: number;
  /** Hours mode: unchosen slots (best gain per hour) also tried as replacements. */
  shortlist: number;
  rng: Rng;
  onProgress?: (utility: number, step: string) => void;
}

function openSlots(state: PlanState): number[] {
  return openNightList(state).flatMap((n) => Array.from(nightSlots(state, n)));
}

/** Slots that could take chosen slot a's place: those overlapping it in its night, and its target's slots in open nights. */
function replacementCandidates(state: PlanState, a: number, maxDurationMs: number, shortlist: number[]): number[] {
  const c = state.c;
  const n = c.slotNight[a]!;
  const out: number[] = [];
  let lo = c.nightFrom[n]!;
  let hi = c.nightTo[n]!;
  const earliest = c.startMs[a]! - maxDurationMs;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (c.startMs[mid]! < earliest) lo = mid + 1;
    else hi = mid;
  }
  for (let j = lo; j < c.nightTo[n]! && c.startMs[j]! < c.endMs[a]!; j++) if (c.endMs[j]! > c.startMs[a]!) out.push(j);
  for (const j of c.targetSlots[c.slotTarget[a]!]!) if (state.nightOpen[c.slotNight[j]!]) out.push(j);
  return out.concat(shortlist);
}

function replacePass(state: PlanState, settings: LocalSearchSettings, maxDurationMs: number, shortlist: number[]): boolean {
  let improved = false;
  for (const a of shuffled(state.chosenSlots(), settings.rng)) {
    if (!state.chosen[a]) continue;
    const before = state.utility;
    state.remove(a);
    let best = -1;
    let bestUtility = before;
    for (const b of replacementCandidates(state, a, maxDurationMs, shortlist)) {
      if (b === a || !state.canAdd(b)) continue;
      const u = state.utility + state.gain(b);
      if (improves(bestUtility, u)) {
        best = b;
        bestUtility = u;
      }
    }
    state.add(best >= 0 ? best : a);
    if (best >= 0) {
      improved = true;
      settings.onProgress?.(state.utility, 'replace');
    }
  }
  return improved;
}

/** The split move of the file comment, for every chosen visit of a star with visitsPerNight > 1. */
function splitPass(state: PlanState, settings: LocalSearchSettings): boolean {
  const c = state.c;
  let improved = false;
  // Without such a star the pass draws nothing from the seeded order, so plans stay as they were.
  if (!c.onePerNight || c.visitsPerNight.every((cap) => cap < 2)) return false;
  for (const a of shuffled(state.chosenSlots(), settings.rng)) {
    const t = c.slotTarget[a]!;
    if (!state.chosen[a] || c.visitsPerNight[t]! < 2) continue;
    const day = c.slotDay[a]!;
    const mine = Array.from(c.targetSlots[t]!).filter((j) => c.slotDay[j] === day);
    const before = state.utility;
    state.remove(a);
    let best: [number, number] | undefined;
    let bestUtility = before;
    for (const b of mine) {
      if (!state.canAdd(b)) continue;
      state.add(b);
      for (const b2 of mine) {
        if (b2 === b || !state.canAdd(b2)) continue;
        const u = state.utility + state.gain(b2);
        if (improves(bestUtility, u)) {
          best = [b, b2];
          bestUtility = u;
        }
      }
      state.remove(b);
    }
    for (const j of best ?? [a]) state.add(j);
    if (best) {
      improved = true;
      settings.onProgress?.(state.utility, 'split');
    }
  }
  return improved;
}

/** Top unchosen slots by gain per hour (hours mode: candidates that need budget freed first). */
function bestUnchosen(state: PlanState, count: number): number[] {
  if (count <= 0) return [];
  const c = state.c;
  const scored: { j: number; key: number }[] = [];
  for (const j of openSlots(state)) if (!state.chosen[j]) scored.push({ j, key: state.rankingGain(j) / c.hours[j]! });
  return scored
    .sort((x, y) => y.key - x.key || x.j - y.j)
    .slice(0, count)
    .map((x) => x.j);
}

/** Improves the plan in place (see the file comment). Returns the number of passes run. */
export function localSearch(state: PlanState, settings: LocalSearchSettings): number {
  const c = state.c;
  let maxDurationMs = 0;
  for (let j = 0; j < c.slotCount; j++) maxDurationMs = Math.max(maxDurationMs, c.endMs[j]! - c.startMs[j]!);
  let pass = 0;
  while (pass < settings.maxPasses) {
    pass++;
    const before = state.utility;
    if (greedyFill(state, openSlots(state)).added.length > 0 && improves(before, state.utility)) settings.onProgress?.(state.utility, 'add');
    let improved = improves(before, state.utility);
    if (pairInsertPass(state, settings.rng, settings.onProgress)) improved = true;
    if (replacePass(state, settings, maxDurationMs, bestUnchosen(state, settings.shortlist))) improved = true;
    if (splitPass(state, settings)) improved = true;
    if (settings.chooseNights && nightSwapPass(state, settings.nightCandidates, settings.rng, settings.onProgress)) improved = true;
    if (!improved) break;
  }
  return pass;
}
