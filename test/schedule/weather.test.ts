import { describe, expect, it } from 'vitest';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import { referenceKOverSigmaK } from '../../reference/schedule.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import type { CandidateSlot, ScheduleProblem, ScheduleResult, TargetOutcome } from '../../src/schedule/types.js';
import { simulateWeather } from '../../src/schedule/weather.js';

const settings = { overshootWeight: 0.1 };
/** What a planet or search reaches (K/sigma_K, or completeness) and its goal. */
const reachedValue = (t: TargetOutcome) => (t.kind === 'search' ? t.completeness! : t.kOverSigmaK!);
const goalOf = (t: TargetOutcome) => (t.kind === 'search' ? t.goalCompleteness! : t.goalSignificance!);

function problemWith(clearProbability: number, seed: number): ScheduleProblem {
  const base = syntheticProblem({
    targets: 3,
    nights: 14,
    slotsPerNight: 2,
    searchFraction: 0.34,
    visibleFraction: 0.8,
    time: { mode: 'choose-nights', nights: 6 },
    minSpacingHours: 0,
    onePerNight: true,
    nightHours: 6,
    seed,
    phaseErrors: true,
  });
  return { ...base, nights: base.nights.map((n) => ({ ...n, clearProbability })) };
}

/**
 * Slow reference: every 2^n clear/cloudy pattern of the nights the plan uses (each clear with
 * probability 0.6), with its probability; per target, the probability of reaching its goal, and
 * the probability of reaching every goal together.
 */
function exactOutcomes(problem: ScheduleProblem, result: ScheduleResult, nightOf = (s: CandidateSlot) => s.nightIndex) {
  const byId = new Map(problem.slots.map((s) => [s.slotId, s]));
  const visits = result.slotIds.map((id) => byId.get(id)!);
  const nights = [...new Set(visits.map(nightOf))];
  const exact = result.targets.map(() => 0);
  let exactAll = 0;
  for (let mask = 0; mask < 1 << nights.length; mask++) {
    const clear = new Set(nights.filter((_, i) => mask & (1 << i)));
    const weight = nights.reduce((p, n) => p * (clear.has(n) ? 0.6 : 0.4), 1);
    const ratios = referenceKOverSigmaK(
      problem,
      visits.filter((v) => clear.has(nightOf(v))),
    );
    const reached = ratios.map((r, i) => r >= goalOf(result.targets[i]!) * (1 - 1e-9));
    reached.forEach((yes, i) => {
      exact[i] += yes ? weight : 0;
    });
    if (reached.every(Boolean)) exactAll += weight;
  }
  return { exact, exactAll, nights };
}

/** problemWith(0.6, seed) with low goals, so that reaching them is a matter of luck with the weather. */
function loweredProblem(seed: number): ScheduleProblem {
  const problem = problemWith(0.6, seed);
  return {
    ...problem,
    targets: problem.targets.map((t) => ({
      ...t,
      planets: t.planets.map((p) => ({ ...p, goalSignificance: 1 })),
      ...(t.search ? { search: { ...t.search, goalSignificance: 1 } } : {}),
    })),
  };
}

describe('simulateWeather', () => {
  it('always clear: each target reaches its goal exactly when the plan does', () => {
    const problem = problemWith(1, 3);
    const result = optimiseSchedule(problem, { seed: 1, ...settings });
    const outcome = simulateWeather(problem, result, 50, 9, settings);
    outcome.targets.forEach((t, i) => {
      const planned = result.targets[i]!;
      expect(t.goalProbability).toBe(reachedValue(planned) >= goalOf(planned) * (1 - 1e-9) ? 1 : 0);
      expect(t.meanKOverSigmaK).toBeCloseTo(reachedValue(planned), 8);
    });
    expect(outcome.meanUtility).toBeCloseTo(result.utility, 8);
  });

  it('always cloudy: nothing is reached', () => {
    const problem = problemWith(0, 4);
    const result = optimiseSchedule(problem, { seed: 1, ...settings });
    const outcome = simulateWeather(problem, result, 50, 9, settings);
    expect(outcome.meanClearNights).toBe(0);
    for (const t of outcome.targets) expect(t.goalProbability).toBe(0);
  });

  it('agrees with an exact sum over every weather outcome, within Monte Carlo error', () => {
    const lowered = loweredProblem(5);
    const result = optimiseSchedule(lowered, { seed: 1, ...settings });
    const { exact, exactAll, nights } = exactOutcomes(lowered, result);
    const trials = 1000;
    const outcome = simulateWeather(lowered, result, trials, 21, settings);
    outcome.targets.forEach((t, i) => {
      // Four binomial standard errors (common practice for a seeded Monte Carlo check).
      const tolerance = 4 * Math.sqrt((exact[i]! * (1 - exact[i]!)) / trials) + 1e-9;
      expect(Math.abs(t.goalProbability - exact[i]!)).toBeLessThanOrEqual(tolerance);
    });
    // Every goal in the same trial, on the exact sum (here 0: the search gets no visit).
    expect(Math.abs(outcome.allGoalsProbability - exactAll)).toBeLessThanOrEqual(4 * Math.sqrt((exactAll * (1 - exactAll)) / trials) + 1e-9);
    // The same seed repeats; the mean number of clear nights is near 0.6 per used night.
    expect(simulateWeather(lowered, result, trials, 21, settings)).toEqual(outcome);
    expect(Math.abs(outcome.meanClearNights - 0.6 * nights.length)).toBeLessThan(4 * Math.sqrt((0.24 * nights.length) / trials));
  });

  it('gives the probability that every goal is reached in the same trial, against the exact sum', () => {
    const problem = problemWith(0.6, 5);
    // The two ephemeris planets only, each reached in some weather and missed in other.
    const targets = problem.targets.filter((t) => !t.search).map((t) => ({ ...t, planets: t.planets.map((p) => ({ ...p, goalSignificance: 1 })) }));
    const ids = new Set(targets.map((t) => t.id));
    const two = { ...problem, targets, slots: problem.slots.filter((s) => ids.has(s.targetId)) };
    const result = optimiseSchedule(two, { seed: 1, ...settings });
    const { exact, exactAll } = exactOutcomes(two, result);
    // Not a trivial case: each goal is uncertain, and so is the joint.
    for (const p of exact) expect(p > 0.05 && p < 0.95).toBe(true);
    expect(exactAll).toBeGreaterThan(0.05);
    // Enough trials that the product of the two probabilities (0.32 here) or the smaller one (0.36)
    // lies outside four standard errors of the joint (0.34).
    const trials = 20_000;
    const outcome = simulateWeather(two, result, trials, 21, settings);
    expect(Math.abs(outcome.allGoalsProbability - exactAll)).toBeLessThanOrEqual(4 * Math.sqrt((exactAll * (1 - exactAll)) / trials) + 1e-9);
    expect(outcome.allGoalsProbability).toBeLessThanOrEqual(Math.min(...outcome.targets.map((t) => t.goalProbability)));
  });

  it('draws one weather for the two halves of a night (calendarNight), against the exact sum over calendar nights', () => {
    const whole = loweredProblem(5);
    // Each night split at its middle (3 h after the synthetic night's start); a slot across it is dropped.
    const middleMs = (s: CandidateSlot) => Date.UTC(2027, 0, 1, 20) + s.nightIndex * 86_400_000 + 3 * 3_600_000;
    const inHalf = (s: CandidateSlot) => (s.startMs + s.durationSec * 1000 <= middleMs(s) ? 0 : s.startMs >= middleMs(s) ? 1 : -1);
    const split: ScheduleProblem = {
      ...whole,
      nights: whole.nights.flatMap((n) => [0, 1].map((k) => ({ ...n, index: 2 * n.index + k, calendarNight: n.index, hoursAvailable: n.hoursAvailable / 2 }))),
      slots: whole.slots.filter((s) => inHalf(s) >= 0).map((s) => ({ ...s, nightIndex: 2 * s.nightIndex + inHalf(s) })),
      // 20 of the 28 halves: some nights are planned in both.
      time: { mode: 'choose-nights', nights: 20 },
    };
    const result = optimiseSchedule(split, { seed: 1, ...settings });
    const byId = new Map(split.slots.map((s) => [s.slotId, s]));
    const visits = result.slotIds.map((id) => byId.get(id)!);
    // One visit of a star a calendar night (onePerNight), and some night planned in both halves.
    const starNights = visits.map((v) => `${v.targetId}/${v.nightIndex >> 1}`);
    expect(new Set(starNights).size).toBe(starNights.length);
    const halvesUsed = new Set(visits.map((v) => v.nightIndex));
    expect([...halvesUsed].some((h) => h % 2 === 0 && halvesUsed.has(h + 1))).toBe(true);
    const { exact } = exactOutcomes(split, result, (s) => s.nightIndex >> 1);
    const trials = 4000;
    const outcome = simulateWeather(split, result, trials, 21, settings);
    outcome.targets.forEach((t, i) => {
      const tolerance = 4 * Math.sqrt((exact[i]! * (1 - exact[i]!)) / trials) + 1e-9;
      expect(Math.abs(t.goalProbability - exact[i]!)).toBeLessThanOrEqual(tolerance);
    });
  });
});
