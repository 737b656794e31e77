import { z } from 'zod';
import { bjd, fraction, isoDate, isoInstant, nonNegative, num, positive, wholeNonNegative } from '../field-schemas.js';
import type { Night } from '../model.js';
import type { Campaign } from './campaign.js';
import { fittedOrbitSchema } from '../rv/fitted-orbit.js';

// The plan's output parts (plan.json, docs/design.md "Data model"): each shape is written once,
// here, as a zod schema; the types are inferred from it and io/plan-json.ts reads a saved plan
// with the same schemas. Units are in the names.

/** Predicted orbital phase of one planet at a visit (0 = mid-transit) and its 1-sigma error. */
export const visitPhaseSchema = z.object({ targetId: z.string(), phase: num, phaseErr: nonNegative });
export type VisitPhase = z.output<typeof visitPhaseSchema>;

/** One planned observation: a visit observes a star (and so every planet of it). */
export const plannedVisitSchema = z.object({
  starId: z.string(),
  localDate: isoDate,
  /** Start of the visit block, acquisition included (the exposure starts acquisitionSec later), ISO 8601 UTC. */
  startUtc: isoInstant,
  /** The same instant (start of the block, acquisition included) in the site's zone, ISO 8601 with offset. */
  startLocal: z.string(),
  /** Mid-exposure time as BJD_TDB. */
  midBjdTdb: bjd,
  exposureSec: positive,
  /** Exposure plus readout plus acquisition. */
  durationSec: positive,
  airmass: num.min(1, 'an airmass of 1 or more'),
  moonSeparationDeg: num.min(0, 'degrees from 0 to 180').max(180, 'degrees from 0 to 180'),
  /** Predicted phase of each planet of the star that has an ephemeris. */
  phases: z.array(visitPhaseSchema),
  /** Per-visit precision (photon + floor), with all the jitter, and its white part (without the nightly share). */
  visitSigmaMps: positive,
  effectiveSigmaMps: positive,
  whiteSigmaMps: positive,
  /** S/N per pixel at the instrument's reference wavelength. */
  snrPerPixel: positive,
  /** A visit before the re-planning time (`--now`), kept as it was planned; absent for visits ahead. */
  kept: z.literal(true).optional(),
  /** A visit beyond the time request (time from need): it uses spare time of the nights asked for. Absent for visits the request holds. */
  spare: z.literal(true).optional(),
  /** plan.ics SEQUENCE (RFC 5545 3.8.7.4) of this visit's event, counted across re-plans; absent when 0. */
  icsSequence: wholeNonNegative.optional(),
});
export type PlannedVisit = z.output<typeof plannedVisitSchema>;

/** A visit already made, from the campaign's observed file. */
export const observedVisitSchema = z.object({
  /** The row's id as given (a star or a planet) and the star it observed. */
  targetId: z.string(),
  starId: z.string(),
  /** Mid-exposure, BJD_TDB (converted from UTC when the file gave UTC) and ISO 8601 UTC. */
  midBjdTdb: bjd,
  midUtc: isoInstant,
  /** The local date of the evening the visit belongs to (site zone), YYYY-MM-DD. */
  localDate: isoDate,
  instrument: z.string(),
  /** Measured RV and its uncertainty (m/s), when the file gives them. */
  rvMps: num.optional(),
  rvErrorMps: positive.optional(),
  /** The white noise the information model gives this visit: rvErrorMps (or the instrument's σ) with the white jitter. */
  whiteSigmaMps: positive,
  /** `observed.csv row 3`. */
  source: z.string(),
});
export type ObservedVisit = z.output<typeof observedVisitSchema>;

/** The re-planning state: the instant before which nothing moves, and nights lost to weather or faults. */
export const replanSchema = z.object({ nowUtc: isoInstant, lostDates: z.array(isoDate) });
export type Replan = z.output<typeof replanSchema>;

/** What a fit of the RVs so far changed for one planet (1-sigma errors). */
export const orbitUpdateSchema = fittedOrbitSchema.extend({
  points: nonNegative,
  catalogue: z.object({ kMps: num.optional(), tcBjdTdb: bjd, tcErrDays: nonNegative, periodDays: positive, periodErrDays: nonNegative }),
});
export type OrbitUpdate = z.output<typeof orbitUpdateSchema>;

export const targetSummarySchema = z.object({
  targetId: z.string(),
  starId: z.string(),
  kind: z.enum(['ephemeris', 'search', 'monitor']),
  priority: positive,
  kMps: nonNegative.optional(),
  /**
   * The period at which kMps is quoted: the ephemeris period; for a blind search (K of its search
   * mass) the logarithmic middle √(Pmin · Pmax) of its range, where K is the geometric mean of
   * K(P) over the range (K ∝ P^(-1/3)). Absent in plans of older versions.
   */
  kPeriodDays: positive.optional(),
  visits: wholeNonNegative,
  hours: nonNegative,
  sigmaKMps: nonNegative.optional(),
  kOverSigmaK: nonNegative.optional(),
  goalSignificance: positive.optional(),
  /** Blind search: expected detection completeness at the search mass over its period range, and its goal (src/schedule/objective-search.ts). */
  completeness: fraction.optional(),
  goalCompleteness: fraction.optional(),
  /** Probability of reaching the goal under the site's weather (simulated). */
  goalProbability: fraction.optional(),
  /** Time from need: what the goal asks of this target's star (src/schedule/need.ts). Absent in plans of older versions. */
  request: z
    .object({
      /** Fewest of the planned visits (in order of value) that reach this target's goal with the campaign's probability; all of them when none do. */
      neededVisits: wholeNonNegative,
      /** Whether that probability is reached at all with the planned visits. */
      reachable: z.boolean(),
      /** The star's request: the largest need of its planets and search, and the hours of those visits with overheads. */
      visits: wholeNonNegative,
      hours: nonNegative,
      /** Probability of reaching this target's goal with the star's requested visits alone. */
      goalProbability: fraction,
    })
    .optional(),
  /** (sigma^2/N) / Var(K): 1 is the best any schedule can do. */
  informationEfficiency: nonNegative.optional(),
  /** 1-sigma phase error at the window's end. */
  phaseErrAtEnd: nonNegative.optional(),
  /** Visits of the star already made (observed file) or kept (before `--now`); `visits` counts only those planned ahead. */
  priorVisits: nonNegative.optional(),
  /** K/sigma_K the prior visits alone give (ephemeris targets). */
  priorKOverSigmaK: nonNegative.optional(),
  /** Completeness the prior visits alone give (searches). */
  priorCompleteness: fraction.optional(),
  /** The orbit fitted to the RVs so far, beside the catalogue values the plan started from. */
  fit: orbitUpdateSchema.optional(),
  /** Blind search: the strongest periodogram peak of the RVs so far (offered, never adopted). */
  peak: z.object({ periodDays: positive, kMps: nonNegative, fap: fraction, significant: z.boolean() }).optional(),
  warnings: z.array(z.string()),
});
export type TargetSummary = z.output<typeof targetSummarySchema>;

/** A planned night held by one half of its dark time (half-nights.ts). */
export const plannedHalfSchema = z.object({ localDate: isoDate, half: z.enum(['first', 'second']) });

/** A next-best night in choose-nights mode (rank 1 is the best). */
export const backupNightSchema = z.object({ localDate: isoDate, rank: num, utilityGain: num });

/** Time from need over the whole plan: the visits the goals need, the nights that hold them and the spare time. */
export const requestTotalsSchema = z.object({
  /** The chosen probability of reaching each goal under the weather (campaign goals.probability). */
  probability: fraction,
  visits: wholeNonNegative,
  hours: nonNegative,
  /** Nights holding requested visits, and those of them whose requested visits all fit in one half of the dark time. */
  /** A night planned by one half counts one half. */
  nights: nonNegative,
  halfNights: z.array(plannedHalfSchema),
  /** Dark hours of the planned nights that no requested visit uses. */
  spareHours: nonNegative,
});
export type RequestTotals = z.output<typeof requestTotalsSchema>;

/** The plan's sums over all visits. */
export const planTotalsSchema = z.object({
  nights: nonNegative,
  visits: nonNegative,
  exposureHours: nonNegative,
  overheadHours: nonNegative,
  totalHours: nonNegative,
  utility: num,
  /** The margin over each goal the planner values (the overshoot weight, src/schedule/utility.ts weatherMargin). Absent in plans of older versions. */
  weatherMargin: nonNegative.optional(),
  /** Dark hours (the campaign's twilight) of the planned nights, and how many of them no visit uses. Absent in plans of older versions. */
  darkHours: nonNegative.optional(),
  idleHours: nonNegative.optional(),
  /** Fraction of weather trials in which every planet and search reaches its goal. Absent in plans of older versions. */
  allGoalsProbability: fraction.optional(),
  /** Time from need. Absent in plans of older versions. */
  request: requestTotalsSchema.optional(),
});
export type PlanTotals = z.output<typeof planTotalsSchema>;

/** One night count of a nights sweep: what the plan for that many nights gives. */
export const sweepRowSchema = z.object({
  nights: wholeNonNegative,
  visits: wholeNonNegative,
  totalHours: nonNegative,
  darkHours: nonNegative,
  idleHours: nonNegative,
  allGoalsProbability: fraction,
  /** Time from need at that count: the visits and hours requested, and how many goals reach the campaign's probability. Absent in plans of older versions. */
  requestedVisits: wholeNonNegative.optional(),
  requestedHours: nonNegative.optional(),
  goalsAtProbability: wholeNonNegative.optional(),
  /** P(goal) with weather of every planet and search, in the plan's target order. */
  goals: z.array(z.object({ targetId: z.string(), goalProbability: fraction })),
});
export type SweepRow = z.output<typeof sweepRowSchema>;

/** The whole plan (plan.json). The campaign and nights are the inputs and sky products as used. */
export interface Plan {
  /** Present when the plan was made with `--now`: what was kept, and which nights were dropped. */
  replan?: Replan;
  /** Visits already made (the campaign's observed file), in time order. */
  observed?: ObservedVisit[];
  schemaVersion: 1;
  generator: string;
  campaign: Campaign;
  nights: Night[];
  /** Nights chosen (choose-nights), given, or used (hours). */
  plannedDates: string[];
  /** choose-nights with halfNights: the planned dates of which the plan holds one half only (the rest are whole). */
  plannedHalves?: z.output<typeof plannedHalfSchema>[];
  /** Next-best nights in choose-nights mode, best first. */
  backups: z.output<typeof backupNightSchema>[];
  visits: PlannedVisit[];
  targets: TargetSummary[];
  totals: PlanTotals;
  /** `crest plan --sweep-nights A:B`: the campaign planned for each night count from A to B. */
  nightsSweep?: SweepRow[];
  warnings: string[];
}
