// Per-visit RV precision: photon noise scaled from the instrument's reference point through the
// S/N per pixel (star, sky, read noise, seeing and extinction at the airmass), the star's line
// width and spectral type; combined with the instrument floor and the star's jitter. Every
// factor is kept so a user can see where the budget goes.

import { inputError } from '../errors.js';
import type { Instrument } from './instrument.js';
import type { BandId } from './bands.js';
import { magnitudeIn } from './dwarf-colours.js';
import { referenceObservation, signalToNoise, instrumentEfficiency, type SignalToNoise } from './signal-to-noise.js';
import { lineWidthFactor, lineWidthKms } from './star-factors.js';
import { teffFactor } from './teff-information.js';

/** The star as the precision model sees it. */
export interface PrecisionStar {
  vmag: number;
  teffK: number;
  vsiniKms: number;
  jitterMps: number;
  /** Magnitudes given in other bands; a missing one comes from V and Teff (dwarf colours). */
  mags?: Partial<Record<BandId, number>>;
  /** Where the star came from (`targets.csv row 3`), for the error line of an unusable Teff. */
  source?: string;
}

export interface PrecisionOptions {
  /**
   * Telescope aperture (m) feeding the same spectrograph, for "what if it were on a larger
   * telescope". Omitted: the instrument's own aperture, where its reference point was measured.
   */
  apertureM?: number;
  /** Seeing FWHM at the zenith (arcsec), e.g. the site's median; omitted: the reference's. */
  seeingArcsec?: number;
}

/** Multiplicative factors on the reference photon noise; 1 means "as at the reference point". */
export interface PrecisionFactors {
  /** 10^(0.2 (m − m_ref)) in the instrument's band. */
  magnitude: number;
  /** (t / t_ref)^(−1/2). */
  exposure: number;
  /** (D / D_ref)^(−1). */
  aperture: number;
  /** 10^(0.2 k (X − X_ref)) at the instrument's wavelength. */
  extinction: number;
  /** √(η_ref / η): light lost at the fibre or slit as the seeing grows with airmass. */
  entrance: number;
  /** How far sky and read noise pull the S/N below the photon limit, relative to the reference. */
  detector: number;
  /** ((w0² + v sin i²) / (w0² + v sin i_ref²))^(3/4), w0 from the resolving power. */
  lineWidth: number;
  /** σ(Teff) / σ(Teff_ref) at fixed magnitude. */
  spectralType: number;
}

export interface PrecisionBudget {
  instrumentId: string;
  exposureSec: number;
  airmass: number;
  apertureM: number;
  /** The band and the star's magnitude in it (estimated from V and Teff when not given). */
  band: BandId;
  mag: number;
  magEstimated: boolean;
  /** S/N per pixel at `snrWavelengthNm`, and what it is made of. */
  snrPerPixel: number;
  snrWavelengthNm: number;
  snr: SignalToNoise;
  /** The instrument's photon-noise σ at its reference point (m/s). */
  referencePhotonSigmaMps: number;
  factors: PrecisionFactors;
  spectralTypeSource: string;
  /** Set when the star's Teff is where the information table is least reliable. */
  teffWarning?: string;
  /** Width of a non-rotating star's lines on this instrument (km/s). */
  lineWidthKms: number;
  /** referencePhotonSigmaMps times every factor. */
  photonSigmaMps: number;
  floorMps: number;
  /** √(photon² + floor²): what the instrument delivers for this star in one visit. */
  visitSigmaMps: number;
  jitterMps: number;
  /** √(photon² + jitter²): the part that averages down over visits. */
  whiteSigmaMps: number;
  /** √(visit² + jitter²): the scatter to expect about a Keplerian. */
  effectiveSigmaMps: number;
}

/** Spectral-type factor, or one input-error line naming the star when its Teff is off the table. */
function spectralType(instrument: Instrument, star: Pick<PrecisionStar, 'teffK' | 'source'>) {
  try {
    return teffFactor(star.teffK, instrument.reference.teffK, instrument.spectralRegion, instrument.teffFactors);
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    // A target's source reads `targets.csv row 3 (line 5)`: the file, then the place in it.
    const place = /^(.*?):? (row \d+ \(line \d+\))$/.exec(star.source ?? '');
    const where = place ? { file: place[1]!, where: place[2]! } : { file: star.source ?? 'command line' };
    throw inputError({ ...where, field: 'teffK', value: star.teffK, allowed: `${err.message} (instrument ${instrument.id})` });
  }
}

/** The photon-noise part of a budget. */
export type PhotonBudget = Omit<PrecisionBudget, 'floorMps' | 'visitSigmaMps' | 'jitterMps' | 'whiteSigmaMps' | 'effectiveSigmaMps'>;

/**
 * Photon noise of one visit (m/s) and its factors. σ ∝ 1/(S/N) at fixed spectrum ([Bouchy2001]),
 * so σ = σ_ref · (S/N_ref / S/N) · line-width factor · spectral-type factor, with S/N per pixel
 * from signalToNoise (star, sky, read noise; extinction and entrance losses at the airmass).
 * In the photon limit this is σ_ref · 10^(0.2 Δm) · (t/t_ref)^(−1/2) · (D/D_ref)^(−1) · ...
 * What does not depend on the airmass is computed once; the result gives the budget at any airmass.
 */
export function photonNoiseByAirmass(
  instrument: Instrument,
  star: Pick<PrecisionStar, 'vmag' | 'teffK' | 'vsiniKms' | 'mags' | 'source'>,
  exposureSec: number,
  options: PrecisionOptions = {},
): (airmass: number) => PhotonBudget {
  const ref = instrument.reference;
  const apertureM = options.apertureM ?? instrument.apertureM;
  const refObs = referenceObservation(instrument);
  const { mag, estimated } = magnitudeIn(star, instrument.band);
  const efficiency = instrumentEfficiency(instrument);
  const refSnr = signalToNoise(instrument, refObs, efficiency);
  const spectral = spectralType(instrument, star);
  const widthKms = lineWidthKms(instrument.resolvingPower);
  const lineWidth = lineWidthFactor(star.vsiniKms, ref.vsiniKms, widthKms);
  // Photon-limited S/N is √S; the detector factor is what sky and read noise take off it.
  const photonLimit = (s: SignalToNoise) => Math.sqrt(s.starElectrons) / s.snrPerPixel;
  return (airmass) => {
    const obs = { mag, exposureSec, airmass, apertureM, seeingZenithArcsec: options.seeingArcsec ?? refObs.seeingZenithArcsec };
    const snr = signalToNoise(instrument, obs, efficiency);
    const factors: PrecisionFactors = {
      magnitude: 10 ** (0.2 * (mag - ref.mag)),
      exposure: (exposureSec / ref.exposureSec) ** -0.5,
      aperture: instrument.apertureM / apertureM,
      extinction: 10 ** (0.2 * instrument.extinctionMagPerAirmass * (airmass - ref.airmass)),
      entrance: Math.sqrt(refSnr.coupling / snr.coupling),
      detector: photonLimit(snr) / photonLimit(refSnr),
      lineWidth,
      spectralType: spectral.factor,
    };
    const product = Object.values(factors).reduce((a, b) => a * b, 1);
    const budget: PhotonBudget = {
      instrumentId: instrument.id,
      exposureSec,
      airmass,
      apertureM,
      band: instrument.band,
      mag,
      magEstimated: estimated,
      snrPerPixel: snr.snrPerPixel,
      snrWavelengthNm: instrument.wavelengthNm,
      snr,
      referencePhotonSigmaMps: ref.photonSigmaMps,
      factors,
      spectralTypeSource: spectral.source,
      lineWidthKms: widthKms,
      photonSigmaMps: ref.photonSigmaMps * product,
    };
    if (spectral.warning) budget.teffWarning = spectral.warning;
    return budget;
  };
}

/** Photon noise of one visit at one airmass (photonNoiseByAirmass). */
export function photonNoise(
  instrument: Instrument,
  star: Pick<PrecisionStar, 'vmag' | 'teffK' | 'vsiniKms' | 'mags' | 'source'>,
  exposureSec: number,
  airmass: number,
  options: PrecisionOptions = {},
): PhotonBudget {
  return photonNoiseByAirmass(instrument, star, exposureSec, options)(airmass);
}

/** Quadrature sum √(Σ x²) of independent noise terms (common practice). */
export function quadratureSum(...terms: number[]): number {
  return Math.sqrt(terms.reduce((sum, x) => sum + x * x, 0));
}

/**
 * The precision budget of one visit: σ_visit² = σ_photon² + σ_floor², σ_white² = σ_photon² +
 * σ_jitter², σ_eff² = σ_visit² + σ_jitter² (common practice). The star's part once; the result
 * gives the budget at any airmass, e.g. for every candidate slot of a star.
 */
export function visitPrecisionByAirmass(
  instrument: Instrument,
  star: PrecisionStar,
  exposureSec: number,
  options: PrecisionOptions = {},
): (airmass: number) => PrecisionBudget {
  const photonAt = photonNoiseByAirmass(instrument, star, exposureSec, options);
  return (airmass) => {
    const photon = photonAt(airmass);
    const visitSigmaMps = quadratureSum(photon.photonSigmaMps, instrument.floorMps);
    // Filled in place: a spread copy of the photon part cost more than the arithmetic.
    return Object.assign(photon, {
      floorMps: instrument.floorMps,
      visitSigmaMps,
      jitterMps: star.jitterMps,
      whiteSigmaMps: quadratureSum(photon.photonSigmaMps, star.jitterMps),
      effectiveSigmaMps: quadratureSum(visitSigmaMps, star.jitterMps),
    });
  };
}

/** The precision budget of one visit at one airmass (visitPrecisionByAirmass). */
export function visitPrecision(
  instrument: Instrument,
  star: PrecisionStar,
  exposureSec: number,
  airmass: number,
  options: PrecisionOptions = {},
): PrecisionBudget {
  return visitPrecisionByAirmass(instrument, star, exposureSec, options)(airmass);
}
