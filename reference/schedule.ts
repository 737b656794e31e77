// Slow reference implementations for tests and the bench: the utility of a set of slots computed
// from scratch (each star's information from a fresh accumulator, 3x3 determinants by elimination), a feasibility check written
// straight from the constraints, and exhaustive search for the best schedule of a small problem.
import { compileProblem } from '../src/schedule/compile.js';
import type { SearchGrid } from '../src/schedule/objective-search.js';
import { referenceCompleteness } from './search-completeness.js';
import { informationVisits, kVariances } from '../src/rv/information.js';
import type { CandidateSlot, PriorVisit, ScheduleProblem } from '../src/schedule/types.js';
import { goalValue, overshootAfterPrior } from '../src/schedule/utility.js';

export interface ReferenceSettings {
  overshootWeight: number;
}

/** K/sigma_K of each planet and completeness of each search for the given visits, from scratch, in the order of ScheduleResult.targets. */
export function referenceKOverSigmaK(problem: ScheduleProblem, visits: CandidateSlot[]): number[] {
  return kOverSigmaKOnGrids(problem, visits, compileProblem(problem).grids).map((r) => r.ratio);
}

interface Ratio {
  /** K/sigma_K, or a search's completeness. */
  ratio: number;
  /** Its goal. */
  goalSignificance: number;
  priority: number;
}

function kOverSigmaKOnGrids(problem: ScheduleProblem, visits: CandidateSlot[], grids: (SearchGrid | null)[]): Ratio[] {
  const ratios = targetRatios(problem, grids);
  return problem.targets.flatMap((target, t) =>
    ratios(
      t,
      visits.filter((v) => v.targetId === target.id),
    ),
  );
}

/**
 * The ratios of target t (its planets' K/σ_K, then its search's) for its visits `own` (in the
 * order given), from scratch: what depends on the problem alone is found once.
 */
function targetRatios(problem: ScheduleProblem, grids: (SearchGrid | null)[]): (t: number, own: CandidateSlot[]) => Ratio[] {
  const nightMid = nightMiddles(problem);
  // A prior visit shares the night of a problem night with its date; other dates get keys below 0.
  const priorKey = new Map<string, number>();
  for (const v of problem.prior ?? []) {
    const night = problem.nights.find((n) => n.localDate === v.localDate);
    if (!priorKey.has(v.localDate)) priorKey.set(v.localDate, night ? night.index : -1 - priorKey.size);
  }
  const priorNightMid = (date: string) => {
    const key = priorKey.get(date)!;
    if (nightMid.has(key)) return nightMid.get(key)!;
    const same = (problem.prior ?? []).filter((v) => v.localDate === date);
    return same.reduce((sum, v) => sum + (v.nightMidBjdTdb ?? v.midBjdTdb), 0) / same.length;
  };
  return (t, own) => {
    const target = problem.targets[t]!;
    const prior = (problem.prior ?? []).filter((v) => v.targetId === target.id);
    const mine = [...own, ...prior];
    const out: Ratio[] = [];
    if (target.model) {
      // A fresh accumulator over the visits: no running state from earlier moves.
      const asVisit = (v: CandidateSlot | PriorVisit) =>
        'nightIndex' in v
          ? { bjdTdb: v.midBjdTdb, whiteSigmaMps: v.whiteSigmaMps, night: v.nightIndex, nightBjdTdb: nightMid.get(v.nightIndex)! }
          : { bjdTdb: v.midBjdTdb, whiteSigmaMps: v.whiteSigmaMps, night: priorKey.get(v.localDate)!, nightBjdTdb: priorNightMid(v.localDate) };
      const visits = informationVisits(target.model, mine.map(asVisit));
      // A visit whose phase information is in the prior keeps only the offset and K columns.
      const model = target.model;
      mine.forEach((v, i) => {
        if (!('phaseInPrior' in v && v.phaseInPrior)) return;
        const rows = visits[i]!.rows;
        for (let k = 0; k < rows.length; k++) {
          const col = k % model.paramCount;
          if (col !== 0 && !model.kIndex.includes(col)) rows[k] = 0;
        }
      });
      const variance = kVariances(model, visits);
      target.planets.forEach((planet, i) => {
        out.push({
          ratio: variance[i] === Infinity ? 0 : planet.kMps / Math.sqrt(variance[i]!),
          goalSignificance: planet.goalSignificance,
          priority: planet.priority,
        });
      });
    }
    const grid = grids[t];
    if (grid && target.search) {
      const ratio = referenceCompleteness(
        grid,
        mine.map((v) => v.midBjdTdb),
        mine.map((v) => 1 / v.whiteSigmaMps ** 2),
        'scheduler',
      );
      out.push({ ratio, goalSignificance: target.search.goalCompleteness, priority: target.search.priority });
    }
    return out;
  };
}

/** Each night's middle as the scheduler takes it (compile.ts): given, or the mean of its slots. */
function nightMiddles(problem: ScheduleProblem): Map<number, number> {
  const out = new Map<number, number>();
  for (const night of problem.nights) {
    const mine = problem.slots.filter((s) => s.nightIndex === night.index);
    out.set(night.index, night.midBjdTdb ?? (mine.length ? mine.reduce((sum, s) => sum + s.midBjdTdb, 0) / mine.length : 0));
  }
  return out;
}

/** Total utility of the given visits, from scratch. */
export function referenceUtility(problem: ScheduleProblem, visits: CandidateSlot[], settings: ReferenceSettings): number {
  return utilityOnGrids(problem, visits, compileProblem(problem).grids, settings.overshootWeight);
}

function utilityOnGrids(problem: ScheduleProblem, visits: CandidateSlot[], grids: (SearchGrid | null)[], overshootWeight: number): number {
  return utilityOfRatios(kOverSigmaKOnGrids(problem, visits, grids), kOverSigmaKOnGrids(problem, [], grids), overshootWeight);
}

/** Total utility from the ratios with the visits and without them (the prior's), in ScheduleResult.targets order. */
function utilityOfRatios(ratios: Ratio[], prior: Ratio[], overshootWeight: number): number {
  return ratios.reduce(
    (sum, r, i) => sum + r.priority * goalValue(r.ratio / r.goalSignificance, overshootAfterPrior(prior[i]!.ratio / r.goalSignificance, overshootWeight)),
    0,
  );
}

/** Every constraint of the problem, checked pairwise: an empty list means feasible. */
export function scheduleViolations(problem: ScheduleProblem, visits: CandidateSlot[]): string[] {
  return violationsOf(problem)(visits);
}

/** scheduleViolations for one problem, with the tables that depend on the problem alone made once. */
function violationsOf(problem: ScheduleProblem): (visits: CandidateSlot[]) => string[] {
  const known = new Set(problem.slots);
  const nights = new Map(problem.nights.map((n) => [n.index, n]));
  const cap = new Map(problem.targets.map((t) => [t.id, t.visitsPerNight ?? 1]));
  const dateOf = new Map(problem.nights.map((n) => [n.index, n.localDate]));
  return (visits) => {
    const problems: string[] = [];
    const ids = new Set<string>();
    for (const v of visits) {
      if (!known.has(v)) problems.push(`${v.slotId} is not a candidate slot`);
      if (ids.has(v.slotId)) problems.push(`${v.slotId} chosen twice`);
      ids.add(v.slotId);
    }
    const { onePerNight } = problem.constraints;
    const spacingHours = (a: CandidateSlot, b: CandidateSlot) =>
      onePerNight && a.nightIndex === b.nightIndex ? (problem.constraints.sameNightSpacingHours ?? 0) : problem.constraints.minSpacingHours;
    for (let i = 0; i < visits.length; i++) {
      for (let k = i + 1; k < visits.length; k++) {
        const a = visits[i]!;
        const b = visits[k]!;
        const sameNight = a.nightIndex === b.nightIndex;
        if (sameNight && a.startMs < b.startMs + b.durationSec * 1000 && b.startMs < a.startMs + a.durationSec * 1000)
          problems.push(`${a.slotId} overlaps ${b.slotId}`);
        if (a.targetId === b.targetId && Math.abs(a.startMs - b.startMs) < spacingHours(a, b) * 3_600_000)
          problems.push(`${a.slotId} and ${b.slotId} closer than the spacing`);
      }
    }
    if (onePerNight) {
      // A star's visits of one night, prior visits on that night's date included, against its cap.
      const count = new Map<string, number>();
      const bump = (targetId: string, date: string) => count.set(`${targetId} ${date}`, (count.get(`${targetId} ${date}`) ?? 0) + 1);
      for (const v of visits) bump(v.targetId, dateOf.get(v.nightIndex)!);
      const planned = new Set(count.keys());
      for (const p of problem.prior ?? []) bump(p.targetId, p.localDate);
      for (const [key, n] of count) {
        const [targetId, date] = key.split(' ') as [string, string];
        if (planned.has(key) && n > cap.get(targetId)!) problems.push(`${targetId} has ${n} visits on ${date}, ${cap.get(targetId)!} allowed`);
      }
    }
    const hoursByNight = new Map<number, number>();
    for (const v of visits) hoursByNight.set(v.nightIndex, (hoursByNight.get(v.nightIndex) ?? 0) + v.durationSec / 3600);
    for (const [n, hours] of hoursByNight) if (hours > nights.get(n)!.hoursAvailable + 1e-9) problems.push(`night ${n} holds ${hours} h`);
    const time = problem.time;
    if (time.mode === 'choose-nights' && hoursByNight.size > time.nights) problems.push(`${hoursByNight.size} nights used, ${time.nights} allowed`);
    const total = visits.reduce((sum, v) => sum + v.durationSec / 3600, 0);
    if (time.mode === 'hours' && total > time.hours + 1e-9) problems.push(`${total} h used, ${time.hours} allowed`);
    // Each star's caps on the visits and hours planned for it (prior visits do not count).
    for (const t of problem.targets) {
      const mine = visits.filter((v) => v.targetId === t.id);
      const hours = mine.reduce((sum, v) => sum + v.durationSec / 3600, 0);
      if (t.maxVisits !== undefined && mine.length > t.maxVisits) problems.push(`${t.id} has ${mine.length} visits, ${t.maxVisits} allowed`);
      if (t.maxHours !== undefined && hours > t.maxHours + 1e-9) problems.push(`${t.id} has ${hours} h, ${t.maxHours} allowed`);
    }
    return problems;
  };
}

/** All subsets of `items` (as index lists) with at most `limit` elements. */
function subsets<T>(items: T[], limit: number): T[][] {
  const out: T[][] = [[]];
  for (const item of items) {
    const n = out.length;
    for (let i = 0; i < n; i++) if (out[i]!.length < limit) out.push([...out[i]!, item]);
  }
  return out;
}

/** All k-element subsets of 0..n-1. */
function combinations(n: number, k: number): number[][] {
  if (k === 0) return [[]];
  if (n < k) return [];
  return [...combinations(n - 1, k), ...combinations(n - 1, k - 1).map((c) => [...c, n - 1])];
}

/**
 * The best utility over every feasible schedule, by enumeration: per night every feasible set of
 * its slots, combined over the nights (in choose-nights mode over every set of exactly N nights,
 * which suffices because the utility never falls when visits are added). Tiny problems only.
 * Each schedule's utility is that of referenceUtility, a sum over the targets of terms that
 * depend on the target's own visits alone: a target's ratios are computed from scratch once per
 * list of its visits and reused by every schedule that gives it the same list.
 */
export function exhaustiveOptimum(problem: ScheduleProblem, settings: ReferenceSettings): { utility: number; visits: CandidateSlot[] } {
  const grids = compileProblem(problem).grids;
  const ratios = targetRatios(problem, grids);
  const prior = kOverSigmaKOnGrids(problem, [], grids);
  const known = problem.targets.map(() => new Map<string, Ratio[]>());
  const utilityOf = (chosen: CandidateSlot[]): number =>
    utilityOfRatios(
      problem.targets.flatMap((target, t) => {
        const own = chosen.filter((v) => v.targetId === target.id);
        const key = own.map((v) => v.slotId).join('\n');
        let r = known[t]!.get(key);
        if (!r) {
          r = ratios(t, own);
          known[t]!.set(key, r);
        }
        return r;
      }),
      prior,
      settings.overshootWeight,
    );
  const oneNightViolations = violationsOf({ ...problem, time: { mode: 'given-nights' } });
  const violations = violationsOf(problem);
  const perNight = problem.nights.map((night) => {
    const mine = problem.slots.filter((s) => s.nightIndex === night.index);
    return subsets(mine, mine.length).filter((set) => oneNightViolations(set).length === 0);
  });
  const time = problem.time;
  const nightSets = time.mode === 'choose-nights' ? combinations(perNight.length, Math.min(time.nights, perNight.length)) : [perNight.map((_, i) => i)];
  const hoursLimit = time.mode === 'hours' ? time.hours + 1e-9 : Infinity;
  let best = { utility: -Infinity, visits: [] as CandidateSlot[] };
  const descend = (nights: number[], at: number, chosen: CandidateSlot[], hours: number): void => {
    if (at === nights.length) {
      if (violations(chosen).length > 0) return;
      const utility = utilityOf(chosen);
      if (utility > best.utility) best = { utility, visits: chosen };
      return;
    }
    for (const set of perNight[nights[at]!]!) {
      const more = set.reduce((sum, s) => sum + s.durationSec / 3600, 0);
      if (hours + more <= hoursLimit) descend(nights, at + 1, set.length ? [...chosen, ...set] : chosen, hours + more);
    }
  };
  for (const nights of nightSets) descend(nights, 0, [], 0);
  return best;
}

/**
 * Greedy by gain per hour with every gain recomputed from scratch: for each step, every candidate
 * slot is tried by recomputing the whole utility and checking every constraint pairwise. The slow
 * twin of the optimiser's incremental greedy, for the bench's speed ratio (given nights or an
 * hours budget; a step adds the best feasible slot while any adds utility).
 */
export function referenceGreedy(problem: ScheduleProblem, settings: ReferenceSettings): { utility: number; visits: CandidateSlot[] } {
  const grids = compileProblem(problem).grids;
  let chosen: CandidateSlot[] = [];
  let utility = utilityOnGrids(problem, chosen, grids, settings.overshootWeight);
  for (;;) {
    let best: { slot: CandidateSlot; perHour: number; utility: number } | undefined;
    for (const slot of problem.slots) {
      if (chosen.includes(slot)) continue;
      const trial = [...chosen, slot];
      if (scheduleViolations(problem, trial).length > 0) continue;
      const value = utilityOnGrids(problem, trial, grids, settings.overshootWeight);
      const perHour = (value - utility) / (slot.durationSec / 3600);
      if (perHour > 1e-12 && (!best || perHour > best.perHour)) best = { slot, perHour, utility: value };
    }
    if (!best) return { utility, visits: chosen };
    chosen = [...chosen, best.slot];
    utility = best.utility;
  }
}
