// What the optimiser is given for a campaign: nights, windows, the RVs so far (fitted), the visits
// already made or kept, the candidate visits still open and the time left, as one scheduling
// problem. Shared by `crest plan` (build-plan.ts) and `crest next` (next-visits.ts).
import type { Night, Window } from '../model.js';
import type { Campaign } from './campaign.js';
import type { ObservedVisit } from './plan-schema.js';
import type { ScheduleProblem } from '../schedule/types.js';
import { computeNights } from '../sky/nights.js';
import { computeWindows, type DroppedWindow } from '../sky/visibility.js';
import {
  candidateSlots,
  scheduleNights,
  setupStars,
  setupTargets,
  starTargets,
  type Candidate,
  type SlotDetail,
  type StarSetup,
  type TargetSetup,
} from './candidates.js';
import { splitHalves } from './half-nights.js';
import { observedVisits } from './observed-visits.js';
import { updateFromRvs, type RvUpdate } from './orbit-update.js';
import type { StageListener } from './plan-stages.js';
import { history, openSlot, priorVisits, remaining, type History, type Remaining, type ReplanOptions } from './replan.js';
import { candidateVisitCount, checkVisitBudget, type MemoryBudget } from './visit-budget.js';

export interface PlanInputs {
  /** The campaign with its targets updated by the RVs so far. */
  campaign: Campaign;
  rv: RvUpdate;
  setups: TargetSetup[];
  stars: StarSetup[];
  nights: Night[];
  windows: Window[];
  /** The nights without a window for a star, and why (src/sky/visibility.ts). */
  dropped: DroppedWindow[];
  observed: ObservedVisit[];
  past: History;
  left: Remaining;
  /** The candidate visits still open, and the problem made of them. */
  candidates: Candidate[];
  /** What one of them means for the plan (airmass, Moon, precision, phases), made on demand. */
  detail: (candidate: Candidate) => SlotDetail;
  problem: ScheduleProblem;
}

export function planInputs(given: Campaign, options: ReplanOptions & MemoryBudget & { onStage?: StageListener }): PlanInputs {
  const { site, constraints, window } = given;
  options.onStage?.('nights');
  const nights = computeNights(site, window.start, window.end, constraints.twilight);
  const catalogueSetups = setupTargets(given);
  const observed = observedVisits(given, setupStars(given, catalogueSetups));
  // The RVs so far update the ephemerides and K's the rest is planned with (orbit-update.ts).
  const rv = updateFromRvs(given, observed, catalogueSetups);
  const campaign = rv.campaign;
  const setups = rv.fits.size > 0 ? setupTargets(campaign) : catalogueSetups;
  const stars = setupStars(campaign, setups);
  options.onStage?.('visibility windows');
  const { windows, dropped } = computeWindows(site, starTargets(stars), nights, constraints);
  const past = history(campaign, observed, options);
  const open = openSlot(campaign, past, options.now);
  const allNights = scheduleNights(campaign, nights);
  const left = remaining(campaign, past, options.previous, allNights);
  const dates = new Set(left.nights.map((n) => n.localDate));
  options.onStage?.('candidate visits');
  // A campaign too large for the heap stops here, before its visits are built (visit-budget.ts).
  if (options.heapLimitBytes !== undefined) checkVisitBudget(campaign, candidateVisitCount(windows, stars, dates), stars.length, options.heapLimitBytes);
  const all = candidateSlots(campaign, nights, windows, stars);
  const candidates = all.candidates.filter((d) => dates.has(d.localDate) && open(d));
  const whole: ScheduleProblem = {
    nights: left.nights,
    targets: stars.flatMap((s) => (s.scheduleTarget ? [s.scheduleTarget] : [])),
    slots: candidates.map((d) => d.slot),
    time: left.time,
    constraints: {
      minSpacingHours: constraints.minSpacingHours,
      onePerNight: constraints.minSpacingHours >= 12,
      sameNightSpacingHours: constraints.sameNightSpacingHours,
    },
    prior: priorVisits(past, rv.fittedStars, allNights),
  };
  const problem = campaign.time.mode === 'choose-nights' && campaign.time.halfNights ? splitHalves(whole, nights) : whole;
  return { campaign, rv, setups, stars, nights, windows, dropped, observed, past, left, candidates, detail: all.detail, problem };
}
