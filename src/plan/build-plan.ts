// The pipeline of `crest plan`: nights → windows → candidate visits (plan-inputs.ts) → optimiser → weather → Plan.
// Pure: the campaign comes in already read and validated; nothing here reads or writes files.
import { DateTime } from 'luxon';
import { starBjdTdb } from '../astro/bjd.js';
import type { Night } from '../model.js';
import type { Campaign } from './campaign.js';
import type { Plan, PlannedVisit, TargetSummary } from './plan-schema.js';
import { phaseErrCycles } from '../orbit/ephemeris.js';
import { optimiseSchedule } from '../schedule/optimise.js';
import type { ScheduleResult } from '../schedule/types.js';
import { problemWeatherMargin } from '../schedule/utility.js';
import { simulateWeather } from '../schedule/weather.js';
import { transitRule, type SlotDetail, type TargetSetup } from './candidates.js';
import { needFromPlan } from '../schedule/need.js';
import { chosenHalves, type PlannedHalf, plannedDarkHours } from './half-nights.js';
import { planInputs } from './plan-inputs.js';
import type { StageListener } from './plan-stages.js';
import { planRequest } from './request.js';
import type { ReplanOptions } from './replan.js';
import { skyFacts } from './visit-causes.js';
import { planWarnings } from './warnings.js';
import type { MemoryBudget } from './visit-budget.js';

export const GENERATOR = 'crest 0.1.0';
/** Weather trials per plan (issue: 1,000). */
export const WEATHER_TRIALS = 1000;

export interface PlanOptions extends ReplanOptions, MemoryBudget {
  /** Overrides the campaign's seed. */
  seed?: number;
  weatherTrials?: number;
  onStage?: StageListener;
}

/** Builds the observing plan for a campaign. Deterministic for a seed. */
export function buildPlan(given: Campaign, options: PlanOptions = {}): Plan {
  const seed = options.seed ?? given.seed;
  const { site, window, time } = given;
  const { campaign, rv, setups, windows, dropped, nights, observed, past, left, candidates, detail, problem } = planInputs(given, options);
  // The margin over each goal the plan values, from the weather over the nights it may use (utility.ts).
  const overshootWeight = problemWeatherMargin(problem, campaign.goals.probability);
  options.onStage?.('optimisation');
  const result = optimiseSchedule(problem, { seed, overshootWeight });
  const trials = options.weatherTrials ?? WEATHER_TRIALS;
  options.onStage?.('weather trials');
  const weather = simulateWeather(problem, result, trials, seed, { overshootWeight });
  const bySlot = new Map(candidates.map((d) => [d.slot.slotId, d]));
  const ahead = result.slotIds.map((id) => plannedVisit(detail(bySlot.get(id)!), campaign));
  const visits = [...past.kept, ...ahead].sort((a, b) => a.startUtc.localeCompare(b.startUtc));
  const windowEndBjdTdb = (t: TargetSetup) => starBjdTdb(DateTime.fromISO(window.end, { zone: site.timeZone }).plus({ days: 1 }).toJSDate(), t.target);
  const lost = new Set(campaign.lostDates);
  const halvesChosen = time.mode === 'choose-nights' && time.halfNights;
  const chosen = halvesChosen ? chosenHalves(result.nightIndices, nights) : { dates: result.nightIndices.map((i) => nights[i]!.localDate), halves: [] };
  const plannedDates =
    time.mode === 'given-nights'
      ? time.dates.filter((d) => !lost.has(d)).sort()
      : [...new Set([...left.spentDates, ...past.kept.map((v) => v.localDate), ...chosen.dates])].sort();
  const plannedHalves = chosen.halves.filter((h) => !past.kept.some((v) => v.localDate === h.localDate));
  options.onStage?.('time request');
  const request = planRequest(
    needFromPlan(problem, result, campaign.goals.probability, trials, seed),
    new Map(result.slotIds.map((id) => [id, { ...bySlot.get(id)!.slot, localDate: bySlot.get(id)!.localDate }])),
    nights,
    plannedDates,
    plannedHalves,
  );
  result.slotIds.forEach((id, i) => {
    if (!request.requestedSlotIds.has(id)) ahead[i]!.spare = true;
  });
  const targets = setups.map((setup) => {
    const summary = targetSummary(setup, result, weather.targets, windowEndBjdTdb(setup));
    const need = request.byTarget.get(setup.target.id);
    if (need && summary.goalProbability !== undefined) summary.request = need;
    const fit = rv.fits.get(setup.target.id);
    const peak = rv.peaks.get(setup.target.id);
    return { ...summary, ...(fit ? { fit } : {}), ...(peak ? { peak } : {}) };
  });
  const exposureHours = visits.reduce((sum, v) => sum + v.exposureSec, 0) / 3600;
  const totalHours = visits.reduce((sum, v) => sum + v.durationSec, 0) / 3600;
  const dark = darkTime(nights, plannedDates, plannedHalves, visits);
  const plan: Plan = {
    schemaVersion: 1,
    generator: GENERATOR,
    ...(options.now
      ? { replan: { nowUtc: DateTime.fromJSDate(options.now, { zone: 'utc' }).toISO({ suppressMilliseconds: true })!, lostDates: campaign.lostDates } }
      : {}),
    ...(observed.length > 0 ? { observed } : {}),
    campaign: { ...campaign, seed },
    nights,
    plannedDates,
    ...(halvesChosen ? { plannedHalves } : {}),
    backups: backupNights(result.backups),
    visits,
    targets,
    totals: {
      nights: plannedDates.length - plannedHalves.length / 2,
      visits: visits.length,
      exposureHours,
      overheadHours: totalHours - exposureHours,
      totalHours,
      utility: result.utility,
      weatherMargin: overshootWeight,
      ...dark,
      allGoalsProbability: weather.allGoalsProbability,
      request: request.totals,
    },
    warnings: [],
  };
  plan.warnings = [...rv.warnings, ...planWarnings(plan, setups, skyFacts(windows, dropped, candidates), transitRule(campaign))];
  return plan;
}

/** Backup nights by date, best first: the two halves of a night appear once, where the better one ranks. */
function backupNights(backups: ScheduleResult['backups']): Plan['backups'] {
  const seen = new Set<string>();
  return backups
    .filter((b) => !seen.has(b.localDate) && seen.add(b.localDate))
    .map((b, i) => ({ localDate: b.localDate, rank: i + 1, utilityGain: b.utilityGain }));
}

/** Dark hours of the planned nights (half of those planned by one half), and those no visit uses (a visit's hours count on its own night). */
function darkTime(nights: Night[], plannedDates: string[], plannedHalves: PlannedHalf[], visits: PlannedVisit[]): { darkHours: number; idleHours: number } {
  const planned = new Set(plannedDates);
  const darkHours = plannedDarkHours(nights, plannedDates, plannedHalves);
  const usedHours = visits.filter((v) => planned.has(v.localDate)).reduce((sum, v) => sum + v.durationSec, 0) / 3600;
  return { darkHours, idleHours: Math.max(0, darkHours - usedHours) };
}

function plannedVisit(d: SlotDetail, campaign: Campaign): PlannedVisit {
  const start = DateTime.fromMillis(d.slot.startMs, { zone: 'utc' });
  return {
    starId: d.slot.targetId,
    localDate: d.localDate,
    startUtc: start.toISO({ suppressMilliseconds: true })!,
    startLocal: start.setZone(campaign.site.timeZone).toISO({ suppressMilliseconds: true })!,
    midBjdTdb: d.midBjdTdb,
    exposureSec: d.exposureSec,
    durationSec: d.slot.durationSec,
    airmass: d.airmass,
    moonSeparationDeg: d.moonSeparationDeg,
    phases: d.phases,
    visitSigmaMps: d.visitSigmaMps,
    snrPerPixel: d.snrPerPixel,
    effectiveSigmaMps: d.effectiveSigmaMps,
    whiteSigmaMps: d.slot.whiteSigmaMps,
  };
}

/**
 * K as the summary quotes it, with its period: a planet's at its period; a search's (K of the
 * search mass) at the logarithmic middle √(Pmin · Pmax) of its range, the geometric mean of K(P)
 * over the range for K ∝ P^(-1/3) at fixed mass [K-formula]. The scheduler itself takes K at Pmin.
 * A search has no σ_K: its score is its detection completeness (src/schedule/objective-search.ts).
 */
function quotedK(setup: TargetSetup): { kMps?: number; kPeriodDays?: number } {
  const { target } = setup;
  if (setup.role !== 'search' || !target.search || setup.kMps === undefined) {
    return { kMps: setup.kMps, ...(target.ephemeris ? { kPeriodDays: target.ephemeris.periodDays } : {}) };
  }
  const { periodMinDays, periodMaxDays } = target.search;
  const kPeriodDays = Math.sqrt(periodMinDays * periodMaxDays);
  return { kMps: setup.kMps * (kPeriodDays / periodMinDays) ** (-1 / 3), kPeriodDays };
}

function targetSummary(
  setup: TargetSetup,
  result: ScheduleResult,
  weather: { targetId: string; goalProbability: number }[],
  windowEndBjdTdb: number,
): TargetSummary {
  const { target } = setup;
  const summary: TargetSummary = {
    targetId: target.id,
    starId: target.starId,
    kind: setup.role ?? 'monitor',
    priority: target.priority,
    visits: 0,
    hours: 0,
    warnings: [],
  };
  if (target.ephemeris) summary.phaseErrAtEnd = phaseErrCycles(target.ephemeris, windowEndBjdTdb);
  const outcome = result.targets.find((t) => t.targetId === target.id);
  if (!setup.role || !outcome) return summary;
  const prior = outcome.kind === 'search' ? { priorCompleteness: outcome.priorValue } : { priorKOverSigmaK: outcome.priorValue };
  return {
    ...summary,
    ...quotedK(setup),
    visits: outcome.visits,
    hours: outcome.hours,
    ...(outcome.priorVisits > 0 ? { priorVisits: outcome.priorVisits, ...prior } : {}),
    sigmaKMps: outcome.sigmaKMps,
    kOverSigmaK: outcome.kOverSigmaK,
    goalSignificance: outcome.goalSignificance,
    completeness: outcome.completeness,
    goalCompleteness: outcome.goalCompleteness,
    goalProbability: weather.find((w) => w.targetId === target.id)?.goalProbability,
    informationEfficiency: outcome.informationEfficiency,
  };
}
