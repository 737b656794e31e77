// The problem in flat typed arrays: slots sorted by (night, start), per-night and per-star slot
// lists, each slot's design rows for its star's information model, and where each search keeps
// its running sums. Built once per optimisation.
import { designRow, type StarModel } from '../rv/information-model.js';
import type { InformationVisit } from '../rv/information.js';
import { searchGrid, searchStatsLength, type SearchGrid } from './objective-search.js';
import { extent } from '../extent.js';
import { compilePrior, type CompiledPrior } from './prior.js';
import type { ScheduleProblem, ScheduleTarget } from './types.js';

/** Ridge of a search target's information matrix, as a fraction of its median visit weight (objective-search.ts). */
const SEARCH_RIDGE_FRACTION = 1e-3;

export interface CompiledProblem {
  problem: ScheduleProblem;
  /** Stars. */
  targetCount: number;
  models: (StarModel | null)[];
  /** Planets of star t are positions planetFrom[t] .. planetFrom[t + 1] - 1 of the planet arrays. */
  planetFrom: Int32Array;
  planetPriority: Float64Array;
  planetK: Float64Array;
  planetGoalSignificance: Float64Array;
  /** Per planet, for the greedy's first-visit estimate: the largest |s| among its star's slots. */
  planetMaxAbsSignal: Float64Array;
  /** Per star: search grid, or null. */
  grids: (SearchGrid | null)[];
  searchPriority: Float64Array;
  searchK: Float64Array;
  /** Per star: the completeness its search aims at. */
  searchGoalCompleteness: Float64Array;
  statsOffset: Int32Array;
  statsLength: number;
  /** Per star with a search: the median weight of its slots. */
  searchMedianWeight: Float64Array;
  /** Per star: largest visit weight among its slots. */
  maxWeight: Float64Array;
  /** Per star: its slot positions in time order. */
  targetSlots: Int32Array[];

  slotCount: number;
  /** Position in problem.slots of each sorted slot. */
  slotSource: Int32Array;
  slotTarget: Int32Array;
  /** Position of the slot's night in `nightOrder`. */
  slotNight: Int32Array;
  /** The slot's calendar night (nightDay of its night). */
  slotDay: Int32Array;
  startMs: Float64Array;
  endMs: Float64Array;
  hours: Float64Array;
  weight: Float64Array;
  midBjdTdb: Float64Array;
  /** Slot j's design rows (samples x parameters of its star's model) start at rows[rowOffset[j]]; -1 without a model. */
  rowOffset: Float64Array;
  rows: Float64Array;
  /** The nominal signal s of the star's first planet at the slot (0 without planets). */
  signal: Float64Array;

  nightCount: number;
  /** Problem nights sorted by their first slot's start (nights without slots last). */
  nightOrder: number[];
  nightHours: Float64Array;
  /** Per night position: its calendar night, 0 .. dayCount - 1 in time order (types.ts ScheduleNight.calendarNight). */
  nightDay: Int32Array;
  dayCount: number;
  /** Per night position: 1 for a granted night (types.ts ScheduleNight.granted). */
  nightGranted: Uint8Array;
  /** Per night position: the night's middle (midBjdTdb scale), where nightly activity is evaluated. */
  nightMidBjdTdb: Float64Array;
  /** Sorted slots of night n are positions nightFrom[n] .. nightTo[n] - 1. */
  nightFrom: Int32Array;
  nightTo: Int32Array;
  spacingMs: number;
  onePerNight: boolean;
  /** With onePerNight: spacing of one star's visits within a night, and per star how many one night holds (prior visits on that date included). */
  sameNightSpacingMs: number;
  visitsPerNight: Int32Array;
  /** Per target: the most visits and hours the plan may give it (Infinity without a cap). */
  maxVisits: Float64Array;
  maxHours: Float64Array;
  /** Visits already made (prior.ts). */
  prior: CompiledPrior;
}

function fail(message: string): never {
  throw new Error(`schedule problem: ${message}`);
}

function checkTarget(t: ScheduleTarget): void {
  const positive = (x: { priority: number; kMps: number }) => x.priority > 0 && x.kMps > 0;
  if (t.planets.length === 0 && !t.search) fail(`star ${t.id} has neither planets nor a search`);
  if (t.planets.length > 0 && t.model?.planetCount !== t.planets.length) fail(`star ${t.id} needs a model with one planet per planet`);
  for (const planet of t.planets) if (!(positive(planet) && planet.goalSignificance > 0)) fail(`planet ${planet.id} needs priority, kMps and goal > 0`);
  const search = t.search;
  const goal = search?.goalCompleteness ?? 0;
  if (search && !(positive(search) && goal > 0 && goal <= 1 && search.periodMinDays > 0 && search.periodMaxDays >= search.periodMinDays))
    fail(`search ${search.id} needs priority, kMps > 0, a completeness goal in (0, 1] and 0 < periodMinDays <= periodMaxDays`);
}

/** Calendar night of each night position, numbered in the order they first appear. */
function calendarNights(problem: ScheduleProblem, nightOrder: number[]): { nightDay: Int32Array; dayCount: number } {
  const ids = new Map<number, number>();
  const nightDay = Int32Array.from(nightOrder, (n) => {
    const key = problem.nights[n]!.calendarNight ?? problem.nights[n]!.index;
    if (!ids.has(key)) ids.set(key, ids.size);
    return ids.get(key)!;
  });
  return { nightDay, dayCount: ids.size };
}

export function compileProblem(problem: ScheduleProblem): CompiledProblem {
  const targetPos = new Map<string, number>();
  problem.targets.forEach((t, i) => {
    if (targetPos.has(t.id)) fail(`star ${t.id} appears twice`);
    checkTarget(t);
    targetPos.set(t.id, i);
  });
  const nightPos = new Map<number, number>();
  problem.nights.forEach((n, i) => {
    if (nightPos.has(n.index)) fail(`night ${n.index} appears twice`);
    nightPos.set(n.index, i);
  });
  for (const s of problem.slots) {
    if (!targetPos.has(s.targetId)) fail(`slot ${s.slotId} names unknown star ${s.targetId}`);
    if (!nightPos.has(s.nightIndex)) fail(`slot ${s.slotId} names unknown night ${s.nightIndex}`);
    if (!(s.durationSec > 0 && s.whiteSigmaMps > 0 && Number.isFinite(s.startMs) && Number.isFinite(s.midBjdTdb)))
      fail(`slot ${s.slotId} needs durationSec > 0, whiteSigmaMps > 0, finite startMs and midBjdTdb`);
  }

  // Nights in time order of their slots; slots sorted by (night, start, id) so the order is total.
  const firstStart = new Float64Array(problem.nights.length).fill(Infinity);
  const midSum = new Float64Array(problem.nights.length);
  const midCount = new Float64Array(problem.nights.length);
  for (const s of problem.slots) {
    const n = nightPos.get(s.nightIndex)!;
    firstStart[n] = Math.min(firstStart[n]!, s.startMs);
    midSum[n] += s.midBjdTdb;
    midCount[n]++;
  }
  const nightOrder = problem.nights.map((_, i) => i).sort((a, b) => firstStart[a]! - firstStart[b]! || problem.nights[a]!.index - problem.nights[b]!.index);
  const rank = new Int32Array(problem.nights.length);
  nightOrder.forEach((n, r) => {
    rank[n] = r;
  });
  const order = problem.slots.map((_, i) => i);
  const slotRank = (i: number) => rank[nightPos.get(problem.slots[i]!.nightIndex)!]!;
  order.sort(
    (a, b) =>
      slotRank(a) - slotRank(b) || problem.slots[a]!.startMs - problem.slots[b]!.startMs || (problem.slots[a]!.slotId < problem.slots[b]!.slotId ? -1 : 1),
  );

  const T = problem.targets.length;
  const S = order.length;
  const N = problem.nights.length;
  const planetFrom = new Int32Array(T + 1);
  problem.targets.forEach((t, i) => {
    planetFrom[i + 1] = planetFrom[i]! + t.planets.length;
  });
  const planets = problem.targets.flatMap((t) => t.planets);
  const models = problem.targets.map((t) => (t.planets.length > 0 ? t.model! : null));
  const rowLength = (t: number) => (models[t] ? models[t]!.samples.length * models[t]!.paramCount : 0);
  let rowsTotal = 0;
  for (const s of problem.slots) rowsTotal += rowLength(targetPos.get(s.targetId)!);
  const c: CompiledProblem = {
    problem,
    targetCount: T,
    models,
    planetFrom,
    planetPriority: Float64Array.from(planets, (p) => p.priority),
    planetK: Float64Array.from(planets, (p) => p.kMps),
    planetGoalSignificance: Float64Array.from(planets, (p) => p.goalSignificance),
    planetMaxAbsSignal: new Float64Array(planets.length),
    grids: [],
    searchPriority: Float64Array.from(problem.targets, (t) => t.search?.priority ?? 0),
    searchK: Float64Array.from(problem.targets, (t) => t.search?.kMps ?? 0),
    searchGoalCompleteness: Float64Array.from(problem.targets, (t) => t.search?.goalCompleteness ?? 1),
    statsOffset: new Int32Array(T),
    statsLength: 0,
    searchMedianWeight: new Float64Array(T),
    maxWeight: new Float64Array(T),
    targetSlots: [],
    slotCount: S,
    slotSource: Int32Array.from(order),
    slotTarget: new Int32Array(S),
    slotNight: new Int32Array(S),
    slotDay: new Int32Array(S),
    startMs: new Float64Array(S),
    endMs: new Float64Array(S),
    hours: new Float64Array(S),
    weight: new Float64Array(S),
    midBjdTdb: new Float64Array(S),
    rowOffset: new Float64Array(S),
    rows: new Float64Array(rowsTotal),
    signal: new Float64Array(S),
    nightCount: N,
    nightOrder,
    nightHours: Float64Array.from(nightOrder, (n) => problem.nights[n]!.hoursAvailable),
    ...calendarNights(problem, nightOrder),
    nightGranted: Uint8Array.from(nightOrder, (n) => (problem.nights[n]!.granted ? 1 : 0)),
    nightMidBjdTdb: Float64Array.from(nightOrder, (n) => problem.nights[n]!.midBjdTdb ?? (midCount[n]! > 0 ? midSum[n]! / midCount[n]! : 0)),
    nightFrom: new Int32Array(N),
    nightTo: new Int32Array(N),
    spacingMs: Math.max(0, problem.constraints.minSpacingHours) * 3_600_000,
    onePerNight: problem.constraints.onePerNight,
    sameNightSpacingMs: Math.max(0, problem.constraints.sameNightSpacingHours ?? 0) * 3_600_000,
    visitsPerNight: Int32Array.from(problem.targets, (t) => t.visitsPerNight ?? 1),
    maxVisits: Float64Array.from(problem.targets, (t) => t.maxVisits ?? Infinity),
    maxHours: Float64Array.from(problem.targets, (t) => t.maxHours ?? Infinity),
    prior: { visits: [], stats: new Float64Array(0), count: new Int32Array(T), weightSum: new Float64Array(T), inNight: new Map() },
  };
  const perTarget: number[][] = problem.targets.map(() => []);
  c.nightFrom.fill(S);
  let rowAt = 0;
  for (let j = 0; j < S; j++) {
    const s = problem.slots[order[j]!]!;
    const t = targetPos.get(s.targetId)!;
    const n = rank[nightPos.get(s.nightIndex)!]!;
    c.slotTarget[j] = t;
    c.slotNight[j] = n;
    c.slotDay[j] = c.nightDay[n]!;
    c.startMs[j] = s.startMs;
    c.endMs[j] = s.startMs + s.durationSec * 1000;
    c.hours[j] = s.durationSec / 3600;
    c.midBjdTdb[j] = s.midBjdTdb;
    // Weighted least squares: a visit weighs 1/sigma^2 (common practice).
    const w = 1 / (s.whiteSigmaMps * s.whiteSigmaMps);
    c.weight[j] = w;
    c.maxWeight[t] = Math.max(c.maxWeight[t]!, w);
    const model = models[t];
    if (model) {
      c.rowOffset[j] = rowAt;
      const p = model.paramCount;
      model.samples.forEach((sample, k) => {
        designRow(model, sample, s.midBjdTdb, c.rows, rowAt + k * p);
      });
      // Sample 0 is the nominal ephemeris (information-model.ts).
      for (let i = 0; i < model.planetCount; i++) {
        const signal = c.rows[rowAt + model.kIndex[i]!]!;
        const at = planetFrom[t]! + i;
        c.planetMaxAbsSignal[at] = Math.max(c.planetMaxAbsSignal[at]!, Math.abs(signal));
        if (i === 0) c.signal[j] = signal;
      }
      rowAt += rowLength(t);
    } else c.rowOffset[j] = -1;
    perTarget[t]!.push(j);
    c.nightFrom[n] = Math.min(c.nightFrom[n]!, j);
    c.nightTo[n] = j + 1;
  }
  for (let n = 0; n < N; n++) if (c.nightTo[n] === 0) c.nightFrom[n] = 0;
  c.targetSlots = perTarget.map((list) => Int32Array.from(list));

  let offset = 0;
  problem.targets.forEach((t, i) => {
    c.statsOffset[i] = offset;
    if (!t.search) {
      c.grids.push(null);
      return;
    }
    const weights = Array.from(c.targetSlots[i]!, (j) => c.weight[j]!).sort((a, b) => a - b);
    const median = weights.length ? weights[weights.length >> 1]! : 1;
    c.searchMedianWeight[i] = median;
    // The span the star's visits can cover: its candidate slots and its prior visits.
    const times = [
      ...Array.from(c.targetSlots[i]!, (j) => c.midBjdTdb[j]!),
      ...(problem.prior ?? []).filter((v) => v.targetId === t.id).map((v) => v.midBjdTdb),
    ];
    const { min, max } = times.length ? extent(times) : { min: 0, max: 0 };
    const grid = searchGrid({
      periodMinDays: t.search.periodMinDays,
      periodMaxDays: t.search.periodMaxDays,
      kMpsAtMin: t.search.kMps,
      eps: SEARCH_RIDGE_FRACTION * median,
      fromDays: min,
      toDays: max,
    });
    c.grids.push(grid);
    offset += searchStatsLength(grid);
  });
  c.statsLength = offset;
  c.prior = compilePrior(c);
  return c;
}

/**
 * Slot `slot` of a compiled problem as an InformationVisit. Its values are read from the compiled
 * arrays, so pointing it at another slot writes one integer: writing doubles into a reused
 * object's fields boxes them anew each time, millions of times in one optimisation.
 */
export class SlotVisit implements InformationVisit {
  slot = 0;
  constructor(private readonly c: CompiledProblem) {}
  get rows(): Float64Array {
    return this.c.rows;
  }
  get offset(): number {
    return this.c.rowOffset[this.slot]!;
  }
  get weight(): number {
    return this.c.weight[this.slot]!;
  }
  get night(): number {
    return this.c.slotDay[this.slot]!;
  }
  get nightBjdTdb(): number {
    return this.c.nightMidBjdTdb[this.c.slotNight[this.slot]!]!;
  }
}
