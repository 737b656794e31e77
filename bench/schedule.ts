// Scheduler bench: a 100-target, 180-night choose-20 problem (time, utility); the ratio of the
// optimiser's utility to the exhaustive optimum on small problems; and a 1,000-target, 365-night
// scale line with its time and the process's peak resident memory. All problems are synthetic.
import { optimiseSchedule } from '../src/schedule/optimise.js';
import { exhaustiveOptimum, referenceGreedy } from '../reference/schedule.js';
import { syntheticProblem, type SyntheticSpec } from '../reference/synthetic.js';
import { needFromPlan } from '../src/schedule/need.js';
import { simulateWeather } from '../src/schedule/weather.js';
import { timeSec, type BenchModule } from './types.js';

function campaign(targets: number, nights: number, seed: number): SyntheticSpec {
  return {
    targets,
    nights,
    slotsPerNight: 3,
    searchFraction: 0.2,
    visibleFraction: 0.6,
    time: { mode: 'choose-nights', nights: 20 },
    minSpacingHours: 0,
    onePerNight: true,
    nightHours: 9,
    seed,
    phaseErrors: true,
  };
}

function runCampaign(targets: number, nights: number): Record<string, unknown> {
  const problem = syntheticProblem(campaign(targets, nights, 1));
  const { value: result, sec } = timeSec(() => optimiseSchedule(problem, { seed: 1 }));
  const weather = timeSec(() => simulateWeather(problem, result, 1000, 1));
  const need = timeSec(() => needFromPlan(problem, result, 0.9, 1000, 1));
  return {
    case: `${targets} targets, ${nights} nights, choose 20`,
    slots: problem.slots.length,
    optimiseSec: Number(sec.toFixed(2)),
    weather1000Sec: Number(weather.sec.toFixed(2)),
    need1000Sec: Number(need.sec.toFixed(2)),
    requestedVisits: need.value.stars.reduce((sum, s) => sum + s.requestedVisits, 0),
    utility: Number(result.utility.toFixed(3)),
    visits: result.slotIds.length,
    targetsAtGoal: result.targets.filter((t) => (t.kOverSigmaK ?? t.completeness ?? 0) >= (t.goalSignificance ?? t.goalCompleteness ?? Infinity)).length,
    peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
  };
}

const SMALL_PROBLEMS = 12;

function exhaustiveRatio(): Record<string, unknown> {
  const settings = { overshootWeight: 0.1 };
  const ratios: number[] = [];
  let optimiseSec = 0;
  let exhaustiveSec = 0;
  for (let seed = 1; seed <= SMALL_PROBLEMS; seed++) {
    const problem = syntheticProblem({
      ...campaign(3, 12, seed),
      slotsPerNight: 1,
      searchFraction: seed % 3 === 0 ? 0.34 : 0,
      visibleFraction: 0.7,
      time: { mode: 'choose-nights', nights: 3 },
      nightHours: 3,
    });
    const fast = timeSec(() => optimiseSchedule(problem, { seed, ...settings }));
    const slow = timeSec(() => exhaustiveOptimum(problem, settings));
    optimiseSec += fast.sec;
    exhaustiveSec += slow.sec;
    ratios.push(fast.value.utility / slow.value.utility);
  }
  return {
    case: `utility / exhaustive optimum, ${SMALL_PROBLEMS} problems: 3 targets, choose 3 of 12 nights`,
    minRatio: Number(Math.min(...ratios).toFixed(4)),
    meanRatio: Number((ratios.reduce((a, b) => a + b, 0) / ratios.length).toFixed(4)),
    optimiseSec: Number(optimiseSec.toFixed(2)),
    exhaustiveSec: Number(exhaustiveSec.toFixed(2)),
  };
}

/**
 * The incremental greedy (running sums: O(1) per ephemeris move) against a greedy that recomputes
 * every gain and every constraint from scratch, on one mid-size given-nights problem; and the full
 * optimiser (greedy, then local search and restarts). Times after one warm-up run each.
 */
function incrementalRatio(): Record<string, unknown> {
  const settings = { overshootWeight: 0.1 };
  const problem = syntheticProblem({ ...campaign(10, 25, 3), time: { mode: 'given-nights' } });
  const greedyOnly = () => optimiseSchedule(problem, { seed: 3, ...settings, restarts: 0, maxPasses: 0 });
  const full = () => optimiseSchedule(problem, { seed: 3, ...settings });
  greedyOnly();
  full();
  const greedy = timeSec(greedyOnly);
  const optimiser = timeSec(full);
  const slow = timeSec(() => referenceGreedy(problem, settings));
  return {
    case: `incremental greedy vs from-scratch greedy: 10 targets, 25 given nights, ${problem.slots.length} slots`,
    greedySec: Number(greedy.sec.toFixed(4)),
    referenceGreedySec: Number(slow.sec.toFixed(2)),
    speedup: Math.round(slow.sec / greedy.sec),
    optimiserSec: Number(optimiser.sec.toFixed(3)),
    utilityGreedy: Number(greedy.value.utility.toFixed(3)),
    utilityOptimiser: Number(optimiser.value.utility.toFixed(3)),
    utilityReferenceGreedy: Number(slow.value.utility.toFixed(3)),
  };
}

/** Four figures, one JSON line each; the scale line runs last so its peak memory is the run's peak. */
export const scheduleBenches: BenchModule[] = [
  { name: 'schedule', run: () => runCampaign(100, 180) },
  { name: 'schedule', run: exhaustiveRatio },
  { name: 'schedule', run: incrementalRatio },
  { name: 'schedule', run: () => runCampaign(1000, 365) },
];
