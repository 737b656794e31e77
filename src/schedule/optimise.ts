// The scheduler's entry point: choose visits (and, in choose-nights mode, nights) that maximise
// the total utility (utility.ts), then report per target what the plan reaches.
//
// 1. Greedy. given-nights and hours: one greedy pass by utility gain per hour over every slot.
//    choose-nights: greedy over nights, each night valued by the greedy schedule inside it given
//    the plan so far (by ranking gains, so that a night holding a target's first visit counts);
//    values are re-computed lazily (a night's cached value is re-checked only
//    when it reaches the top, the usual lazy-greedy device for diminishing returns, Minoux 1978).
// 2. Local search (local-search.ts) to a local optimum: add, replace (move and swap), night swap;
//    a star whose visits are together worth nothing gives them up, and local search runs again.
// 3. Restarts (iterated local search, below), keeping the best plan.
// 4. choose-nights: every night left out is valued given the final plan; the best are backups.
import { createRng, type Rng } from '../rv/random.js';
import { compileProblem, type CompiledProblem } from './compile.js';
import { fillNight, greedyFill, nightValue } from './greedy.js';
import { localSearch, type LocalSearchSettings } from './local-search.js';
import { improves, openNightList, shuffled } from './moves.js';
import { PlanState } from './state.js';
import type { ScheduleOptions, ScheduleProblem, ScheduleResult, TargetOutcome } from './types.js';
import { goalValue } from './utility.js';

/** Opens nights greedily (never those in `excluded`) until `count` are open. */
function chooseNightsGreedy(state: PlanState, count: number, excluded: Set<number>): void {
  const c = state.c;
  // Cached value and the round (nights opened so far) it was computed in.
  const value = new Float64Array(c.nightCount);
  const stamp = new Int32Array(c.nightCount);
  const pending = new Set<number>();
  for (let n = 0; n < c.nightCount; n++) {
    if (state.nightOpen[n] || excluded.has(n)) continue;
    value[n] = nightValue(state, n).ranking;
    pending.add(n);
  }
  let round = 0;
  while (state.openNights < count && pending.size > 0) {
    let top = -1;
    for (const n of pending) if (top < 0 || value[n]! > value[top]! || (value[n] === value[top] && n < top)) top = n;
    if (stamp[top] !== round) {
      value[top] = nightValue(state, top).ranking;
      stamp[top] = round;
      continue;
    }
    pending.delete(top);
    fillNight(state, top);
    round++;
  }
}

/** Per planet and per search: what the plan reaches (a star's visits serve all of them). */
function outcomes(state: PlanState): TargetOutcome[] {
  const c = state.c;
  return c.problem.targets.flatMap((star, t) => {
    const visits = state.targetVisits[t]!;
    const shared = { starId: star.id, visits: visits.length, priorVisits: c.prior.count[t]!, hours: visits.reduce((sum, j) => sum + c.hours[j]!, 0) };
    const weightSum = visits.reduce((sum, j) => sum + c.weight[j]!, c.prior.weightSum[t]!);
    const out: TargetOutcome[] = star.planets.map((planet, i) => {
      const at = c.planetFrom[t]! + i;
      const variance = state.kVariance[at]!;
      const kOverSigmaK = state.planetFractionOfGoal(at) * planet.goalSignificance;
      const outcome: TargetOutcome = {
        targetId: planet.id,
        kind: 'ephemeris',
        ...shared,
        priorValue: state.priorPlanetFraction[at]! * planet.goalSignificance,
        informationPerMps2: 1 / variance,
        sigmaKMps: Math.sqrt(variance),
        kOverSigmaK,
        goalSignificance: planet.goalSignificance,
        utility: planet.priority * goalValue(kOverSigmaK / planet.goalSignificance, state.planetOvershoot[at]!),
      };
      // Efficiency (sigma^2/N)/Var(K^) generalised to unequal weights: I / sum w (docs/references.md [Visits-needed]).
      if (visits.length + shared.priorVisits > 0) outcome.informationEfficiency = 1 / variance / weightSum;
      return outcome;
    });
    if (star.search) {
      const goal = star.search.goalCompleteness;
      const completeness = state.searchCompleteness(t, 0, 0);
      out.push({
        targetId: star.search.id,
        kind: 'search',
        ...shared,
        priorValue: state.priorSearchFraction[t]! * goal,
        completeness,
        goalCompleteness: goal,
        utility: star.search.priority * goalValue(completeness / goal, state.searchOvershoot[t]!),
      });
    }
    return out;
  });
}

function backups(state: PlanState, count: number): ScheduleResult['backups'] {
  const c = state.c;
  const ranked: { n: number; gain: number }[] = [];
  for (let n = 0; n < c.nightCount; n++) if (!state.nightOpen[n] && c.nightTo[n]! > c.nightFrom[n]!) ranked.push({ n, gain: nightValue(state, n).utility });
  ranked.sort((a, b) => b.gain - a.gain || a.n - b.n);
  return ranked.slice(0, count).map(({ n, gain }, i) => {
    const night = c.problem.nights[c.nightOrder[n]!]!;
    return { nightIndex: night.index, localDate: night.localDate, rank: i + 1, utilityGain: gain };
  });
}

function snapshot(state: PlanState): { nights: number[]; slots: number[] } {
  return { nights: openNightList(state), slots: state.chosenSlots() };
}

function restoreSnapshot(state: PlanState, saved: { nights: number[]; slots: number[] }): void {
  // Every visit out first: granted nights stay open and keep theirs through closeNight.
  for (const j of state.chosenSlots()) state.remove(j);
  for (const n of openNightList(state)) state.closeNight(n);
  for (const n of saved.nights) state.openNight(n);
  for (const j of saved.slots) state.add(j);
}

/**
 * Perturbation for iterated local search (Lourenco, Martin & Stuetzle 2003, "Iterated local
 * search", Handbook of Metaheuristics): drop a random number, up to half, of the chosen nights (or
 * of the visits), rebuild greedily without them, and let local search polish the result.
 */
function dropCount(of: number, rng: Rng): number {
  return 1 + Math.floor(rng.uniform() * Math.ceil(of / 2));
}

function perturb(state: PlanState, nights: number, rng: Rng): void {
  const c = state.c;
  if (nights > 0) {
    const out = shuffled(openNightList(state), rng).slice(0, dropCount(state.openNights, rng));
    for (const n of out) state.closeNight(n);
    chooseNightsGreedy(state, nights, new Set(out));
    return;
  }
  const chosen = state.chosenSlots();
  const out = new Set(shuffled(chosen, rng).slice(0, dropCount(chosen.length, rng)));
  for (const j of out) state.remove(j);
  const rest: number[] = [];
  for (let j = 0; j < c.slotCount; j++) if (!out.has(j)) rest.push(j);
  greedyFill(state, rest);
}

/**
 * Removes the visits of every star whose visits together are worth nothing (a search that has not
 * reached its first detectable completeness: the greedy's first-visit credit started it, and no
 * single move of local search sees that its visits are wasted); true if any went.
 */
function dropWorthless(state: PlanState): boolean {
  let dropped = false;
  state.targetVisits.forEach((visits, t) => {
    if (visits.length === 0 || state.targetUtility[t]! > 0) return;
    for (const j of [...visits]) state.remove(j);
    dropped = true;
  });
  return dropped;
}

/** Local search, then again after dropWorthless if it freed any time. */
function polish(state: PlanState, settings: LocalSearchSettings): void {
  localSearch(state, settings);
  if (dropWorthless(state)) localSearch(state, settings);
}

/** Builds the plan state from a compiled problem: greedy, local search, then seeded restarts. */
export function optimiseCompiled(c: CompiledProblem, options: ScheduleOptions): PlanState {
  const time = c.problem.time;
  const state = new PlanState(c, time.mode === 'hours' ? time.hours : Infinity, options.overshootWeight ?? 0.1);
  const nights = time.mode === 'choose-nights' ? Math.min(time.nights, c.nightCount - c.nightGranted.reduce((a, b) => a + b, 0)) : 0;
  const choosing = time.mode === 'choose-nights';
  if (choosing) {
    for (let n = 0; n < c.nightCount; n++) if (c.nightGranted[n]) fillNight(state, n);
    chooseNightsGreedy(state, nights, new Set());
  } else {
    for (let n = 0; n < c.nightCount; n++) state.openNight(n);
    greedyFill(
      state,
      Array.from({ length: c.slotCount }, (_, j) => j),
    );
  }
  options.onProgress?.(state.utility, 'greedy');
  const rng = createRng(options.seed);
  const settings: LocalSearchSettings = {
    chooseNights: choosing,
    maxPasses: options.maxPasses ?? 30,
    nightCandidates: 10,
    shortlist: time.mode === 'hours' ? 64 : 0,
    rng,
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  };
  polish(state, settings);
  // Restarts cost a full local search each: many on small problems, none above 20,000 slots.
  const restarts = options.restarts ?? Math.min(30, Math.floor(20_000 / Math.max(1, c.slotCount)));
  let best = snapshot(state);
  let bestUtility = state.utility;
  for (let r = 0; r < restarts; r++) {
    // Restarts explore from a copy of the best plan; only a better plan is kept (and reported).
    const quiet = { ...settings, onProgress: undefined };
    perturb(state, nights, rng);
    polish(state, quiet);
    if (improves(bestUtility, state.utility)) {
      best = snapshot(state);
      bestUtility = state.utility;
      options.onProgress?.(state.utility, 'restart');
    } else {
      restoreSnapshot(state, best);
    }
  }
  return state;
}

/**
 * Chooses visits (and nights) for `problem`; deterministic for `options.seed`.
 * Throws a plain Error if the problem is inconsistent (unknown target or night, missing phase).
 */
export function optimiseSchedule(problem: ScheduleProblem, options: ScheduleOptions): ScheduleResult {
  const c = compileProblem(problem);
  const state = optimiseCompiled(c, options);
  const chosen = state.chosenSlots();
  const targets = outcomes(state);
  const nights = new Set<number>();
  for (let n = 0; n < c.nightCount; n++)
    if (state.nightOpen[n] && (problem.time.mode === 'choose-nights' || state.nightVisits[n]!.length > 0)) nights.add(problem.nights[c.nightOrder[n]!]!.index);
  return {
    slotIds: chosen.map((j) => problem.slots[c.slotSource[j]!]!.slotId),
    nightIndices: [...nights].sort((a, b) => a - b),
    backups: problem.time.mode === 'choose-nights' ? backups(state, options.backups ?? 5) : [],
    targets,
    // Summed afresh rather than from the running total, which collects rounding over many moves.
    utility: targets.reduce((sum, t) => sum + t.utility, 0),
    hours: chosen.reduce((sum, j) => sum + c.hours[j]!, 0),
  };
}
