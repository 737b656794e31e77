// One star at a time, what a chosen set of its visits reaches: K/sigma_K of each of its planets
// (its information model, src/rv/information.ts) and its search's completeness (objective-search.ts),
// the visits already made always included (prior.ts). The weather replay (weather.ts) and the
// sizing of the request from need (need.ts) share it, so both count exactly what the optimiser does.
import { StarInformation } from '../rv/information.js';
import { type CompiledProblem, SlotVisit } from './compile.js';
import { searchCompleteness, searchStatsLength, updateSearchStats } from './objective-search.js';
import { seedInformation, seedSearchStats } from './prior.js';

export class StarOutcomes {
  /** Outcome ids: the planets in compiled order, then one per search in star order. */
  readonly ids: string[];
  /** Per outcome: its goal and priority. */
  readonly goal: Float64Array;
  readonly priority: Float64Array;
  /** Per star: the outcome position of its search, or -1. */
  readonly searchOutcome: Int32Array;
  /** Per star: the outcome positions of its planets, then of its search. */
  readonly ofStar: number[][];
  /** Per outcome: its star. */
  readonly starOfOutcome: Int32Array;
  private readonly information: (StarInformation | null)[];
  private readonly stats: Float64Array;
  private readonly visit: SlotVisit;
  private readonly variance: Float64Array;
  private star = -1;

  constructor(private readonly c: CompiledProblem) {
    const problem = c.problem;
    this.ids = problem.targets.flatMap((t) => t.planets.map((p) => p.id));
    this.searchOutcome = new Int32Array(c.targetCount).fill(-1);
    problem.targets.forEach((t, i) => {
      if (t.search) this.searchOutcome[i] = this.ids.push(t.search.id) - 1;
    });
    this.goal = new Float64Array(this.ids.length);
    this.priority = new Float64Array(this.ids.length);
    this.goal.set(c.planetGoalSignificance);
    this.priority.set(c.planetPriority);
    this.searchOutcome.forEach((at, t) => {
      if (at < 0) return;
      this.goal[at] = c.searchGoalCompleteness[t]!;
      this.priority[at] = c.searchPriority[t]!;
    });
    this.ofStar = Array.from({ length: c.targetCount }, (_, t) => {
      const planets = Array.from({ length: c.planetFrom[t + 1]! - c.planetFrom[t]! }, (_, i) => c.planetFrom[t]! + i);
      return this.searchOutcome[t]! >= 0 ? [...planets, this.searchOutcome[t]!] : planets;
    });
    this.starOfOutcome = new Int32Array(this.ids.length);
    this.ofStar.forEach((positions, t) => {
      for (const at of positions) this.starOfOutcome[at] = t;
    });
    this.information = c.models.map((model) => (model ? new StarInformation(model) : null));
    this.stats = new Float64Array(Math.max(1, ...c.grids.map((g) => (g ? searchStatsLength(g) : 0))));
    this.visit = new SlotVisit(c);
    this.variance = new Float64Array(Math.max(1, ...c.models.map((m) => m?.planetCount ?? 0)));
  }

  /** Starts star t from its visits already made alone. */
  start(t: number): void {
    this.star = t;
    seedSearchStats(this.stats, this.c, this.c.prior, t, 0);
    const info = this.information[t];
    if (info) {
      info.clear();
      seedInformation(info, this.c.prior, t);
    }
  }

  /** Adds slot j (a slot of the started star). */
  add(j: number): void {
    const c = this.c;
    const grid = c.grids[this.star];
    if (grid) updateSearchStats(this.stats, 0, grid, c.weight[j]!, c.midBjdTdb[j]!, 1);
    const info = this.information[this.star];
    if (info) {
      this.visit.slot = j;
      info.apply(this.visit, 1);
    }
  }

  /**
   * Writes the started star's outcomes into out (at their outcome positions): K/sigma_K of each
   * planet (0 while undetermined) and the search's completeness, as the visits stand or with added slot
   * `without` left out (its removal is priced, never applied).
   */
  values(out: Float64Array, without = -1): void {
    const c = this.c;
    const t = this.star;
    const info = this.information[t];
    if (info) {
      if (without >= 0) this.visit.slot = without;
      info.variances(this.variance, without >= 0 ? this.visit : undefined, -1);
      const from = c.planetFrom[t]!;
      for (let i = 0; i < info.planetCount; i++) {
        const v = this.variance[i]!;
        out[from + i] = v === Infinity ? 0 : c.planetK[from + i]! / Math.sqrt(v);
      }
    }
    const grid = c.grids[t];
    if (grid) {
      out[this.searchOutcome[t]!] =
        without >= 0 ? searchCompleteness(this.stats, 0, grid, -1, c.weight[without]!, c.midBjdTdb[without]!) : searchCompleteness(this.stats, 0, grid);
    }
  }
}
