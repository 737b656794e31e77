// Visits already made (ScheduleProblem.prior) as the plan state and the weather replay see them:
// per star, fixed information visits and the search sums they start from. A prior visit on the
// date of a problem night shares that night's key (and so its nightly noise) with new visits of
// the night; every other date gets a key of its own after the problem's nights.
import { designRows, type StarModel } from '../rv/information-model.js';
import type { InformationVisit, StarInformation } from '../rv/information.js';
import type { CompiledProblem } from './compile.js';
import { searchStatsLength, updateSearchStats } from './objective-search.js';

export interface CompiledPrior {
  /** Per star: its prior visits for the information model (empty without a model). */
  visits: InformationVisit[][];
  /** Search sums of the prior visits alone, laid out like the plan's (statsOffset per star). */
  stats: Float64Array;
  /** Per star: number of prior visits and the sum of their weights. */
  count: Int32Array;
  weightSum: Float64Array;
  /** Prior visits of star t on the date of calendar night d, keyed t * nightCount + d (counted against visitsPerNight). */
  inNight: Map<number, number>;
}

export function compilePrior(c: CompiledProblem): CompiledPrior {
  const { problem } = c;
  const prior = problem.prior ?? [];
  const targetPos = new Map(problem.targets.map((t, i) => [t.id, i]));
  // Night keys: the calendar night of a problem night with that date, else one past them.
  const problemKey = new Map<string, number>();
  const dayMid = new Float64Array(c.nightCount);
  c.nightOrder.forEach((n, position) => {
    problemKey.set(problem.nights[n]!.localDate, c.nightDay[position]!);
    dayMid[c.nightDay[position]!] = c.nightMidBjdTdb[position]!;
  });
  const otherNights = new Map<string, { key: number; sumDays: number; count: number }>();
  for (const v of prior) {
    if (problemKey.has(v.localDate)) continue;
    const night = otherNights.get(v.localDate) ?? { key: c.nightCount + otherNights.size, sumDays: 0, count: 0 };
    night.sumDays += v.nightMidBjdTdb ?? v.midBjdTdb;
    night.count++;
    otherNights.set(v.localDate, night);
  }
  const out: CompiledPrior = {
    visits: problem.targets.map(() => []),
    stats: new Float64Array(c.statsLength),
    count: new Int32Array(c.targetCount),
    weightSum: new Float64Array(c.targetCount),
    inNight: new Map(),
  };
  for (const v of prior) {
    const t = targetPos.get(v.targetId);
    if (t === undefined) throw new Error(`schedule problem: prior visit names unknown star ${v.targetId}`);
    if (!(v.whiteSigmaMps > 0 && Number.isFinite(v.midBjdTdb)))
      throw new Error(`schedule problem: prior visit of ${v.targetId} needs whiteSigmaMps > 0 and a finite midBjdTdb`);
    // Weighted least squares: a visit weighs 1/sigma^2 (common practice).
    const weight = 1 / (v.whiteSigmaMps * v.whiteSigmaMps);
    out.count[t]++;
    out.weightSum[t] += weight;
    const position = problemKey.get(v.localDate);
    if (position !== undefined) out.inNight.set(t * c.nightCount + position, (out.inNight.get(t * c.nightCount + position) ?? 0) + 1);
    const grid = c.grids[t];
    if (grid) updateSearchStats(out.stats, c.statsOffset[t]!, grid, weight, v.midBjdTdb, 1);
    const model = c.models[t];
    if (!model) continue;
    const other = otherNights.get(v.localDate);
    const night = position ?? other!.key;
    const nightBjdTdb = position !== undefined ? dayMid[position]! : other!.sumDays / other!.count;
    const rows = designRows(model, v.midBjdTdb);
    if (v.phaseInPrior) keepOffsetAndK(rows, model);
    out.visits[t]!.push({ rows, offset: 0, weight, night, nightBjdTdb });
  }
  return out;
}

/** Zeroes every column of a visit's design rows but the offset's (column 0) and the K's. */
export function keepOffsetAndK(rows: Float64Array, model: StarModel): void {
  const keep = new Set([0, ...model.kIndex]);
  for (let at = 0; at < rows.length; at += model.paramCount) {
    for (let col = 0; col < model.paramCount; col++) if (!keep.has(col)) rows[at + col] = 0;
  }
}

/** Star t's prior visits into a fresh (or cleared) information accumulator. */
export function seedInformation(info: StarInformation, prior: CompiledPrior, t: number): void {
  for (const v of prior.visits[t]!) info.apply(v, 1);
}

/** Star t's search sums reset to those of its prior visits alone. */
export function seedSearchStats(stats: Float64Array, c: CompiledProblem, prior: CompiledPrior, t: number, at = c.statsOffset[t]!): void {
  const grid = c.grids[t];
  if (!grid) return;
  const from = c.statsOffset[t]!;
  stats.set(prior.stats.subarray(from, from + searchStatsLength(grid)), at);
}
