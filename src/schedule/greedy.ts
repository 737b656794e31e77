// Greedy by marginal utility per hour: repeatedly add the feasible slot with the largest
// (ranking) gain per hour of telescope time, until none adds anything. Gains change only for the
// target that just received a visit, so its slots are re-priced at once and the other entries of
// the heap stay valid (each slot has at most one entry, changed in place when re-priced).
import type { PlanState } from './state.js';

/** Whether (keyA, slotA) ranks above (keyB, slotB): the larger key, and on equal keys the earlier slot, so the order is fully determined. */
function ranksAbove(keyA: number, slotA: number, keyB: number, slotB: number): boolean {
  return keyA > keyB || (keyA === keyB && slotA < slotB);
}

/** Max-heap of slots by key with at most one entry per slot, whose key can change in place (each slot's position is kept). */
class SlotHeap {
  private keys = new Float64Array(64);
  private slots = new Int32Array(64);
  /** Heap position of each slot; -1 without an entry. */
  private readonly position: Int32Array;
  size = 0;

  constructor(slotCount: number) {
    this.position = new Int32Array(slotCount).fill(-1);
  }

  private put(i: number, key: number, slot: number): void {
    this.keys[i] = key;
    this.slots[i] = slot;
    this.position[slot] = i;
  }

  /** Puts (key, slot) into hole i, moved up past the parents it ranks above, else down past the children that rank above it. */
  private settle(i: number, key: number, slot: number): void {
    const { keys, slots } = this;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (!ranksAbove(key, slot, keys[parent]!, slots[parent]!)) break;
      this.put(i, keys[parent]!, slots[parent]!);
      i = parent;
    }
    for (;;) {
      let child = 2 * i + 1;
      if (child >= this.size) break;
      if (child + 1 < this.size && ranksAbove(keys[child + 1]!, slots[child + 1]!, keys[child]!, slots[child]!)) child++;
      if (!ranksAbove(keys[child]!, slots[child]!, key, slot)) break;
      this.put(i, keys[child]!, slots[child]!);
      i = child;
    }
    this.put(i, key, slot);
  }

  /** Sets the key of slot's entry, adding the entry if it has none. */
  set(slot: number, key: number): void {
    let i = this.position[slot]!;
    if (i < 0) {
      if (this.size === this.keys.length) {
        const keys = new Float64Array(2 * this.size);
        const slots = new Int32Array(2 * this.size);
        keys.set(this.keys);
        slots.set(this.slots);
        this.keys = keys;
        this.slots = slots;
      }
      i = this.size++;
    }
    this.settle(i, key, slot);
  }

  /** Removes slot's entry, if it has one. */
  delete(slot: number): void {
    const i = this.position[slot]!;
    if (i < 0) return;
    this.position[slot] = -1;
    const last = --this.size;
    if (i < last) this.settle(i, this.keys[last]!, this.slots[last]!);
  }

  /** Removes the top entry and returns its slot. */
  pop(): number {
    const top = this.slots[0]!;
    this.delete(top);
    return top;
  }
}

/** Smallest gain worth a visit. */
const MIN_GAIN = 1e-12;

/** The heap and per-star lists greedyFill reuses from call to call (one set per plan state). */
interface GreedyScratch {
  heap: SlotHeap;
  /** Candidates grouped by star: star t's are byTarget[from[t] .. from[t] + count[t]). */
  from: Int32Array;
  count: Int32Array;
  byTarget: Int32Array;
  /** The stars among the candidates, in order of their first candidate. */
  targets: Int32Array;
}

const scratchOf = new WeakMap<PlanState, GreedyScratch>();

function scratch(state: PlanState, candidates: number): GreedyScratch {
  let s = scratchOf.get(state);
  if (!s) {
    const T = state.c.targetCount;
    s = { heap: new SlotHeap(state.c.slotCount), from: new Int32Array(T), count: new Int32Array(T), byTarget: new Int32Array(64), targets: new Int32Array(T) };
    scratchOf.set(state, s);
  }
  if (s.byTarget.length < candidates) s.byTarget = new Int32Array(Math.max(candidates, 2 * s.byTarget.length));
  return s;
}

/**
 * Adds slots from `candidates` greedily (see the file comment); returns the slots added, in order,
 * and the sum of their ranking gains (state.rankingGain: a first ephemeris visit counts half a pair).
 * With `exact`, slots are ranked by their exact gain instead (a lone first visit then counts nothing).
 */
export function greedyFill(state: PlanState, candidates: ArrayLike<number>, exact = false): { added: number[]; rankingValue: number } {
  const c = state.c;
  const { heap, from, count, byTarget, targets } = scratch(state, candidates.length);
  // Group the candidates by star (a counting sort that keeps their order).
  for (let i = 0; i < candidates.length; i++) count[c.slotTarget[candidates[i]!]!] = 0;
  for (let i = 0; i < candidates.length; i++) count[c.slotTarget[candidates[i]!]!]++;
  let next = 0;
  let targetCount = 0;
  for (let i = 0; i < candidates.length; i++) {
    const t = c.slotTarget[candidates[i]!]!;
    if (count[t]! > 0) {
      targets[targetCount++] = t;
      from[t] = next;
      next += count[t]!;
      count[t] = 0;
    }
  }
  for (let i = 0; i < candidates.length; i++) {
    const j = candidates[i]!;
    const t = c.slotTarget[j]!;
    byTarget[from[t]! + count[t]!++] = j;
  }
  // Prices star t's listed slots but `skip`, dropping those that cannot be added: the greedy only
  // adds, and an add never makes another slot addable, so they stay out for the rest of the pass.
  const price = (t: number, skip: number) => {
    const start = from[t]!;
    const end = start + count[t]!;
    let kept = start;
    for (let i = start; i < end; i++) {
      const j = byTarget[i]!;
      if (j === skip || !state.canAdd(j)) {
        heap.delete(j);
        continue;
      }
      byTarget[kept++] = j;
      const g = exact ? state.gain(j) : state.rankingGain(j);
      if (g > MIN_GAIN) heap.set(j, g / c.hours[j]!);
      else heap.delete(j);
    }
    count[t] = kept - start;
  };
  for (let i = 0; i < targetCount; i++) price(targets[i]!, -1);
  const added: number[] = [];
  let rankingValue = 0;
  while (heap.size > 0) {
    const j = heap.pop();
    const t = c.slotTarget[j]!;
    if (!state.canAdd(j)) continue;
    rankingValue += state.rankingGain(j);
    state.add(j);
    added.push(j);
    price(t, j);
  }
  return { added, rankingValue };
}

/** Slot positions of night n (a contiguous range of the sorted slots). */
export function nightSlots(state: PlanState, n: number): Int32Array {
  const from = state.c.nightFrom[n]!;
  const out = new Int32Array(state.c.nightTo[n]! - from);
  for (let i = 0; i < out.length; i++) out[i] = from + i;
  return out;
}

/**
 * Opens night n and fills it with the better (by exact utility) of the two greedy schedules,
 * ranked by ranking gains or by exact gains: the first can start a target, the second does not
 * spend time on a first visit that nothing else in the plan pairs with.
 */
export function fillNight(state: PlanState, n: number): { added: number[]; rankingValue: number } {
  const before = state.utility;
  state.openNight(n);
  const slots = nightSlots(state, n);
  const ranked = greedyFill(state, slots);
  const rankedUtility = state.utility;
  for (const j of ranked.added) state.remove(j);
  const exact = greedyFill(state, slots, true);
  if (state.utility - before >= rankedUtility - before) return { added: exact.added, rankingValue: ranked.rankingValue };
  for (const j of exact.added) state.remove(j);
  for (const j of ranked.added) state.add(j);
  return ranked;
}

/**
 * What filling closed night n (fillNight) would add to the plan, which is left unchanged:
 * `utility`, the exact gain, and `ranking`, the sum of ranking gains (used to order nights).
 */
export function nightValue(state: PlanState, n: number): { utility: number; ranking: number } {
  const before = state.utility;
  const { added, rankingValue } = fillNight(state, n);
  const utility = state.utility - before;
  for (const j of added) state.remove(j);
  state.closeNight(n);
  return { utility, ranking: rankingValue };
}
