// A plan under construction: which slots are chosen, which nights are open, and each star's
// information (src/rv/information.ts) and search sums, so that adding, removing or pricing one
// visit costs what that star's model costs (O(samples x parameters^2), or O(observed nights^2)
// with correlated activity), plus O(period grid) for a search: never a recomputation of the plan.
import { StarInformation, type InformationVisit } from '../rv/information.js';
import { SlotVisit, type CompiledProblem } from './compile.js';
import { idealCompleteness, MIN_SEARCH_VISITS, searchCompleteness, updateSearchStats } from './objective-search.js';
import { seedInformation, seedSearchStats } from './prior.js';
import { slotCodeHigh, slotCodeLow } from './set-key.js';
import { goalValue, overshootAfterPrior } from './utility.js';

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
  /** Chosen slots per night and per star, as sorted slot positions (slot order is time order). */
  readonly nightVisits: number[][];
  readonly targetVisits: number[][];
  readonly nightUsedHours: Float64Array;
  /** Hours of visit blocks chosen per star (for its maxHours cap). */
  readonly targetHours: Float64Array;
  /** Search running sums. */
  readonly stats: Float64Array;
  /** Per star: its information on its planets' K (null without planets). */
  readonly information: (StarInformation | null)[];
  /** Var(K) of every planet as the plan stands (compiled planet order). */
  readonly kVariance: Float64Array;
  readonly targetUtility: Float64Array;
  /**
   * Per star: the key of its set of visits (set-key.ts), which returns to a former value when the
   * visits do (a night swap tried and undone): a gain priced under the same key is still exact.
   */
  private readonly targetKeyLow: Int32Array;
  private readonly targetKeyHigh: Int32Array;
  /** Per slot: the last gain priced and its star's key then (gainKnown 0: none). */
  private readonly gainValue: Float64Array;
  private readonly gainKeyLow: Int32Array;
  private readonly gainKeyHigh: Int32Array;
  private readonly gainKnown: Uint8Array;
  utility = 0;
  hoursUsed = 0;
  openNights = 0;
  /** Overshoot weight of each planet (compiled order) and of each star's search (utility.ts overshootAfterPrior). */
  readonly planetOvershoot: Float64Array;
  /** (K/sigma_K)/goal of each planet, and completeness/goal of each search, from the prior visits alone. */
  readonly priorPlanetFraction: Float64Array;
  readonly priorSearchFraction: Float64Array;
  readonly searchOvershoot: Float64Array;
  /** Per search star: visits below which each is credited the ideal rate (rankingGain), and that credit. */
  private readonly searchCreditVisits: Int32Array;
  private readonly searchCredit: Float64Array;
  private readonly visit: SlotVisit;
  private readonly trialVariance: Float64Array;

  constructor(
    readonly c: CompiledProblem,
    /** Total hours of visits allowed (Infinity if no budget). */
    readonly hoursBudget: number,
    readonly overshootWeight: number,
  ) {
    this.visit = new SlotVisit(c);
    this.chosen = new Uint8Array(c.slotCount);
    this.nightOpen = new Uint8Array(c.nightCount);
    this.nightVisits = Array.from({ length: c.nightCount }, () => []);
    this.targetVisits = Array.from({ length: c.targetCount }, () => []);
    this.nightUsedHours = new Float64Array(c.nightCount);
    this.targetHours = new Float64Array(c.targetCount);
    this.stats = c.prior.stats.slice();
    this.information = c.models.map((model) => (model ? new StarInformation(model) : null));
    this.kVariance = new Float64Array(c.planetK.length).fill(Infinity);
    this.trialVariance = new Float64Array(Math.max(1, ...c.models.map((m) => m?.planetCount ?? 0)));
    this.information.forEach((info, t) => {
      if (!info || c.prior.count[t] === 0) return;
      seedInformation(info, c.prior, t);
      this.storeVariances(t);
    });
    this.priorPlanetFraction = Float64Array.from(c.planetK, (_, i) => this.planetFractionOfGoal(i));
    this.priorSearchFraction = Float64Array.from(c.grids, (grid, t) => (grid && c.prior.count[t]! > 0 ? this.searchFractionOfGoal(t, 0, 0) : 0));
    this.planetOvershoot = this.priorPlanetFraction.map((x) => overshootAfterPrior(x, overshootWeight));
    this.searchOvershoot = this.priorSearchFraction.map((x) => overshootAfterPrior(x, overshootWeight));
    this.searchCreditVisits = new Int32Array(c.targetCount);
    this.searchCredit = new Float64Array(c.targetCount);
    c.grids.forEach((grid, t) => {
      if (grid) this.setSearchCredit(t);
    });
    this.targetUtility = new Float64Array(c.targetCount);
    this.targetKeyLow = new Int32Array(c.targetCount);
    this.targetKeyHigh = new Int32Array(c.targetCount);
    this.gainValue = new Float64Array(c.slotCount);
    this.gainKeyLow = new Int32Array(c.slotCount);
    this.gainKeyHigh = new Int32Array(c.slotCount);
    this.gainKnown = new Uint8Array(c.slotCount);
    for (let t = 0; t < c.targetCount; t++) {
      this.targetUtility[t] = this.targetValue(t, 0, 0);
      this.utility += this.targetUtility[t]!;
    }
  }

  /** The information module's view of slot j (one reused object whose only field is the slot). */
  private visitOf(j: number): InformationVisit {
    this.visit.slot = j;
    return this.visit;
  }

  /** (K/sigma_K)/goal of planet i (compiled order) for a K variance. */
  private planetFraction(i: number, variance: number): number {
    return variance === Infinity ? 0 : this.c.planetK[i]! / Math.sqrt(variance) / this.c.planetGoalSignificance[i]!;
  }

  /** (K/sigma_K)/goal of planet i as the plan stands. */
  planetFractionOfGoal(i: number): number {
    return this.planetFraction(i, this.kVariance[i]!);
  }

  /** Completeness of star t's search with slot j added (sign 1), removed (-1), or as it is (0). */
  searchCompleteness(t: number, sign: number, j: number): number {
    const c = this.c;
    if (sign === 0) return searchCompleteness(this.stats, c.statsOffset[t]!, c.grids[t]!);
    return searchCompleteness(this.stats, c.statsOffset[t]!, c.grids[t]!, sign, c.weight[j]!, c.midBjdTdb[j]!);
  }

  /** Completeness/goal of star t's search with slot j added (sign 1), removed (-1), or as it is (0). */
  searchFractionOfGoal(t: number, sign: number, j: number): number {
    return this.searchCompleteness(t, sign, j) / this.c.searchGoalCompleteness[t]!;
  }

  /**
   * The credit of a search's first visits: completeness rises slowly over its first visits (the
   * threshold falls as they add up), so each visit while the star has fewer than n0 is credited
   * U(n0) / n0, U(n) the utility of n ideal visits of the star's median weight (objective-search.ts
   * idealCompleteness) and n0 the count with the best utility per visit, at most the star's slots.
   */
  private setSearchCredit(t: number): void {
    const c = this.c;
    const grid = c.grids[t]!;
    let best = 0;
    let bestN = 0;
    // No more visits than the star's slots, its cap and (one a night) the nights it can have allow.
    const time = c.problem.time;
    const nights = c.onePerNight ? (time.mode === 'choose-nights' ? time.nights + c.nightGranted.reduce((x, y) => x + y, 0) : c.nightCount) : Infinity;
    const most = Math.min(4 * MIN_SEARCH_VISITS + 40, c.prior.count[t]! + Math.min(c.targetSlots[t]!.length, c.maxVisits[t]!, nights * c.visitsPerNight[t]!));
    for (let n = MIN_SEARCH_VISITS; n <= most; n++) {
      const x = idealCompleteness(grid, n, c.searchMedianWeight[t]!) / c.searchGoalCompleteness[t]!;
      const rate = (c.searchPriority[t]! * goalValue(x, this.searchOvershoot[t]!)) / n;
      if (rate > best) {
        best = rate;
        bestN = n;
      }
    }
    this.searchCreditVisits[t] = bestN;
    this.searchCredit[t] = best;
  }

  /** Utility of star t with slot j added (sign 1), removed (-1), or as it is (0). */
  targetValue(t: number, sign: number, j: number): number {
    const c = this.c;
    let value = 0;
    const info = this.information[t];
    if (info) {
      const from = c.planetFrom[t]!;
      if (sign !== 0) info.variances(this.trialVariance, this.visitOf(j), sign as 1 | -1);
      for (let i = 0; i < info.planetCount; i++) {
        const variance = sign === 0 ? this.kVariance[from + i]! : this.trialVariance[i]!;
        value += c.planetPriority[from + i]! * goalValue(this.planetFraction(from + i, variance), this.planetOvershoot[from + i]!);
      }
    }
    if (c.grids[t]) value += c.searchPriority[t]! * goalValue(this.searchFractionOfGoal(t, sign, j), this.searchOvershoot[t]!);
    return value;
  }

  /** Exact change of the total utility if slot j were added. */
  gain(j: number): number {
    const t = this.c.slotTarget[j]!;
    const low = this.targetKeyLow[t]!;
    const high = this.targetKeyHigh[t]!;
    if (this.gainKnown[j] && this.gainKeyLow[j] === low && this.gainKeyHigh[j] === high) return this.gainValue[j]!;
    const gain = this.targetValue(t, 1, j) - this.targetUtility[t]!;
    this.gainValue[j] = gain;
    this.gainKeyLow[j] = low;
    this.gainKeyHigh[j] = high;
    this.gainKnown[j] = 1;
    return gain;
  }

  /** Exact change of the total utility if chosen slot j were removed (<= 0). */
  loss(j: number): number {
    const t = this.c.slotTarget[j]!;
    return this.targetValue(t, -1, j) - this.targetUtility[t]!;
  }

  /**
   * Gain used to rank slots in greedy passes. It equals gain(j) except for a star's first visits,
   * which alone carry little or nothing: while a star's visits do not yet determine its K's
   * (one visit, which the offset absorbs; two for a two-planet star), each visit is credited
   * half the utility of a pair made with an ideal partner (the star's
   * largest weight at the opposite extreme of each planet's signal; two visits with K alone free
   * give I = w1 w2 / (w1 + w2) (s1 - s2)^2), so that greedy starts new stars. Likewise a search's
   * first visits (setSearchCredit).
   */
  rankingGain(j: number): number {
    const c = this.c;
    const t = c.slotTarget[j]!;
    const visits = this.targetVisits[t]!.length + c.prior.count[t]!;
    const gain = this.gain(j);
    let credit = 0;
    if (c.grids[t] && visits < this.searchCreditVisits[t]!) credit += this.searchCredit[t]!;
    // Until the star's visits determine its K's (one visit per planet beyond the offset), each is credited as half a pair.
    if (this.information[t] && this.kVariance[c.planetFrom[t]!] === Infinity) {
      const w = c.weight[j]!;
      const wp = c.maxWeight[t]!;
      const model = c.models[t]!;
      for (let i = 0; i < model.planetCount; i++) {
        const at = c.planetFrom[t]! + i;
        const m = c.rows[c.rowOffset[j]! + model.kIndex[i]!]!;
        const partner = m >= 0 ? -c.planetMaxAbsSignal[at]! : c.planetMaxAbsSignal[at]!;
        const info = ((w * wp) / (w + wp)) * (m - partner) * (m - partner);
        credit += 0.5 * c.planetPriority[at]! * goalValue((c.planetK[at]! * Math.sqrt(info)) / c.planetGoalSignificance[at]!, this.planetOvershoot[at]!);
      }
    }
    return Math.max(gain, credit);
  }

  /** Whether slot j can be added: open night, budgets, its star's caps, no overlap in its night, spacing and visits a night for its target. */
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
    const t = c.slotTarget[j]!;
    const mine = this.targetVisits[t]!;
    if (mine.length >= c.maxVisits[t]! || this.targetHours[t]! + h > c.maxHours[t]! + 1e-9) return false;
    const k = lowerBound(mine, j);
    const start = c.startMs[j]!;
    // With onePerNight the star's visits of its calendar night are contiguous around k (slots sorted
    // by night, then start; the halves of a night follow each other): each is held to the same-night spacing and counted; the nearest visit of
    // another night on either side to minSpacing (the next ones are further still).
    const day = c.slotDay[j]!;
    let sameNight = c.onePerNight && c.prior.inNight.size > 0 ? (c.prior.inNight.get(t * c.nightCount + day) ?? 0) : 0;
    let below = k - 1;
    let above = k;
    if (c.onePerNight) {
      for (; below >= 0 && c.slotDay[mine[below]!] === day; below--) {
        if (Math.abs(c.startMs[mine[below]!]! - start) < c.sameNightSpacingMs) return false;
        sameNight++;
      }
    }
    if (below >= 0 && Math.abs(c.startMs[mine[below]!]! - start) < c.spacingMs) return false;
    if (c.onePerNight) {
      for (; above < mine.length && c.slotDay[mine[above]!] === day; above++) {
        if (Math.abs(c.startMs[mine[above]!]! - start) < c.sameNightSpacingMs) return false;
        sameNight++;
      }
    }
    if (above < mine.length && Math.abs(c.startMs[mine[above]!]! - start) < c.spacingMs) return false;
    return !c.onePerNight || sameNight < c.visitsPerNight[t]!;
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
    this.targetHours[t] += sign * c.hours[j]!;
    const grid = c.grids[t];
    if (grid) {
      // No visits left: back to the prior's sums exactly rather than keep the rounding residue of the removals.
      if (mine.length === 0) seedSearchStats(this.stats, c, c.prior, t);
      else updateSearchStats(this.stats, c.statsOffset[t]!, grid, c.weight[j]!, c.midBjdTdb[j]!, sign);
    }
    const info = this.information[t];
    if (info) {
      info.apply(this.visitOf(j), sign);
      this.storeVariances(t);
    }
    const value = this.targetValue(t, 0, 0);
    this.utility += value - this.targetUtility[t]!;
    this.targetUtility[t] = value;
    this.targetKeyLow[t] ^= slotCodeLow(j);
    this.targetKeyHigh[t] ^= slotCodeHigh(j);
  }

  /** kVariance of star t's planets from its information as it stands. */
  private storeVariances(t: number): void {
    const info = this.information[t]!;
    info.variances(this.trialVariance);
    for (let i = 0; i < info.planetCount; i++) this.kVariance[this.c.planetFrom[t]! + i] = this.trialVariance[i]!;
  }

  /** Opens night n; `openNights` counts the nights chosen, not the granted ones. */
  openNight(n: number): void {
    if (!this.nightOpen[n] && !this.c.nightGranted[n]) this.openNights++;
    this.nightOpen[n] = 1;
  }

  /** Closes night n and removes its visits; returns them (to restore with openNight + add). */
  closeNight(n: number): number[] {
    if (this.c.nightGranted[n]) throw new Error('schedule: a granted night cannot be closed');
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
