// Signal-to-noise ratio per spectral pixel at the instrument's reference wavelength: star
// photons through the atmosphere, the entrance and the spectrograph; sky in the entrance;
// detector read noise over the pixels summed across the order.

import type { Instrument } from './instrument.js';
import { zeroPointPhotonFlux } from './bands.js';
import { entranceCoupling, entranceSkyAreaArcsec2, seeingAtAirmassArcsec } from './seeing.js';

export interface Observation {
  /** Star magnitude in the instrument's band. */
  mag: number;
  exposureSec: number;
  airmass: number;
  /** Seeing FWHM at the zenith (arcsec). */
  seeingZenithArcsec: number;
  apertureM: number;
}

export interface SignalToNoise {
  snrPerPixel: number;
  /** Star, sky electrons and read-noise variance (e⁻²) in one spectral pixel. */
  starElectrons: number;
  skyElectrons: number;
  readVarianceE2: number;
  /** Seeing FWHM at the airmass (arcsec) and the fraction of the star's light entering. */
  seeingArcsec: number;
  coupling: number;
}

/** Wavelength width of one pixel (nm): λ / (R · pixels per resolution element) (common practice). */
export function pixelWidthNm(instrument: Instrument): number {
  return instrument.wavelengthNm / (instrument.resolvingPower * instrument.pixelsPerResolutionElement);
}

/** Clear collecting area (m²) of an aperture D: π D² / 4; the obstruction is in the efficiency. */
function areaM2(apertureM: number): number {
  return (Math.PI * apertureM * apertureM) / 4;
}

/** Photons per second per pixel before the efficiency: star and sky (zero points [Bessell1998]). */
function photonRates(instrument: Instrument, obs: Observation) {
  const perMag0 = zeroPointPhotonFlux(instrument.band) * areaM2(obs.apertureM) * pixelWidthNm(instrument);
  const seeingArcsec = seeingAtAirmassArcsec(obs.seeingZenithArcsec, obs.airmass);
  const coupling = entranceCoupling(instrument.entrance, seeingArcsec);
  // Extinction: 10^(−0.4 k X) at the instrument's wavelength (common practice).
  const star = perMag0 * 10 ** (-0.4 * (obs.mag + instrument.extinctionMagPerAirmass * obs.airmass)) * coupling;
  const sky = perMag0 * 10 ** (-0.4 * instrument.skyMagPerArcsec2) * entranceSkyAreaArcsec2(instrument.entrance, seeingArcsec);
  return { star, sky, seeingArcsec, coupling };
}

/** Read-noise variance in one extracted spectral pixel: spatial pixels × RN² (common practice). */
function readVariance(instrument: Instrument): number {
  return instrument.spatialPixels * instrument.readNoiseE ** 2;
}

/** The reference point as an observation. */
export function referenceObservation(instrument: Instrument): Observation {
  const ref = instrument.reference;
  return {
    mag: ref.mag,
    exposureSec: ref.exposureSec,
    airmass: ref.airmass,
    seeingZenithArcsec: ref.seeingArcsec / ref.airmass ** 0.6,
    apertureM: instrument.apertureM,
  };
}

/**
 * Overall efficiency η (detected electrons per photon reaching the telescope in the pixel's
 * band) that reproduces the reference S/N: with star and sky counts η·P_s, η·P_b and read
 * variance r, S/N² (η P_s + η P_b + r) = η² P_s², the positive root of that quadratic.
 */
export function instrumentEfficiency(instrument: Instrument): number {
  const obs = referenceObservation(instrument);
  const rates = photonRates(instrument, obs);
  const ps = rates.star * obs.exposureSec;
  const pb = rates.sky * obs.exposureSec;
  const snr2 = instrument.reference.snrPerPixel ** 2;
  const b = snr2 * (ps + pb);
  return (b + Math.sqrt(b * b + 4 * ps * ps * snr2 * readVariance(instrument))) / (2 * ps * ps);
}

/** S/N per pixel = S / √(S + B + n_spatial RN²) (the CCD equation, [Howell2006]). */
export function signalToNoise(instrument: Instrument, obs: Observation, efficiency = instrumentEfficiency(instrument)): SignalToNoise {
  const rates = photonRates(instrument, obs);
  const starElectrons = efficiency * rates.star * obs.exposureSec;
  const skyElectrons = efficiency * rates.sky * obs.exposureSec;
  const readVarianceE2 = readVariance(instrument);
  return {
    snrPerPixel: starElectrons / Math.sqrt(starElectrons + skyElectrons + readVarianceE2),
    starElectrons,
    skyElectrons,
    readVarianceE2,
    seeingArcsec: rates.seeingArcsec,
    coupling: rates.coupling,
  };
}
