// A plan under construction: which slots are chosen, which nights are open, and each target's
// running sums, so that adding, removing or pricing one visit costs O(1) (ephemeris target) or
// O(period grid) (search target), never a recomputation of the whole plan.
import type { CompiledProblem } from './compile.js';
import { EPHEMERIS_STATS, ephemerisInformation, updateEphemerisStats } from './objective-ephemeris.js';
import { searchLogScore, searchStatsLength, updateSearchStats } from './objective-search.js';
import { goalValue } from './utility.js';

/** Position of the first element of the sorted `list` greater than or equal to `value`. */
function lowerBound(list: number[], value: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (list[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export class PlanState {
  readonly chosen: Uint8Array;
  readonly nightOpen: Uint8Array;
  /** Chosen slots per night and per target, as sorted slot positions (slot order is time order). */
  readonly nightVisits: number[][];
  readonly targetVisits: number[][];
  readonly nightUsedHours: Float64Array;
  readonly stats: Float64Array;
  readonly targetUtility: Float64Array;
  /** Bumped whenever a target's visits change (cached gains of its slots go stale). */
  readonly targetVersion: Int32Array;
  utility = 0;
  hoursUsed = 0;
  openNights = 0;

  constructor(
    readonly c: CompiledProblem,
    /** Total hours of visits allowed (Infinity if no budget). */
    readonly hoursBudget: number,
    readonly overshootWeight: number,
  ) {
    this.chosen = new Uint8Array(c.slotCount);
    this.nightOpen = new Uint8Array(c.nightCount);
    this.nightVisits = Array.from({ length: c.nightCount }, () => []);
    this.targetVisits = Array.from({ length: c.targetCount }, () => []);
    this.nightUsedHours = new Float64Array(c.nightCount);
    this.stats = new Float64Array(c.statsLength);
    this.targetUtility = new Float64Array(c.targetCount);
    this.targetVersion = new Int32Array(c.targetCount);
    for (let t = 0; t < c.targetCount; t++) {
      this.targetUtility[t] = this.targetValue(t, 0, 0);
      this.utility += this.targetUtility[t]!;
    }
  }

  /** (K/sigma_K)/goal of target t, with slot j added (sign 1), removed (-1), or as it is (0). */
  fractionOfGoal(t: number, sign: number, j: number): number {
    const c = this.c;
    const offset = c.statsOffset[t]!;
    const grid = c.grids[t];
    const w = sign === 0 ? 0 : c.weight[j]!;
    const a = sign === 0 ? 0 : c.valueA[j]!;
    if (grid) return Math.exp(searchLogScore(this.stats, offset, grid, sign, w, a)) / c.goal[t]!;
    // Fewer than two visits carry no information on K (the offset absorbs one); exact 0, free of rounding residue.
    if (this.targetVisits[t]!.length + sign < 2) return 0;
    const info = ephemerisInformation(this.stats, offset, sign, w, a, sign === 0 ? 0 : c.valueB[j]!);
    return (c.kMps[t]! * Math.sqrt(info)) / c.goal[t]!;
  }

  /** Utility of target t with slot j added (sign 1), removed (-1), or as it is (0). */
  targetValue(t: number, sign: number, j: number): number {
    return this.c.priority[t]! * goalValue(this.fractionOfGoal(t, sign, j), this.overshootWeight);
  }

  /** Exact change of the total utility if slot j were added. */
  gain(j: number): number {
    const t = this.c.slotTarget[j]!;
    return this.targetValue(t, 1, j) - this.targetUtility[t]!;
  }

  /** Exact change of the total utility if chosen slot j were removed (<= 0). */
  loss(j: number): number {
    const t = this.c.slotTarget[j]!;
    return this.targetValue(t, -1, j) - this.targetUtility[t]!;
  }

  /**
   * Gain used to rank slots in greedy passes. It equals gain(j) except for the first visit of an
   * ephemeris target, which alone carries no information (the offset absorbs it): that visit is
   * credited half the utility of a pair made with an ideal partner (the target's largest weight
   * at the opposite extreme of its signal), so that greedy starts new targets. Likewise a search
   * target's first three visits (offset, sine and cosine need three before the ridge stops
   * dominating): each is credited at least a third of the utility of three visits of its weight
   * spread evenly in phase, where the sine/cosine information is 3w/2 on both axes at every
   * period, so K/sigma_K = K_geo sqrt(3w/2) with K_geo the grid's geometric-mean K.
   */
  rankingGain(j: number): number {
    const c = this.c;
    const t = c.slotTarget[j]!;
    const grid = c.grids[t];
    if (grid) {
      if (this.targetVisits[t]!.length >= 3) return this.gain(j);
      const x = (Math.exp(grid.meanLogK) * Math.sqrt(1.5 * c.weight[j]!)) / c.goal[t]!;
      return Math.max(this.gain(j), (c.priority[t]! * goalValue(x, this.overshootWeight)) / 3);
    }
    if (this.targetVisits[t]!.length > 0) return this.gain(j);
    const w = c.weight[j]!;
    const wp = c.maxWeight[t]!;
    const m = c.valueA[j]!;
    const partner = m >= 0 ? -c.maxAbsSignal[t]! : c.maxAbsSignal[t]!;
    // Two visits: I = w1 w2 / (w1 + w2) (s1 - s2)^2 (the formula of objective-ephemeris.ts with N = 2).
    const info = ((w * wp) / (w + wp)) * (m - partner) * (m - partner);
    const x = (c.kMps[t]! * Math.sqrt(info)) / c.goal[t]!;
    return 0.5 * c.priority[t]! * goalValue(x, this.overshootWeight);
  }

  /** Whether slot j can be added: open night, budgets, no overlap in its night, spacing for its target. */
  canAdd(j: number): boolean {
    const c = this.c;
    if (this.chosen[j]) return false;
    const n = c.slotNight[j]!;
    if (!this.nightOpen[n]) return false;
    const h = c.hours[j]!;
    if (this.hoursUsed + h > this.hoursBudget + 1e-9) return false;
    if (this.nightUsedHours[n]! + h > c.nightHours[n]! + 1e-9) return false;
    const inNight = this.nightVisits[n]!;
    const at = lowerBound(inNight, j);
    if (at > 0 && c.endMs[inNight[at - 1]!]! > c.startMs[j]!) return false;
    if (at < inNight.length && c.startMs[inNight[at]!]! < c.endMs[j]!) return false;
    const mine = this.targetVisits[c.slotTarget[j]!]!;
    const k = lowerBound(mine, j);
    for (const other of [mine[k - 1], mine[k]]) {
      if (other === undefined) continue;
      if (Math.abs(c.startMs[other]! - c.startMs[j]!) < c.spacingMs) return false;
      if (c.onePerNight && c.slotNight[other] === n) return false;
    }
    return true;
  }

  add(j: number): void {
    this.apply(j, 1);
  }

  remove(j: number): void {
    this.apply(j, -1);
  }

  private apply(j: number, sign: 1 | -1): void {
    const c = this.c;
    const t = c.slotTarget[j]!;
    const n = c.slotNight[j]!;
    const inNight = this.nightVisits[n]!;
    const mine = this.targetVisits[t]!;
    if (sign === 1) {
      this.chosen[j] = 1;
      inNight.splice(lowerBound(inNight, j), 0, j);
      mine.splice(lowerBound(mine, j), 0, j);
    } else {
      this.chosen[j] = 0;
      inNight.splice(lowerBound(inNight, j), 1);
      mine.splice(lowerBound(mine, j), 1);
    }
    this.nightUsedHours[n] += sign * c.hours[j]!;
    this.hoursUsed += sign * c.hours[j]!;
    const grid = c.grids[t];
    if (mine.length === 0) {
      // No visits left: clear the sums exactly rather than keep the rounding residue of the removals.
      this.stats.fill(0, c.statsOffset[t]!, c.statsOffset[t]! + (grid ? searchStatsLength(grid) : EPHEMERIS_STATS));
    } else if (grid) updateSearchStats(this.stats, c.statsOffset[t]!, grid, c.weight[j]!, c.valueA[j]!, sign);
    else updateEphemerisStats(this.stats, c.statsOffset[t]!, c.weight[j]!, c.valueA[j]!, c.valueB[j]!, sign);
    const value = this.targetValue(t, 0, 0);
    this.utility += value - this.targetUtility[t]!;
    this.targetUtility[t] = value;
    this.targetVersion[t]++;
  }

  openNight(n: number): void {
    if (!this.nightOpen[n]) this.openNights++;
    this.nightOpen[n] = 1;
  }

  /** Closes night n and removes its visits; returns them (to restore with openNight + add). */
  closeNight(n: number): number[] {
    const removed = [...this.nightVisits[n]!];
    for (const j of removed) this.remove(j);
    if (this.nightOpen[n]) this.openNights--;
    this.nightOpen[n] = 0;
    return removed;
  }

  /** Chosen slot positions in time order. */
  chosenSlots(): number[] {
    return this.nightVisits.flat().sort((a, b) => a - b);
  }
}
