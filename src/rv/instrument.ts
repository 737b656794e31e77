// A spectrograph's profile as the precision model uses it (sites/instruments/*.json, read by
// src/io/instrument.ts). Units are in the names.

import type { BandId } from './bands.js';
import type { Entrance } from './seeing.js';
import type { SpectralRegion } from './teff-information.js';

/** The measured point every other star's photon noise is scaled from (src/rv/precision.ts). */
export interface InstrumentReference {
  /** Photon-noise σ (m/s) at this point. */
  photonSigmaMps: number;
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
