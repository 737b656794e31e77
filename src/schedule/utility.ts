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
