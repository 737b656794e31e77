// The problem in flat typed arrays: slots sorted by (night, start), per-night and per-target
// slot lists, and where each target keeps its running sums. Built once per optimisation.
import { EPHEMERIS_STATS, signalMoments } from './objective-ephemeris.js';
import { searchGrid, searchStatsLength, type SearchGrid } from './objective-search.js';
import type { ScheduleProblem } from './types.js';

/** Ridge of a search target's information matrix, as a fraction of its median visit weight (objective-search.ts). */
const SEARCH_RIDGE_FRACTION = 1e-3;

export interface CompiledProblem {
  problem: ScheduleProblem;
  targetCount: number;
  /** Per target: search grid, or null for an ephemeris target. */
  grids: (SearchGrid | null)[];
  priority: Float64Array;
  kMps: Float64Array;
  goal: Float64Array;
  statsOffset: Int32Array;
  statsLength: number;
  /** Per target, for the greedy's first-visit estimate: largest weight and largest |m| among its slots. */
  maxWeight: Float64Array;
  maxAbsSignal: Float64Array;
  /** Per target: its slot positions in time order. */
  targetSlots: Int32Array[];

  slotCount: number;
  /** Position in problem.slots of each sorted slot. */
  slotSource: Int32Array;
  slotTarget: Int32Array;
  /** Position of the slot's night in `nightOrder`. */
  slotNight: Int32Array;
  startMs: Float64Array;
  endMs: Float64Array;
  hours: Float64Array;
  weight: Float64Array;
  /** Ephemeris: mean signal m; search: mid time in days. */
  valueA: Float64Array;
  /** Ephemeris: mean square signal q; search: unused. */
  valueB: Float64Array;

  nightCount: number;
  /** Problem nights sorted by their first slot's start (nights without slots last). */
  nightOrder: number[];
  nightHours: Float64Array;
  /** Sorted slots of night n are positions nightFrom[n] .. nightTo[n] - 1. */
  nightFrom: Int32Array;
  nightTo: Int32Array;
  spacingMs: number;
  onePerNight: boolean;
}

function fail(message: string): never {
  throw new Error(`schedule problem: ${message}`);
}

export function compileProblem(problem: ScheduleProblem, searchGridSize: number): CompiledProblem {
  const targetPos = new Map<string, number>();
  problem.targets.forEach((t, i) => {
    if (targetPos.has(t.id)) fail(`target ${t.id} appears twice`);
    if (!(t.priority > 0 && t.kMps > 0 && t.goal > 0)) fail(`target ${t.id} needs priority, kMps and goal > 0`);
    if (t.kind === 'search' && !(t.periodMinDays > 0 && t.periodMaxDays >= t.periodMinDays)) fail(`target ${t.id} needs 0 < periodMinDays <= periodMaxDays`);
    targetPos.set(t.id, i);
  });
  const nightPos = new Map<number, number>();
  problem.nights.forEach((n, i) => {
    if (nightPos.has(n.index)) fail(`night ${n.index} appears twice`);
    nightPos.set(n.index, i);
  });
  for (const s of problem.slots) {
    if (!targetPos.has(s.targetId)) fail(`slot ${s.slotId} names unknown target ${s.targetId}`);
    if (!nightPos.has(s.nightIndex)) fail(`slot ${s.slotId} names unknown night ${s.nightIndex}`);
    if (!(s.durationSec > 0 && s.sigmaEffMps > 0 && Number.isFinite(s.startMs))) fail(`slot ${s.slotId} needs durationSec > 0, sigmaEffMps > 0, a finite startMs`);
    const kind = problem.targets[targetPos.get(s.targetId)!]!.kind;
    if (kind === 'ephemeris' && !(Number.isFinite(s.phase) && (s.phaseErr ?? 0) >= 0)) fail(`slot ${s.slotId} of an ephemeris target needs phase and phaseErr >= 0`);
    if (kind === 'search' && !Number.isFinite(s.midDays)) fail(`slot ${s.slotId} of a search target needs midDays`);
  }

  // Nights in time order of their slots; slots sorted by (night, start, id) so the order is total.
  const firstStart = new Float64Array(problem.nights.length).fill(Infinity);
  for (const s of problem.slots) {
    const n = nightPos.get(s.nightIndex)!;
    firstStart[n] = Math.min(firstStart[n]!, s.startMs);
  }
  const nightOrder = problem.nights.map((_, i) => i).sort((a, b) => firstStart[a]! - firstStart[b]! || problem.nights[a]!.index - problem.nights[b]!.index);
  const rank = new Int32Array(problem.nights.length);
  nightOrder.forEach((n, r) => (rank[n] = r));
  const order = problem.slots.map((_, i) => i);
  const slotRank = (i: number) => rank[nightPos.get(problem.slots[i]!.nightIndex)!]!;
  order.sort((a, b) => slotRank(a) - slotRank(b) || problem.slots[a]!.startMs - problem.slots[b]!.startMs || (problem.slots[a]!.slotId < problem.slots[b]!.slotId ? -1 : 1));

  const T = problem.targets.length;
  const S = order.length;
  const N = problem.nights.length;
  const c: CompiledProblem = {
    problem,
    targetCount: T,
    grids: [],
    priority: Float64Array.from(problem.targets, (t) => t.priority),
    kMps: Float64Array.from(problem.targets, (t) => t.kMps),
    goal: Float64Array.from(problem.targets, (t) => t.goal),
    statsOffset: new Int32Array(T),
    statsLength: 0,
    maxWeight: new Float64Array(T),
    maxAbsSignal: new Float64Array(T),
    targetSlots: [],
    slotCount: S,
    slotSource: Int32Array.from(order),
    slotTarget: new Int32Array(S),
    slotNight: new Int32Array(S),
    startMs: new Float64Array(S),
    endMs: new Float64Array(S),
    hours: new Float64Array(S),
    weight: new Float64Array(S),
    valueA: new Float64Array(S),
    valueB: new Float64Array(S),
    nightCount: N,
    nightOrder,
    nightHours: Float64Array.from(nightOrder, (n) => problem.nights[n]!.hoursAvailable),
    nightFrom: new Int32Array(N),
    nightTo: new Int32Array(N),
    spacingMs: Math.max(0, problem.constraints.minSpacingHours) * 3_600_000,
    onePerNight: problem.constraints.onePerNight,
  };
  const perTarget: number[][] = problem.targets.map(() => []);
  c.nightFrom.fill(S);
  for (let j = 0; j < S; j++) {
    const s = problem.slots[order[j]!]!;
    const t = targetPos.get(s.targetId)!;
    const n = rank[nightPos.get(s.nightIndex)!]!;
    c.slotTarget[j] = t;
    c.slotNight[j] = n;
    c.startMs[j] = s.startMs;
    c.endMs[j] = s.startMs + s.durationSec * 1000;
    c.hours[j] = s.durationSec / 3600;
    // Weighted least squares: a visit weighs 1/sigma^2 (common practice).
    const w = 1 / (s.sigmaEffMps * s.sigmaEffMps);
    c.weight[j] = w;
    c.maxWeight[t] = Math.max(c.maxWeight[t]!, w);
    if (problem.targets[t]!.kind === 'ephemeris') {
      const { m, q } = s.signalMoments ?? signalMoments(s.phase!, s.phaseErr ?? 0);
      c.valueA[j] = m;
      c.valueB[j] = q;
      c.maxAbsSignal[t] = Math.max(c.maxAbsSignal[t]!, Math.abs(m));
    } else {
      c.valueA[j] = s.midDays!;
    }
    perTarget[t]!.push(j);
    c.nightFrom[n] = Math.min(c.nightFrom[n]!, j);
    c.nightTo[n] = j + 1;
  }
  for (let n = 0; n < N; n++) if (c.nightTo[n] === 0) c.nightFrom[n] = 0;
  c.targetSlots = perTarget.map((list) => Int32Array.from(list));

  let offset = 0;
  problem.targets.forEach((t, i) => {
    c.statsOffset[i] = offset;
    if (t.kind === 'ephemeris') {
      c.grids.push(null);
      offset += EPHEMERIS_STATS;
      return;
    }
    const weights = Array.from(c.targetSlots[i]!, (j) => c.weight[j]!).sort((a, b) => a - b);
    const median = weights.length ? weights[weights.length >> 1]! : 1;
    const grid = searchGrid(t.periodMinDays, t.periodMaxDays, t.kMps, searchGridSize, SEARCH_RIDGE_FRACTION * median);
    c.grids.push(grid);
    offset += searchStatsLength(grid);
  });
  c.statsLength = offset;
  return c;
}
