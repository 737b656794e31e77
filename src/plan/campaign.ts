// A campaign as the planner takes it (src/io/campaign.ts reads it): site, instrument, targets,
// window and settings. Units are in the names.

import type { Constraints, Site, Target, TimeModel } from '../model.js';
import type { Instrument } from '../rv/instrument.js';

/** How the star's jitter is split and how transits are kept out of visits. */
export interface NoiseSettings {
  /** Default fraction of the jitter variance shared by all visits of one night. */
  nightlyJitterFraction: number;
}

export interface TransitAvoidance {
  /** Keep visits out of the predicted transit with this probability (two-sided Gaussian). */
  confidence: number;
  /** Never remove more than this fraction of the orbit; beyond it, warn and keep the phases. */
  maxOrbitFraction: number;
}

export interface Goals {
  /** K / sigma_K to reach for targets with an ephemeris. */
  significance: number;
  /** The probability under the site's weather with which the time request (from need) reaches each goal. */
  probability: number;
  /** Detection completeness to reach for a blind search (src/schedule/objective-search.ts); default 0.5. */
  searchCompleteness: number;
}

/** The default completeness goal of a blind search: an even chance of detecting a planet of the search mass. */
export const DEFAULT_SEARCH_COMPLETENESS = 0.5;

/** One row of a campaign's observed file (src/io/observed.ts), before its time is resolved. */
export interface ObservedRow {
  targetId: string;
  midBjdTdb?: number;
  midUtc?: string;
  instrument: string;
  rvMps?: number;
  rvErrorMps?: number;
  /** 1-based data row and the line it ends on. */
  row: number;
  line: number;
}

export interface Campaign {
  name: string;
  file: string;
  site: Site;
  instrument: Instrument;
  targets: Target[];
  targetsFile: string;
  window: { start: string; end: string };
  time: TimeModel;
  constraints: Constraints;
  goals: Goals;
  noise: NoiseSettings;
  transits: TransitAvoidance;
  seed: number;
  /** Visits already made (the campaign's `observed` file), when it names one. */
  observed?: { file: string; rows: ObservedRow[] };
  /** Nights lost to weather or faults (local evening dates): never planned. */
  lostDates: string[];
}
