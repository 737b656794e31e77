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
