// The input data model below every layer (docs/design.md, "Data model"): site, targets,
// constraints, and the sky's products (nights, windows). The instrument is in src/rv/instrument.ts,
// the campaign in src/plan/campaign.ts, the plan's output in src/plan/plan-schema.ts. Units are in the names.

/** Photometric bands Crest knows (src/rv/bands.ts): Johnson V, Cousins R and I, 2MASS-like J and H, Gaia G. */
export const BANDS = ['V', 'R', 'I', 'J', 'H', 'G'] as const;
export type BandId = (typeof BANDS)[number];

export type { HorizonPoint, Site } from './site.js';

export interface Ephemeris {
  periodDays: number;
  periodErrDays: number;
  /** Mid-transit (or conjunction) time, BJD_TDB. */
  tcBjdTdb: number;
  tcErrDays: number;
  /** Transit duration (hours); when given, visits avoid the transit (Rossiter–McLaughlin effect). */
  transitDurationHours?: number;
}

export interface PlanetSpec {
  msiniEarth?: number;
  kMps?: number;
  ecc: number;
  omegaDeg: number;
  /** When given, e and ω are fitted: Gaussian prior of this width on e cos ω and e sin ω. */
  eccPriorSigma?: number;
}

export interface SearchSpec {
  periodMinDays: number;
  periodMaxDays: number;
  msiniEarth: number;
}

/**
 * One row of a target list: a planet or candidate (with an ephemeris), a blind search, or both.
 * Rows of one star share its star fields (coordinates, magnitude, Teff, mass, rotation, jitter,
 * activity); a visit observes the star and informs every planet of it.
 */
export interface Target {
  id: string;
  /** The star this row belongs to (the row's id when the list has no star column). */
  starId: string;
  raDeg: number;
  decDeg: number;
  pmRaMasYr: number;
  pmDecMasYr: number;
  epochYear: number;
  vmag: number;
  teffK: number;
  massSun: number;
  vsiniKms: number;
  jitterMps: number;
  /** Fraction of the jitter variance shared by all visits of one night; default: the campaign's. */
  nightlyJitterFraction?: number;
  /** Rotation period: the star's activity is then correlated across nights (quasi-periodic kernel). */
  rotationDays?: number;
  /** Activity amplitude (m/s) and coherence time (days) of that kernel. */
  activityMps?: number;
  activityCoherenceDays?: number;
  priority: number;
  /** K / sigma_K to reach for this target; overrides the campaign's goals.significance. */
  goalSignificance?: number;
  ephemeris?: Ephemeris;
  planet?: PlanetSpec;
  search?: SearchSpec;
  /** Magnitudes given in other bands (V is `vmag`); a missing one comes from V and Teff. */
  mags?: Partial<Record<BandId, number>>;
  /** Chromospheric activity log R'HK and surface gravity log g (cgs), when given. */
  logRhk?: number;
  logg?: number;
  /** The target's own exposure (s) or σ per visit (m/s, photon + floor); either wins over the chosen exposure. */
  exposureSec?: number;
  visitSigmaMps?: number;
  /** Visits of the star allowed in one night (default 1), spaced by the campaign's sameNightSpacingHours. */
  visitsPerNight?: number;
  /** Caps on what the campaign plans for the star ahead (visits already made do not count); the campaign's constraints give defaults. */
  maxVisits?: number;
  maxHours?: number;
  /** How the jitter was found: "as given", or the relations behind the default. */
  jitterSource?: string;
  /** Names of fields filled with documented defaults rather than given. */
  estimated: string[];
  /** Where the row came from, for messages: `targets.csv row 3`. */
  source: string;
}

export type { Constraints, TimeModel, TwilightLevel } from './constraints.js';

/** One night of the site (docs/design.md, "Data model"). Instants are UTC; null where the Sun never gets that low/high. */
export interface Night {
  /** The local date of the evening (site time zone), YYYY-MM-DD. */
  localDate: string;
  sunset: Date | null;
  sunrise: Date | null;
  civil: { dusk: Date | null; dawn: Date | null };
  nautical: { dusk: Date | null; dawn: Date | null };
  astronomical: { dusk: Date | null; dawn: Date | null };
  /** Dark span for the chosen twilight level; null when there is none this night. */
  darkStart: Date | null;
  darkEnd: Date | null;
  darkHours: number;
  /** Why a field is null (e.g. "Sun never below -12 deg"), or undefined. */
  note?: string;
  moon: {
    /** Illuminated fraction at the middle of the night, 0..1. */
    illumination: number;
    /** Moonrise and moonset between sunset and sunrise; null when the Moon does not rise or set then. */
    rise: Date | null;
    set: Date | null;
    upDuringDark: boolean;
  };
}

/** When one target is observable in one night. */
export interface Window {
  targetId: string;
  localDate: string;
  start: Date;
  end: Date;
  bestTime: Date;
  minAirmass: number;
  moonSeparationDeg: number;
}
