// The shared data model (DESIGN.md, "Data model"). Units are in the names.

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
  sourceNote: string;
  /** Path of the file it was read from. */
  file: string;
}

export interface InstrumentReference {
  sigmaMps: number;
  vmag: number;
  exposureSec: number;
  teffK: number;
  vsiniKms: number;
}

export interface Instrument {
  id: string;
  name: string;
  apertureM: number;
  /** Photon-noise precision at one reference point; all other stars scale from it. */
  reference: InstrumentReference;
  floorMps: number;
  readoutSec: number;
  acquisitionSec: number;
  minExposureSec: number;
  maxExposureSec: number;
  extinctionMagPerAirmass: number;
  /** Intrinsic plus instrumental line width w0 (km/s) for the rotation factor. */
  lineWidthKms: number;
  /** Optional override of the spectral-type factor: [teffK, factor] pairs, interpolated. */
  teffFactors?: [number, number][];
  sourceNote: string;
  file: string;
}

export interface Ephemeris {
  periodDays: number;
  periodErrDays: number;
  /** Mid-transit (or conjunction) time, BJD_TDB. */
  tcBjdTdb: number;
  tcErrDays: number;
}

export interface PlanetSpec {
  massEarth?: number;
  kMps?: number;
  ecc: number;
  omegaDeg: number;
}

export interface SearchSpec {
  periodMinDays: number;
  periodMaxDays: number;
  massEarth: number;
}

export interface Target {
  id: string;
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
  priority: number;
  ephemeris?: Ephemeris;
  planet?: PlanetSpec;
  search?: SearchSpec;
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

export interface Goals {
  /** K / sigma_K to reach for targets with an ephemeris. */
  significance: number;
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
  seed: number;
}
