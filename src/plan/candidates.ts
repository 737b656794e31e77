// Candidate visits: from the visibility windows and the per-visit cost, the visit blocks the
// scheduler may choose among, each with its airmass, precision and predicted orbital phase.
import { DateTime } from 'luxon';
import { bjdTdb } from '../astro/bjd.js';
import type { Campaign, Night, Target, Window } from '../model.js';
import { overlapsTransit, phaseAt, phaseErrCycles } from '../orbit/ephemeris.js';
import { semiAmplitudeMps } from '../orbit/semi-amplitude.js';
import { signalShape, type SignalShape } from '../orbit/signal-shape.js';
import { targetKMps } from '../orbit/target-k.js';
import { chooseExposureSec, fixedExposure, visitCostSec, type ExposureChoice } from '../rv/exposure.js';
import { visitPrecision } from '../rv/precision.js';
import { TYPICAL_AIRMASS } from '../rv/target-detect.js';
import { moonSeparationDeg, moonTrack } from '../sky/moon-track.js';
import { airmassAt, preparePosition, siteClock } from '../sky/target-position.js';
import type { CandidateSlot, ScheduleNight, ScheduleTarget } from '../schedule/types.js';

/** Spacing of candidate start times inside a window (Crest's choice: fine enough for phase, coarse enough to stay fast). */
export const SLOT_STEP_MIN = 10;

/** What a candidate slot means for the plan, beyond what the scheduler needs. */
export interface SlotDetail {
  slot: CandidateSlot;
  localDate: string;
  exposureSec: number;
  airmass: number;
  moonSeparationDeg: number;
  midBjdTdb: number;
  sigmaMps: number;
  /** S/N per pixel at the instrument's wavelength. */
  snrPerPixel: number;
}

export interface TargetSetup {
  target: Target;
  exposure: ExposureChoice;
  durationSec: number;
  /** The scheduler's view of the target, or undefined when it has no goal to schedule for. */
  scheduleTarget?: ScheduleTarget;
  /** Why a target is not scheduled. */
  skipped?: string;
  /** The signal's shape against phase, for a planet on an eccentric orbit. */
  shape?: SignalShape;
}

/** Exposure (at a typical airmass) and the scheduler's goal for each target. */
export function setupTargets(campaign: Campaign): TargetSetup[] {
  const { instrument, goals } = campaign;
  return campaign.targets.map((target) => {
    const kMps = targetKMps(target);
    const goal = target.goalSignificance ?? goals.significance;
    // The target's own exposure or sigma wins; otherwise the fewest hours for its K within the
    // visits the campaign can give (src/rv/exposure.ts).
    const options = { seeingArcsec: campaign.site.medianSeeingArcsec, kMps, significance: goal, maxVisits: visitCap(campaign) };
    const exposure =
      target.exposureSec === undefined
        ? chooseExposureSec(instrument, target, TYPICAL_AIRMASS, target.sigmaMps, options)
        : fixedExposure(instrument, target, TYPICAL_AIRMASS, target.exposureSec, options);
    const setup: TargetSetup = { target, exposure, durationSec: visitCostSec(instrument, exposure.exposureSec) };
    if (target.ephemeris && kMps !== undefined) {
      setup.scheduleTarget = { kind: 'ephemeris', id: target.id, priority: target.priority, kMps, goal };
      if (target.planet && target.planet.ecc > 0) setup.shape = signalShape(target.planet.ecc, target.planet.omegaDeg);
    } else if (target.search) {
      const { periodMinDays, periodMaxDays, massEarth } = target.search;
      const kAtMin = semiAmplitudeMps({ starMassSun: target.massSun, planetMassEarth: massEarth, periodDays: periodMinDays });
      setup.scheduleTarget = { kind: 'search', id: target.id, priority: target.priority, kMps: kAtMin, goal, periodMinDays, periodMaxDays };
    } else {
      setup.skipped = target.ephemeris ? 'has an ephemeris but no planet mass or K: nothing to schedule for' : 'has neither an ephemeris with a planet nor a search range: nothing to schedule for';
    }
    return setup;
  });
}

/**
 * The most visits one target can get: one a night when visits are at least 12 h apart (the
 * scheduler's onePerNight), over the campaign's nights; no cap in hours mode or with closer spacing.
 */
function visitCap(campaign: Campaign): number {
  if (campaign.constraints.minSpacingHours < 12) return Infinity;
  const time = campaign.time;
  return time.mode === 'choose-nights' ? time.nights : time.mode === 'given-nights' ? time.dates.length : Infinity;
}

/** Clear-night probability of a night: the site's fraction, per month when given (common practice). */
export function clearProbability(clearFraction: number | number[], localDate: string): number {
  return typeof clearFraction === 'number' ? clearFraction : clearFraction[DateTime.fromISO(localDate).month - 1]!;
}

export function scheduleNights(campaign: Campaign, nights: Night[]): ScheduleNight[] {
  return nights.map((night, index) => ({
    index,
    localDate: night.localDate,
    clearProbability: clearProbability(campaign.site.clearFraction, night.localDate),
    hoursAvailable: night.darkHours,
  }));
}

/**
 * Visit blocks every SLOT_STEP_MIN inside each window (none whose exposure overlaps a predicted
 * transit when the target gives its duration): acquisition, exposure, readout, the whole
 * block inside the window. Airmass, Moon distance, precision and phase at mid-exposure.
 */
export function candidateSlots(campaign: Campaign, nights: Night[], windows: Window[], setups: TargetSetup[]): SlotDetail[] {
  const { site, instrument } = campaign;
  const byTarget = new Map(setups.filter((s) => s.scheduleTarget).map((s) => [s.target.id, s]));
  const nightIndex = new Map(nights.map((n, i) => [n.localDate, i]));
  const perNight = new Map<string, Window[]>();
  for (const w of windows) {
    if (!byTarget.has(w.targetId)) continue;
    perNight.set(w.localDate, [...(perNight.get(w.localDate) ?? []), w]);
  }
  const details: SlotDetail[] = [];
  for (const [localDate, nightWindows] of perNight) {
    const n = nightIndex.get(localDate)!;
    const night = nights[n]!;
    const clock = siteClock(site, new Date((night.darkStart!.getTime() + night.darkEnd!.getTime()) / 2));
    const moon = moonTrack(night, clock);
    for (const w of nightWindows) {
      const setup = byTarget.get(w.targetId)!;
      const { target } = setup;
      const position = preparePosition(target, clock);
      const durationMs = setup.durationSec * 1000;
      const leadMs = instrument.acquisitionSec * 1000;
      const exposureMs = setup.exposure.exposureSec * 1000;
      const stepMs = SLOT_STEP_MIN * 60_000;
      // Blocks start on whole minutes, so the plan reads 21:06, not 21:05:43.9.
      const firstMs = Math.ceil(w.start.getTime() / 60_000) * 60_000;
      for (let startMs = firstMs; startMs + durationMs <= w.end.getTime(); startMs += stepMs) {
        const midMs = startMs + leadMs + exposureMs / 2;
        const midBjdTdb = bjdTdb(new Date(midMs), target.raDeg, target.decDeg);
        const halfExposureDays = setup.exposure.exposureSec / 2 / 86_400;
        if (target.ephemeris && overlapsTransit(target.ephemeris, midBjdTdb - halfExposureDays, midBjdTdb + halfExposureDays)) continue;
        const airmass = airmassAt(position, midMs);
        const budget = visitPrecision(instrument, target, setup.exposure.exposureSec, airmass, { seeingArcsec: site.medianSeeingArcsec });
        const slot: CandidateSlot = {
          slotId: `${target.id}|${localDate}|${startMs}`,
          targetId: target.id,
          nightIndex: n,
          startMs,
          durationSec: setup.durationSec,
          sigmaEffMps: budget.effMps,
          midDays: midBjdTdb,
        };
        if (target.ephemeris && setup.scheduleTarget?.kind === 'ephemeris') {
          slot.phase = phaseAt(target.ephemeris, midBjdTdb);
          slot.phaseErr = phaseErrCycles(target.ephemeris, midBjdTdb);
          if (setup.shape) slot.signalMoments = setup.shape.moments(slot.phase, slot.phaseErr);
        }
        details.push({
          slot,
          localDate,
          exposureSec: setup.exposure.exposureSec,
          airmass,
          moonSeparationDeg: moonSeparationDeg(moon, position.vector, midMs),
          midBjdTdb,
          sigmaMps: budget.visitMps,
          snrPerPixel: budget.snrPerPixel,
        });
      }
    }
  }
  return details;
}
