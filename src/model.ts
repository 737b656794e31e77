// The shared data model (docs/design.md, "Data model"). Units are in the names.

import type { BandId } from './rv/bands.js';
import type { Entrance } from './rv/seeing.js';
import type { SpectralRegion } from './rv/teff-information.js';

export interface HorizonPoint {
  azimuthDeg: number;
  altitudeDeg: number;
}

export interface Site {
  id: string;
  name: string;
  latitudeDeg: number;
  /** East positive. */
  longitudeDeg: number;
  elevationM: number;
  /** IANA time-zone name. */
  timeZone: string;
  minAltitudeDeg: number;
  /** Local horizon; altitude interpolated linearly in azimuth (north = 0, east = 90). */
  horizon?: HorizonPoint[];
  /** Telescope hour-angle limits in hours: east is negative, west positive. */
  hourAngleLimitsHours?: { east: number; west: number };
  /** Fraction of clear nights: one number, or twelve monthly values (January first). */
  clearFraction: number | number[];
  /** Median seeing FWHM at the zenith (arcsec); omitted: each instrument's reference seeing. */
  medianSeeingArcsec?: number;
  /** Semester boundaries as month-day (`MM-DD`) pairs; B may end in the next year. */
  semesters?: { A: { start: string; end: string }; B: { start: string; end: string } };
  sourceNote: string;
  /** Path of the file it was read from. */
  file: string;
}

/** The measured point every other star's photon noise is scaled from (src/rv/precision.ts). */
export interface InstrumentReference {
  /** Photon-noise σ (m/s) at this point. */
  sigmaMps: number;
  /** The reference star's magnitude in the instrument's band. */
  mag: number;
  exposureSec: number;
  airmass: number;
  /** Seeing FWHM (arcsec) at that airmass. */
  seeingArcsec: number;
  /** S/N per pixel at the instrument's wavelengthNm. */
  snrPerPixel: number;
  teffK: number;
  vsiniKms: number;
}

export interface Instrument {
  id: string;
  name: string;
  apertureM: number;
  resolvingPower: number;
  /** Photometric band the profile's magnitudes are in. */
  band: BandId;
  /** Wavelength (nm) of the reference S/N and of the extinction coefficient. */
  wavelengthNm: number;
  /** Wavelength coverage [min, max] (nm). */
  coverageNm: [number, number];
  /** Which RV-information table applies (src/rv/teff-information.ts). */
  spectralRegion: SpectralRegion;
  /** Photon-noise precision at one reference point; all other stars scale from it. */
  reference: InstrumentReference;
  readNoiseE: number;
  pixelsPerResolutionElement: number;
  /** Detector pixels summed across the order into one spectral pixel. */
  spatialPixels: number;
  entrance: Entrance;
  /** Dark-sky surface brightness in the band (mag/arcsec²). */
  skyMagPerArcsec2: number;
  floorMps: number;
  readoutSec: number;
  acquisitionSec: number;
  minExposureSec: number;
  maxExposureSec: number;
  /** Extinction at wavelengthNm (mag per airmass). */
  extinctionMagPerAirmass: number;
  /** Optional override of the spectral-type factor: [teffK, factor] pairs, interpolated. */
  teffFactors?: [number, number][];
  /** Where each number comes from, by field name. */
  sources: Record<string, string>;
  sourceNote: string;
  file: string;
}

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
  massEarth?: number;
  kMps?: number;
  ecc: number;
  omegaDeg: number;
  /** When given, e and ω are fitted: Gaussian prior of this width on e cos ω and e sin ω. */
  eccPriorSigma?: number;
}

export interface SearchSpec {
  periodMinDays: number;
  periodMaxDays: number;
  massEarth: number;
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
  sigmaMps?: number;
  /** Visits of the star allowed in one night (default 1), spaced by the campaign's sameNightSpacingHours. */
  visitsPerNight?: number;
  /** How the jitter was found: "as given", or the relations behind the default. */
  jitterSource?: string;
  /** Names of fields filled with documented defaults rather than given. */
  estimated: string[];
  /** Where the row came from, for messages: `targets.csv row 3`. */
  source: string;
}

export type TwilightLevel = 'civil' | 'nautical' | 'astronomical';

export type TimeModel =
  | { mode: 'choose-nights'; nights: number }
  | { mode: 'given-nights'; dates: string[] }
  | { mode: 'hours'; hours: number };

export interface Constraints {
  twilight: TwilightLevel;
  maxAirmass: number;
  moonSeparationDeg: number;
  /** Minimum spacing between two visits of one target (hours). */
  minSpacingHours: number;
  /** When visits are one a night (minSpacingHours >= 12): least spacing of a star's visits within one night, start to start, for stars with visitsPerNight > 1 (hours). */
  sameNightSpacingHours: number;
  /** Windows shorter than this are dropped (minutes). */
  minWindowMinutes: number;
}

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
}

/** One row of a campaign's observed file (src/io/observed.ts), before its time is resolved. */
export interface ObservedRow {
  targetId: string;
  midBjdTdb?: number;
  midUtc?: string;
  instrument: string;
  rvMps?: number;
  rvErrMps?: number;
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

/** Predicted orbital phase of one planet at a visit (0 = mid-transit) and its 1-sigma error. */
export interface VisitPhase {
  targetId: string;
  phase: number;
  phaseErr: number;
}

/** One planned observation: a visit observes a star (and so every planet of it). */
export interface PlannedVisit {
  starId: string;
  localDate: string;
  /** Start of the visit block, acquisition included (the exposure starts acquisitionSec later), ISO 8601 UTC. */
  startUtc: string;
  /** The same instant (start of the block, acquisition included) in the site's zone, ISO 8601 with offset. */
  startLocal: string;
  /** Mid-exposure time as BJD_TDB. */
  midBjdTdb: number;
  exposureSec: number;
  /** Exposure plus readout plus acquisition. */
  durationSec: number;
  airmass: number;
  moonSeparationDeg: number;
  /** Predicted phase of each planet of the star that has an ephemeris. */
  phases: VisitPhase[];
  /** Per-visit precision (photon + floor), with all the jitter, and its white part (without the nightly share). */
  sigmaMps: number;
  sigmaEffMps: number;
  sigmaWhiteMps: number;
  /** S/N per pixel at the instrument's reference wavelength. */
  snrPerPixel: number;
  /** A visit before the re-planning time (`--now`), kept as it was planned; absent for visits ahead. */
  kept?: true;
  /** plan.ics SEQUENCE (RFC 5545 3.8.7.4) of this visit's event, counted across re-plans; absent when 0. */
  icsSequence?: number;
}

/** A visit already made, from the campaign's observed file. */
export interface ObservedVisit {
  /** The row's id as given (a star or a planet) and the star it observed. */
  targetId: string;
  starId: string;
  /** Mid-exposure, BJD_TDB (converted from UTC when the file gave UTC) and ISO 8601 UTC. */
  midBjdTdb: number;
  midUtc: string;
  /** The local date of the evening the visit belongs to (site zone), YYYY-MM-DD. */
  localDate: string;
  instrument: string;
  /** Measured RV and its uncertainty (m/s), when the file gives them. */
  rvMps?: number;
  rvErrMps?: number;
  /** The white noise the information model gives this visit: rvErrMps (or the instrument's σ) with the white jitter. */
  sigmaWhiteMps: number;
  /** `observed.csv row 3`. */
  source: string;
}

/** The re-planning state: the instant before which nothing moves, and nights lost to weather or faults. */
export interface Replan {
  nowUtc: string;
  lostDates: string[];
}

export interface TargetSummary {
  targetId: string;
  starId: string;
  kind: 'ephemeris' | 'search' | 'monitor';
  priority: number;
  kMps?: number;
  visits: number;
  hours: number;
  sigmaKMps?: number;
  kOverSigmaK?: number;
  goal?: number;
  /** Probability of reaching the goal under the site's weather (simulated). */
  goalProbability?: number;
  /** (sigma^2/N) / Var(K): 1 is the best any schedule can do. */
  informationEfficiency?: number;
  /** 1-sigma phase error at the window's end. */
  phaseErrAtEnd?: number;
  /** Visits of the star already made (observed file) or kept (before `--now`); `visits` counts only those planned ahead. */
  priorVisits?: number;
  /** K/sigma_K the prior visits alone give (ephemeris targets). */
  priorKOverSigmaK?: number;
  /** The orbit fitted to the RVs so far, beside the catalogue values the plan started from. */
  fit?: OrbitUpdate;
  /** Blind search: the strongest periodogram peak of the RVs so far (offered, never adopted). */
  peak?: { periodDays: number; kMps: number; fap: number; significant: boolean };
  warnings: string[];
}

/** A planet's K and ephemeris as fitted to RVs, with 1-sigma errors. */
export interface FittedOrbit {
  kMps: number;
  kErrMps: number;
  tcBjdTdb: number;
  tcErrDays: number;
  periodDays: number;
  periodErrDays: number;
}

/** What a fit of the RVs so far changed for one planet (1-sigma errors). */
export interface OrbitUpdate extends FittedOrbit {
  points: number;
  catalogue: { kMps?: number; tcBjdTdb: number; tcErrDays: number; periodDays: number; periodErrDays: number };
}

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
  /** Next-best nights in choose-nights mode, best first. */
  backups: { localDate: string; rank: number; utilityGain: number }[];
  visits: PlannedVisit[];
  targets: TargetSummary[];
  totals: { nights: number; visits: number; exposureHours: number; overheadHours: number; totalHours: number; utility: number };
  warnings: string[];
}
