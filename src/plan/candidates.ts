// Candidate visits: from the visibility windows and the per-visit cost, the visit blocks the
// scheduler may choose among, one star at a time (a visit observes a star and so all its planets),
// each with its airmass, precision and the predicted phase of each planet.
import { DateTime } from 'luxon';
import { extent } from '../extent.js';
import { bjdTdbOnTrack } from '../astro/bjd.js';
import { earthTrack, type EarthTrack } from '../astro/earth-track.js';
import { properMotionVectorJ2000 } from '../astro/position.js';
import type { Night, Target, Window } from '../model.js';
import type { Campaign } from './campaign.js';
import type { VisitPhase } from './plan-schema.js';
import { overlapsTransit, phaseAt, phaseErrCycles, type TransitRule } from '../orbit/ephemeris.js';
import { semiAmplitudeMps } from '../orbit/semi-amplitude.js';
import { targetKMps } from '../orbit/target-k.js';
import { chooseExposureSec, fixedExposure, visitCostSec, type ExposureChoice } from '../rv/exposure.js';
import { normalQuantile } from '../rv/normal-cdf.js';
import { visitPrecisionByAirmass, type PrecisionBudget } from '../rv/precision.js';
import { TYPICAL_AIRMASS } from '../rv/target-detect.js';
import { moonSeparationDeg, moonTrack, type MoonTrack } from '../sky/moon-track.js';
import { airmassAt, preparePosition, siteClock, type SiteClock } from '../sky/target-position.js';
import type { CandidateSlot, ScheduleNight, ScheduleTarget } from '../schedule/types.js';
import { starNoise, whiteSigmaMps, type StarNoise } from '../rv/star-noise.js';
import { planetRows, starModel, starsOf } from './star-model.js';

/** Spacing of candidate start times inside a window (Crest's choice: fine enough for phase, coarse enough to stay fast). */
export const SLOT_STEP_MIN = 10;

/** A candidate visit as the optimiser gets it, with the evening it belongs to. */
export interface Candidate {
  slot: CandidateSlot;
  localDate: string;
}

/** What a candidate slot means for the plan, beyond what the scheduler needs (made only for the visits shown). */
export interface SlotDetail extends Candidate {
  exposureSec: number;
  airmass: number;
  moonSeparationDeg: number;
  midBjdTdb: number;
  /** Photon + floor; with all the jitter. */
  visitSigmaMps: number;
  effectiveSigmaMps: number;
  phases: VisitPhase[];
  /** S/N per pixel at the instrument's wavelength. */
  snrPerPixel: number;
}

/** One row of the target list: its role in the plan, or why it has none. */
export interface TargetSetup {
  target: Target;
  exposure: ExposureChoice;
  durationSec: number;
  /** K of a planet row; K at the shortest search period of a search row. */
  kMps?: number;
  role?: 'ephemeris' | 'search';
  /** Why a row is not scheduled. */
  skipped?: string;
}

/** One star: its rows, the exposure of its visits and the scheduler's view of it. */
export interface StarSetup {
  starId: string;
  /** The star's first row, which carries its star fields (shared by every row). */
  star: Target;
  rows: TargetSetup[];
  exposure: ExposureChoice;
  durationSec: number;
  noise: StarNoise;
  scheduleTarget?: ScheduleTarget;
}

/** Exposure (at a typical airmass) and the role of each row. */
export function setupTargets(campaign: Campaign): TargetSetup[] {
  const { instrument, goals } = campaign;
  return campaign.targets.map((target) => {
    const kMps = targetKMps(target);
    const goalSignificance = target.goalSignificance ?? goals.significance;
    // The target's own exposure or sigma wins; otherwise the fewest hours for its K within the
    // visits the campaign can give (src/rv/exposure.ts).
    const options = { seeingArcsec: campaign.site.medianSeeingArcsec, kMps, goalSignificance, maxVisits: visitCap(campaign, target) };
    const exposure =
      target.exposureSec === undefined
        ? chooseExposureSec(instrument, target, TYPICAL_AIRMASS, target.visitSigmaMps, options)
        : fixedExposure(instrument, target, TYPICAL_AIRMASS, target.exposureSec, options);
    const setup: TargetSetup = { target, exposure, durationSec: visitCostSec(instrument, exposure.exposureSec) };
    if (target.ephemeris && kMps !== undefined) {
      setup.role = 'ephemeris';
      setup.kMps = kMps;
    } else if (target.search) {
      const { periodMinDays, msiniEarth } = target.search;
      setup.role = 'search';
      setup.kMps = semiAmplitudeMps({ starMassSun: target.massSun, planetMassEarth: msiniEarth, periodDays: periodMinDays });
    } else {
      setup.skipped = target.ephemeris
        ? 'has an ephemeris but no planet mass or K: nothing to schedule for'
        : 'has neither an ephemeris with a planet nor a search range: nothing to schedule for';
    }
    return setup;
  });
}

/** Rows grouped by star, each star with its planets (in model order), its search and its information model. */
export function setupStars(campaign: Campaign, setups: TargetSetup[]): StarSetup[] {
  const byId = new Map(setups.map((s) => [s.target.id, s]));
  return [...starsOf(campaign.targets)].map(([starId, rows]) => {
    const rowSetups = rows.map((t) => byId.get(t.id)!);
    // The star's visits take the exposure its hardest planet (smallest K) asks for; without planets, the first row's.
    const lead = rowSetups.filter((r) => r.role === 'ephemeris').sort((a, b) => a.kMps! - b.kMps!)[0] ?? rowSetups[0]!;
    // Every row of the star is observed with that exposure.
    for (const row of rowSetups) Object.assign(row, { exposure: lead.exposure, durationSec: lead.durationSec });
    const star: StarSetup = {
      starId,
      star: lead.target,
      rows: rowSetups,
      exposure: lead.exposure,
      durationSec: lead.durationSec,
      noise: starNoise(lead.target, campaign.noise.nightlyJitterFraction),
    };
    const goalOf = (t: Target) => t.goalSignificance ?? campaign.goals.significance;
    const planets = planetRows(rows).map((t) => ({ id: t.id, priority: t.priority, kMps: byId.get(t.id)!.kMps!, goalSignificance: goalOf(t) }));
    const searchRow = rowSetups.find((s) => s.role === 'search');
    if (planets.length === 0 && !searchRow) return star;
    const target: ScheduleTarget = { id: starId, planets };
    if (lead.target.visitsPerNight !== undefined && lead.target.visitsPerNight > 1) target.visitsPerNight = lead.target.visitsPerNight;
    const caps = starCaps(campaign, lead.target);
    if (caps.maxVisits !== undefined) target.maxVisits = caps.maxVisits;
    if (caps.maxHours !== undefined) target.maxHours = caps.maxHours;
    const model = starModel(rows, campaign);
    if (model) target.model = model;
    if (searchRow) {
      const { periodMinDays, periodMaxDays } = searchRow.target.search!;
      target.search = {
        id: searchRow.target.id,
        priority: searchRow.target.priority,
        kMps: searchRow.kMps!,
        goalCompleteness: campaign.goals.searchCompleteness,
        periodMinDays,
        periodMaxDays,
      };
    }
    star.scheduleTarget = target;
    return star;
  });
}

/** The target list's stars as targets for the sky engine: one row per star, named by the star. */
export function starTargets(stars: StarSetup[]): Target[] {
  return stars.map((s) => ({ ...s.star, id: s.starId }));
}

/**
 * The most visits one target can get: its cap (maxVisits), and its visitsPerNight a night when visits are at least 12 h
 * apart (the scheduler's onePerNight), over the campaign's nights; no cap in hours mode or with
 * closer spacing.
 */
function visitCap(campaign: Campaign, target: Target): number {
  const capped = starCaps(campaign, target).maxVisits ?? Infinity;
  if (campaign.constraints.minSpacingHours < 12) return capped;
  const time = campaign.time;
  const nights = time.mode === 'choose-nights' ? time.nights : time.mode === 'given-nights' ? time.dates.length : Infinity;
  return Math.min(capped, nights * (target.visitsPerNight ?? 1));
}

/** A star's caps on visits and hours planned: its own columns, else the campaign's defaults. */
export function starCaps(campaign: Campaign, target: Target): { maxVisits?: number; maxHours?: number } {
  return { maxVisits: target.maxVisits ?? campaign.constraints.maxVisitsPerStar, maxHours: target.maxHours ?? campaign.constraints.maxHoursPerStar };
}

/** Clear-night probability of a night: the site's fraction, per month when given (common practice). */
export function clearProbability(clearFraction: number | number[], localDate: string): number {
  return typeof clearFraction === 'number' ? clearFraction : clearFraction[DateTime.fromISO(localDate).month - 1]!;
}

/** JD of an instant (the night's middle for nightly activity: minutes matter nothing there). */
const julianDate = (ms: number) => ms / 86_400_000 + 2_440_587.5;

export function scheduleNights(campaign: Campaign, nights: Night[]): ScheduleNight[] {
  return nights.map((night, index) => {
    const out: ScheduleNight = {
      index,
      localDate: night.localDate,
      clearProbability: clearProbability(campaign.site.clearFraction, night.localDate),
      hoursAvailable: night.darkHours,
    };
    if (night.darkStart && night.darkEnd) out.midBjdTdb = julianDate((night.darkStart.getTime() + night.darkEnd.getTime()) / 2);
    return out;
  });
}

/** The transit rule of a campaign: z for its two-sided confidence. */
export function transitRule(campaign: Campaign): TransitRule {
  return { zScore: normalQuantile((1 + campaign.transits.confidence) / 2), maxOrbitFraction: campaign.transits.maxOrbitFraction };
}

/** What a star's slots share on every night: its planets' ephemerides, its block's timing and its precision by airmass. */
interface StarSlotSetup {
  setup: StarSetup;
  ephemerides: { id: string; eph: NonNullable<Target['ephemeris']> }[];
  transiting: NonNullable<Target['ephemeris']>[];
  durationMs: number;
  /** From the block's start to mid-exposure. */
  midOffsetMs: number;
  halfExposureDays: number;
  precisionAt: (airmass: number) => PrecisionBudget;
}

function starSlotSetup(campaign: Campaign, setup: StarSetup): StarSlotSetup {
  const { instrument, site } = campaign;
  const { exposureSec } = setup.exposure;
  return {
    setup,
    ephemerides: setup.rows.filter((r) => r.role === 'ephemeris').map((r) => ({ id: r.target.id, eph: r.target.ephemeris! })),
    transiting: setup.rows.flatMap((r) => (r.target.ephemeris?.transitDurationHours !== undefined ? [r.target.ephemeris] : [])),
    durationMs: setup.durationSec * 1000,
    midOffsetMs: instrument.acquisitionSec * 1000 + (exposureSec * 1000) / 2,
    halfExposureDays: exposureSec / 2 / 86_400,
    precisionAt: visitPrecisionByAirmass(instrument, setup.star, exposureSec, { seeingArcsec: site.medianSeeingArcsec }),
  };
}

/** A night's shared state for its slots: its index, clock, Moon and the Earth's track. */
interface NightState {
  n: number;
  clock: SiteClock;
  moon: MoonTrack;
  earth: EarthTrack;
}

/** The candidate visits of a campaign and, for any of them, what it means for the plan. */
export interface CandidateSet {
  candidates: Candidate[];
  /** The visit's airmass, Moon distance, precision and phases, computed as the candidates were (the same numbers). */
  detail: (candidate: Candidate) => SlotDetail;
}

/**
 * Visit blocks every SLOT_STEP_MIN inside each of a star's windows (none whose exposure overlaps a
 * predicted transit of one of its planets, as transitRule says): acquisition, exposure, readout,
 * the whole block inside the window, with their white σ at the airmass of mid-exposure.
 * Per night the Earth's barycentric track (BJD_TDB) and the Moon; per star and night its place and
 * its J2000 direction with proper motion; per star its precision's airmass-free part. Only the
 * scheduler's part of each candidate is kept (a survey has millions); `detail` makes the rest for
 * the few visits a plan shows.
 */
export function candidateSlots(campaign: Campaign, nights: Night[], windows: Window[], stars: StarSetup[]): CandidateSet {
  const rule = transitRule(campaign);
  const byStar = new Map(stars.filter((s) => s.scheduleTarget).map((s) => [s.starId, starSlotSetup(campaign, s)]));
  const nightIndex = new Map(nights.map((n, i) => [n.localDate, i]));
  const perNight = new Map<string, Window[]>();
  for (const w of windows) {
    if (!byStar.has(w.targetId)) continue;
    const list = perNight.get(w.localDate);
    if (list) list.push(w);
    else perNight.set(w.localDate, [w]);
  }
  const states = new Map<string, NightState>();
  const candidates: Candidate[] = [];
  for (const [localDate, nightWindows] of perNight) {
    const n = nightIndex.get(localDate)!;
    const night = nights[n]!;
    const clock = siteClock(campaign.site, new Date((night.darkStart!.getTime() + night.darkEnd!.getTime()) / 2));
    const earth = earthTrack(extent(nightWindows.map((w) => w.start.getTime())).min, extent(nightWindows.map((w) => w.end.getTime())).max);
    const state = { n, clock, moon: moonTrack(night, clock), earth };
    states.set(localDate, state);
    for (const w of nightWindows) windowSlots(byStar.get(w.targetId)!, w, state, rule, candidates);
  }
  const detail = (c: Candidate): SlotDetail => slotDetail(byStar.get(c.slot.targetId)!, c, states.get(c.localDate)!);
  return { candidates, detail };
}

/** One window's slots, with the night's shared state, appended to `out`. */
function windowSlots(star: StarSlotSetup, w: Window, night: NightState, rule: TransitRule, out: Candidate[]): void {
  const { setup, transiting, durationMs, midOffsetMs, halfExposureDays } = star;
  const position = preparePosition(setup.star, night.clock);
  const direction = properMotionVectorJ2000(setup.star, night.clock.frame.epochYear);
  const stepMs = SLOT_STEP_MIN * 60_000;
  // Blocks start on whole minutes, so the plan reads 21:06, not 21:05:43.9.
  const firstMs = Math.ceil(w.start.getTime() / 60_000) * 60_000;
  for (let startMs = firstMs; startMs + durationMs <= w.end.getTime(); startMs += stepMs) {
    const midBjdTdb = bjdTdbOnTrack(night.earth, new Date(startMs + midOffsetMs), direction);
    if (transiting.some((eph) => overlapsTransit(eph, midBjdTdb - halfExposureDays, midBjdTdb + halfExposureDays, rule))) continue;
    const budget = star.precisionAt(airmassAt(position, startMs + midOffsetMs));
    const slot: CandidateSlot = {
      slotId: `${setup.starId}|${w.localDate}|${startMs}`,
      targetId: setup.starId,
      nightIndex: night.n,
      startMs,
      durationSec: setup.durationSec,
      whiteSigmaMps: whiteSigmaMps(budget.visitSigmaMps, setup.noise),
      midBjdTdb,
    };
    out.push({ slot, localDate: w.localDate });
  }
}

/** A candidate's airmass, Moon distance, precision and phases at mid-exposure, as windowSlots computes them. */
function slotDetail(star: StarSlotSetup, c: Candidate, night: NightState): SlotDetail {
  const { setup, ephemerides, midOffsetMs } = star;
  const position = preparePosition(setup.star, night.clock);
  const midMs = c.slot.startMs + midOffsetMs;
  const { midBjdTdb } = c.slot;
  const airmass = airmassAt(position, midMs);
  const budget = star.precisionAt(airmass);
  return {
    ...c,
    exposureSec: setup.exposure.exposureSec,
    airmass,
    moonSeparationDeg: moonSeparationDeg(night.moon, position.vector, midMs),
    midBjdTdb,
    visitSigmaMps: budget.visitSigmaMps,
    effectiveSigmaMps: budget.effectiveSigmaMps,
    phases: ephemerides.map(({ id, eph }) => ({ targetId: id, phase: phaseAt(eph, midBjdTdb), phaseErr: phaseErrCycles(eph, midBjdTdb) })),
    snrPerPixel: budget.snrPerPixel,
  };
}
