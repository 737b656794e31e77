// The scheduler's plain-data interface: nights, candidate slots and targets in; chosen slots out.
// Nothing here depends on the sky, precision or orbit code: the caller turns those into slots.

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
}

/** One possible visit: a target observed from `startMs` for `durationSec` in one night. */
export interface CandidateSlot {
  slotId: string;
  targetId: string;
  nightIndex: number;
  /** Start of the visit, ms since 1970 (UTC). The visit occupies [startMs, startMs + durationSec). */
  startMs: number;
  /** Exposure plus readout plus acquisition. */
  durationSec: number;
  /** Per-visit RV uncertainty with jitter; the visit's weight is 1/sigma^2. */
  sigmaEffMps: number;
  /** Ephemeris targets: predicted orbital phase in cycles (0 = mid-transit) and its 1-sigma error. */
  phase?: number;
  phaseErr?: number;
  /**
   * Ephemeris targets of an eccentric orbit: the expected signal E[s] and E[s²] at this visit,
   * computed by the caller from the orbit's shape. Omitted: the circular closed form from phase.
   */
  signalMoments?: { m: number; q: number };
  /** Search targets: mid-exposure time in days (any fixed zero point, e.g. BJD_TDB). */
  midDays?: number;
}

interface TargetBase {
  id: string;
  /** Weight in the total utility; > 0. */
  priority: number;
  /** Semi-amplitude (for search targets: at periodMinDays). */
  kMps: number;
  /** K / sigma_K to reach. */
  goal: number;
}

/** A planet with an ephemeris: the information on K at the predicted phases. */
export interface EphemerisScheduleTarget extends TargetBase {
  kind: 'ephemeris';
}

/** A blind search: phase coverage over a period range; K scales as P^(-1/3) from periodMinDays. */
export interface SearchScheduleTarget extends TargetBase {
  kind: 'search';
  periodMinDays: number;
  periodMaxDays: number;
}

export type ScheduleTarget = EphemerisScheduleTarget | SearchScheduleTarget;

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
  /** At most one visit per target per night. */
  onePerNight: boolean;
}

export interface ScheduleProblem {
  nights: ScheduleNight[];
  targets: ScheduleTarget[];
  slots: CandidateSlot[];
  time: ScheduleTimeModel;
  constraints: ScheduleConstraints;
}

export interface ScheduleOptions {
  /** Seeds the order in which local search tries moves (and so breaks ties). */
  seed: number;
  /** Backup nights to rank (choose-nights mode). Default 5. */
  backups?: number;
  /** Periods in the log-spaced grid of a search target. Default 48. */
  searchGridSize?: number;
  /** Height of the soft cap above the goal (see utility.ts). Default 0.1. */
  overshootWeight?: number;
  /** Perturb-and-repair restarts after the first local optimum. Default: 30 up to 666 slots, then fewer (20,000 / slots), none above 20,000. */
  restarts?: number;
  /** Upper bound on local-search passes. Default 30. */
  maxPasses?: number;
  /** Called after the greedy pass and after every accepted local-search move with the total utility. */
  onProgress?: (utility: number, step: string) => void;
}

export interface TargetOutcome {
  targetId: string;
  kind: 'ephemeris' | 'search';
  visits: number;
  hours: number;
  /**
   * Ephemeris: expected information on K, sum w (s - mean s)^2, in (m/s)^-2.
   * Search: the same quantity implied by the grid's geometric-mean K/sigma_K at kMps.
   */
  informationPerMps2: number;
  sigmaKMps: number;
  kOverSigmaK: number;
  goal: number;
  /** This target's term of the total utility. */
  utility: number;
  /** Ephemeris targets: information / sum w; 1 is the best any schedule can do. */
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
