// The utility of one target, and so of a plan (the sum over targets).
//
// x = (K / sigma_K) / goal is the fraction of the goal reached. A target's utility is
//   u = priority * g(x),  g(x) = x                                 for x <= 1,
//                         g(x) = 1 + b (1 - exp(-(x - 1) / b))      for x > 1,
// with b the overshoot weight (default 0.1): linear up to the goal, then a soft cap at 1 + b
// whose slope starts at 1 (g is continuous with its first derivative) and decays with scale b.
// g is non-decreasing and concave, and x grows as sqrt(information) (sigma_K = 1/sqrt(I)), so
// each extra visit of a target is worth less than the one before: once a target passes its goal,
// time flows to the others, while a little margin for bad weather still counts.
// (A saturating, priority-weighted sum of concave terms is the usual form for a diminishing-
// returns objective on which greedy choice works well: Nemhauser, Wolsey & Fisher 1978.)
// Crest's plans take b from the weather (weatherMargin below): the margin a goal needs to survive
// the nights the clouds may take.
import { normalQuantile } from '../rv/normal-cdf.js';
import type { ScheduleProblem } from './types.js';

/** g(x) above: the value of reaching the fraction x of the goal. */
export function goalValue(fractionOfGoal: number, overshootWeight: number): number {
  const x = fractionOfGoal;
  if (x <= 1) return x;
  if (overshootWeight <= 0) return 1;
  return 1 + overshootWeight * (1 - Math.exp(-(x - 1) / overshootWeight));
}

/**
 * The overshoot weight of a target given what its visits already made reach (fraction of the
 * goal): those visits are certain, so a target they alone carry to its goal needs no margin for
 * weather, and its value is flat past the goal (Crest's rule: no further visits unless another
 * planet of the star asks for them).
 */
export function overshootAfterPrior(priorFractionOfGoal: number, overshootWeight: number): number {
  return priorFractionOfGoal >= 1 ? 0 : overshootWeight;
}

/**
 * The overshoot weight a campaign's weather asks for. With n nights each clear with probability
 * f (their mean), the fraction of a target's clear-sky information that survives is about
 * Binomial(n, f) / n; its lower (1 - p) quantile is F = f - z_p sqrt(f (1 - f) / n) by the
 * normal approximation, and K/sigma_K scales as sqrt(F). Reaching the goal with probability p
 * then asks a clear-sky fraction of the goal x >= 1 / sqrt(F), and the soft cap's scale b is that
 * margin, 1 / sqrt(F) - 1: 0 under a sure sky, at most 1 (where F is a quarter or less).
 */
export function weatherMargin(meanClearProbability: number, nights: number, probability: number): number {
  const f = meanClearProbability;
  if (f >= 1 || nights <= 0) return 0;
  const quantile = f - normalQuantile(probability) * Math.sqrt((f * (1 - f)) / nights);
  return quantile <= 0.25 ? 1 : Math.min(1, 1 / Math.sqrt(quantile) - 1);
}

/** weatherMargin for a problem: its nights' mean clear probability over the nights the time model can use. */
export function problemWeatherMargin(problem: ScheduleProblem, probability: number): number {
  const { nights, time } = problem;
  if (nights.length === 0) return 0;
  const meanClear = nights.reduce((sum, n) => sum + n.clearProbability, 0) / nights.length;
  const granted = nights.filter((n) => n.granted).length;
  const used = time.mode === 'choose-nights' ? Math.min(nights.length, time.nights + granted) : nights.length;
  return weatherMargin(meanClear, used, probability);
}
