// Time from need (src/schedule/need.ts) against a slow reference written here: each star's planned
// visits ranked by backward elimination on the dense Cramér–Rao K variances
// (test/support/dense-information.ts, independent of the incremental information model), then
// seeded weather of its own (each night clear with the site's probability, common practice) and,
// per trial, the shortest prefix of that ranking whose clear visits reach the goal (a bisection:
// information only grows with visits). The check: no star is asked for more visits than
// its planets need for their goals with the campaign's probability, plus at most one: with two
// visits fewer, the reference does not clearly reach every goal with that probability (a need
// can jump by several visits when the next ones share nights, so the two estimates are compared
// in probability, within three standard errors of their Monte Carlo noise). And the other way:
// the requested visits do reach it, within the same noise. Stars with a blind search are left out
// (their need is the search score's; the planets' is what this reference computes).
import { beforeAll, describe, expect, it } from 'vitest';
import { buildPlan, WEATHER_TRIALS } from '../../src/plan/build-plan.js';
import { clearProbability } from '../../src/plan/candidates.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { starModel, starsOf } from '../../src/plan/star-model.js';
import { nightMiddleJd } from '../../src/plan/visit-information.js';
import { createRng } from '../../src/rv/random.js';
import { type DenseVisit, denseKVariances } from '../support/dense-information.js';
import { demoPlan } from '../support/demo-plan.js';
import { randomCampaign } from './random-campaign.js';

/** Reference weather trials: P is good to ±0.015 at 0.9 (binomial standard error). */
const REFERENCE_TRIALS = 400;
/** Random campaigns rebuilt with the plan's full weather trials (the shared ones use 20). */
const RANDOM = [0, 3, 5, 8, 11, 14];

interface StarCheck {
  starId: string;
  planned: number;
  requested: number;
  /** Whether Crest finds every planet's goal reachable with the chosen probability. */
  reachable: boolean;
  /** Per planet: the reference's P(goal) with the first n visits of its ranking, n = 0 .. planned. */
  probability: Float64Array[];
}

function referenceNeed(plan: Plan, starId: string): StarCheck | undefined {
  const rows = starsOf(plan.campaign.targets).get(starId)!;
  if (rows.some((t) => t.search)) return undefined;
  const model = starModel(rows, plan.campaign);
  const summaries = model?.planets.map((p) => plan.targets.find((s) => s.targetId === p.input.id)!);
  if (!model || !summaries?.every((s) => s.request && s.kMps)) return undefined;
  const nightPos = new Map(plan.nights.map((n, i) => [n.localDate, i]));
  const visits = plan.visits.filter((v) => v.starId === starId && !v.kept);
  if (!visits.length || plan.observed?.length || plan.visits.some((v) => v.kept)) return undefined;
  const dense = (v: (typeof visits)[number]): DenseVisit => ({
    bjdTdb: v.midBjdTdb,
    whiteSigmaMps: v.whiteSigmaMps,
    night: nightPos.get(v.localDate)!,
    nightBjdTdb: nightMiddleJd(plan.nights[nightPos.get(v.localDate)!]),
  });
  const ratios = (set: typeof visits) => {
    // γ and each K need a visit of their own before the K's are determined.
    if (set.length < 1 + summaries.length) return summaries.map(() => 0);
    const variance = denseKVariances(model, set.map(dense));
    return summaries.map((s, i) => (variance[i] === Infinity ? 0 : s.kMps! / Math.sqrt(variance[i]!)));
  };
  const goals = summaries.map((s) => s.goalSignificance!);
  // Backward elimination: drop the visit whose loss leaves the largest sum of log(ratio / goal).
  const kept = [...visits];
  const dropped: typeof visits = [];
  while (kept.length) {
    let best = 0;
    let bestScore = -Infinity;
    kept.forEach((_, k) => {
      const r = ratios(kept.filter((_, i) => i !== k));
      const score = r.reduce((sum, x, i) => sum + Math.log(1e-12 + x / goals[i]!), 0);
      if (score >= bestScore) {
        bestScore = score;
        best = k;
      }
    });
    dropped.push(kept.splice(best, 1)[0]!);
  }
  const order = dropped.reverse();
  const dates = [...new Set(order.map((v) => v.localDate))];
  const rng = createRng(9001);
  const reached = summaries.map(() => new Float64Array(order.length + 1));
  for (let trial = 0; trial < REFERENCE_TRIALS; trial++) {
    const clear = new Set(dates.filter((d) => rng.uniform() < clearProbability(plan.campaign.site.clearFraction, d)));
    const reaches = (n: number, i: number) => ratios(order.slice(0, n).filter((v) => clear.has(v.localDate)))[i]! >= goals[i]! * (1 - 1e-9);
    summaries.forEach((_, i) => {
      if (!reaches(order.length, i)) return;
      let lo = 0;
      let hi = order.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (reaches(mid, i)) hi = mid;
        else lo = mid + 1;
      }
      reached[i]![lo]++;
    });
  }
  const probability = reached.map((counts) => {
    let sum = 0;
    return counts.map((k) => {
      sum += k;
      return sum / REFERENCE_TRIALS;
    });
  });
  return { starId, planned: visits.length, requested: summaries[0]!.request!.visits, reachable: summaries.every((s) => s.request!.reachable), probability };
}

function checks(plan: Plan): StarCheck[] {
  return [...new Set(plan.targets.map((t) => t.starId))].flatMap((id) => referenceNeed(plan, id) ?? []);
}

describe('time from need against a slow reference', () => {
  const plans = new Map<string, Plan>();
  const checked = new Map<string, StarCheck[]>();
  beforeAll(() => {
    plans.set('demo', demoPlan());
    for (const i of RANDOM) {
      plans.set(`random ${i}`, buildPlan(randomCampaign(i)));
      // At the lowest probability allowed more stars reach their goals before their last planned visit.
      const campaign = randomCampaign(i);
      plans.set(`random ${i} at 50%`, buildPlan({ ...campaign, goals: { ...campaign.goals, probability: 0.5 } }));
    }
    for (const [name, plan] of plans) checked.set(name, checks(plan));
  }, 600_000);

  it('the plans hold stars below, at and above their need', () => {
    const all = [...checked.values()].flat();
    console.info(
      `time from need: ${all.length} stars; requested ${all.reduce((s, c) => s + c.requested, 0)} ` +
        `of ${all.reduce((s, c) => s + c.planned, 0)} planned visits; ` +
        `${all.filter((c) => c.requested < c.planned).length} stars asked for fewer than planned`,
    );
    expect(all.length).toBeGreaterThan(20);
    expect(all.filter((c) => c.reachable).length).toBeGreaterThan(5);
    expect(all.filter((c) => c.requested < c.planned).length).toBeGreaterThan(2);
  });

  for (const name of ['demo', ...RANDOM.flatMap((i) => [`random ${i}`, `random ${i} at 50%`])]) {
    it(`${name}: each star's requested visits are within one of what its planets need`, () => {
      const plan = plans.get(name)!;
      const q = plan.totals.request!.probability;
      // Three standard errors of the difference of two binomial estimates (the plan's trials and the reference's).
      const tolerance = 3 * Math.sqrt(q * (1 - q) * (1 / REFERENCE_TRIALS + 1 / WEATHER_TRIALS));
      for (const c of checked.get(name)!) {
        const curves = c.probability.map((p) => [...p].map((x) => x.toFixed(2)).join(' ')).join(' | ');
        const text = `${c.starId}: requested ${c.requested} of ${c.planned}, reference P ${curves}`;
        // Not more than need + 1: two visits fewer would not clearly do for every planet.
        if (c.requested >= 2)
          expect(
            c.probability.some((p) => p[c.requested - 2]! < q + tolerance),
            text,
          ).toBe(true);
        // Not less than need: the requested visits reach each goal with the probability, within the noise.
        if (c.reachable) for (const p of c.probability) expect(p[c.requested]!, text).toBeGreaterThan(q - tolerance);
      }
      // Totals: the requested visits and hours are those not marked spare.
      const requested = plan.visits.filter((v) => !v.kept && !v.spare);
      expect(plan.totals.request!.visits).toBe(requested.length);
      expect(plan.totals.request!.hours).toBeCloseTo(requested.reduce((s, v) => s + v.durationSec, 0) / 3600, 9);
      expect(plan.totals.request!.nights).toBe(new Set(requested.map((v) => v.localDate)).size);
    });
  }

  it('at the full count the probabilities are the weather replay’s (the same seeded trials)', () => {
    for (const plan of plans.values()) {
      for (const s of plan.targets) {
        if (!s.request || s.request.visits !== s.visits) continue;
        expect(s.request.goalProbability, s.targetId).toBe(s.goalProbability);
      }
    }
  });
});
