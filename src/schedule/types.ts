// The scheduler's plain-data interface: nights, candidate slots and stars in; chosen slots out.
// Nothing here depends on the sky or precision code: the caller turns those into slots, and each
// star brings its information model (src/rv/information-model.ts).
import type { StarModel } from '../rv/information-model.js';

/** One night that may hold visits. */
export interface ScheduleNight {
  /** Any integer, unique per night; slots refer to it. */
  index: number;
  /** The evening's local date, YYYY-MM-DD (labels only). */
  localDate: string;
  /** Probability that the night is clear, 0..1 (the weather model). */
  clearProbability: number;
  /** Hours of dark time that visits may fill; chosen visits in one night never sum to more. */
  hoursAvailable: number;
  /**
   * The night's middle on the slots' BJD_TDB scale (where nightly activity is evaluated; the planner gives the dark time's middle
   * as a JD(UTC), within 10 min of it); default: the mean of its slots.
   */
  midBjdTdb?: number;
  /**
   * choose-nights: a night already granted (one in progress when re-planning): open from the
   * start, never closed, and not counted in `time.nights`.
   */
  granted?: boolean;
  /**
   * The calendar night this one is part of (default: its own index). Nights that share it are
   * halves of one night, each chosen on its own: one weather draw, one nightly noise term, and one
   * count of a star's visits under constraints.onePerNight. Their slots must not overlap in time.
   */
  calendarNight?: number;
}

/** One possible visit: a star observed from `startMs` for `durationSec` in one night. */
export interface CandidateSlot {
  slotId: string;
  /** The star (ScheduleTarget.id). */
  targetId: string;
  nightIndex: number;
  /** Start of the visit, ms since 1970 (UTC). The visit occupies [startMs, startMs + durationSec). */
  startMs: number;
  /** Exposure plus readout plus acquisition. */
  durationSec: number;
  /** The visit's white noise (photon, floor, white part of the jitter); its weight is 1/sigma^2. */
  whiteSigmaMps: number;
  /** Mid-exposure time in days, BJD_TDB (search targets: any fixed zero point will do). */
  midBjdTdb: number;
}

/** A planet with an ephemeris: scored by the information on its K (src/rv/information.ts). */
export interface SchedulePlanet {
  id: string;
  /** Weight in the total utility; > 0. */
  priority: number;
  kMps: number;
  /** K / sigma_K to reach. */
  goalSignificance: number;
}

/** A blind search: detection completeness over a period range (objective-search.ts); K scales as P^(-1/3) from periodMinDays. */
export interface ScheduleSearch {
  id: string;
  priority: number;
  /** Semi-amplitude of the search mass at periodMinDays. */
  kMps: number;
  /** Completeness to reach, in (0, 1]. */
  goalCompleteness: number;
  periodMinDays: number;
  periodMaxDays: number;
}

/**
 * A star: what one visit observes. Its planets (in the order of `model.planets`) share every
 * visit through the star's information model; a blind search may ride along or stand alone.
 */
export interface ScheduleTarget {
  id: string;
  planets: SchedulePlanet[];
  /** The star's information model; required when it has planets. */
  model?: StarModel;
  search?: ScheduleSearch;
  /** With constraints.onePerNight: how many visits of the star one night may hold (default 1). */
  visitsPerNight?: number;
  /** Caps on the visits and on the hours (visit blocks) the plan gives the star; prior visits do not count (default: none). */
  maxVisits?: number;
  maxHours?: number;
}

/**
 * A visit already made (or kept before a re-planning time): it enters its star's information
 * and search sums as given and is never moved or removed. It uses no budget of the problem: the
 * caller gives the time model what is left.
 */
export interface PriorVisit {
  /** The star (ScheduleTarget.id). */
  targetId: string;
  /** The evening's local date: a visit on a problem night's date shares that night's nightly noise. */
  localDate: string;
  /** Mid-exposure, BJD_TDB days (the slots' midBjdTdb scale). */
  midBjdTdb: number;
  /** White noise of the visit (m/s); its weight is 1/sigma^2. */
  whiteSigmaMps: number;
  /** The middle of its night (midBjdTdb scale), where nightly activity is evaluated; default: the mean of that date's prior visits. */
  nightMidBjdTdb?: number;
  /**
   * The star's ephemeris prior already holds what this visit says about phases, periods and
   * eccentricity (an orbit fit of its RV): it then informs only the offset and the K's.
   */
  phaseInPrior?: boolean;
}

export type ScheduleTimeModel =
  /** Choose this many nights among the problem's nights. */
  | { mode: 'choose-nights'; nights: number }
  /** Every night of the problem is granted: decide what to do in each. */
  | { mode: 'given-nights' }
  /** At most this many hours of visits (durations summed), over any nights. */
  | { mode: 'hours'; hours: number };

export interface ScheduleConstraints {
  /** Minimum time between the starts of two visits of one target (hours); 0 for none. */
  minSpacingHours: number;
  /**
   * Nights govern a target's visits: at most its visitsPerNight (default 1) in one night, their
   * starts at least sameNightSpacingHours apart; minSpacingHours then holds between nights.
   */
  onePerNight: boolean;
  /** Least time between the starts of two visits of one target in one night (hours); default 0. */
  sameNightSpacingHours?: number;
}

export interface ScheduleProblem {
  nights: ScheduleNight[];
  targets: ScheduleTarget[];
  slots: CandidateSlot[];
  time: ScheduleTimeModel;
  constraints: ScheduleConstraints;
  /** Visits already made; they count as information only. */
  prior?: PriorVisit[];
}

export interface ScheduleOptions {
  /** Seeds the order in which local search tries moves (and so breaks ties). */
  seed: number;
  /** Backup nights to rank (choose-nights mode). Default 5. */
  backups?: number;
  /** Height of the soft cap above the goal (see utility.ts). Default 0.1. */
  overshootWeight?: number;
  /** Perturb-and-repair restarts after the first local optimum. Default: 30 up to 666 slots, then fewer (20,000 / slots), none above 20,000. */
  restarts?: number;
  /** Upper bound on local-search passes. Default 30. */
  maxPasses?: number;
  /** Called after the greedy pass and after every accepted local-search move with the total utility. */
  onProgress?: (utility: number, step: string) => void;
}

/** What the plan reaches for one planet or search (a star with two planets has two outcomes). */
export interface TargetOutcome {
  /** The planet's or search's id. */
  targetId: string;
  starId: string;
  kind: 'ephemeris' | 'search';
  /** Visits and hours of the star chosen by the plan (prior visits not included). */
  visits: number;
  /** The star's prior visits (ScheduleProblem.prior), and what they alone give (K/sigma_K, or a search's completeness). */
  priorVisits: number;
  priorValue: number;
  hours: number;
  /** Ephemeris: 1 / Var(K), every other parameter marginalised, in (m/s)^-2; sigma_K and K/sigma_K from it. */
  informationPerMps2?: number;
  sigmaKMps?: number;
  kOverSigmaK?: number;
  goalSignificance?: number;
  /** Search: the detection completeness at the search mass (objective-search.ts) and its goal. */
  completeness?: number;
  goalCompleteness?: number;
  /** This target's term of the total utility. */
  utility: number;
  /** Ephemeris targets: information / sum w; 1 is the best a white-noise, known-phase schedule can do. */
  informationEfficiency?: number;
}

export interface BackupNight {
  nightIndex: number;
  localDate: string;
  /** 1 = best. */
  rank: number;
  /** Utility added by the best schedule inside this night, given the plan. */
  utilityGain: number;
}

export interface ScheduleResult {
  /** Chosen slot ids, in time order. */
  slotIds: string[];
  /** Night indices with at least one visit (choose-nights: the chosen nights), ascending. */
  nightIndices: number[];
  backups: BackupNight[];
  targets: TargetOutcome[];
  utility: number;
  hours: number;
}
