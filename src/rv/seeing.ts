// Seeing at an airmass and the fraction of a star's light that enters a fibre or a slit.

import { erfc } from './normal-cdf.js';

/** The spectrograph's entrance on the sky. */
export type Entrance = { kind: 'fibre'; diameterArcsec: number } | { kind: 'slit'; widthArcsec: number };

/** Seeing FWHM (arcsec) at airmass X from the zenith value: θ(X) = θ_zenith · X^0.6 ([Roddier1981]). */
export function seeingAtAirmassArcsec(zenithArcsec: number, airmass: number): number {
  return zenithArcsec * airmass ** 0.6;
}

/** FWHM = 2 √(2 ln 2) σ for a Gaussian (common practice). */
const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

/**
 * Fraction of a Gaussian seeing disc of this FWHM inside the entrance, star centred (common
 * practice): a fibre of diameter d takes 1 − exp(−(d/2)² / (2σ²)); a slit of width w (long
 * enough to hold the whole profile) takes erf(w / (2√2 σ)).
 */
export function entranceCoupling(entrance: Entrance, seeingFwhmArcsec: number): number {
  const sigma = seeingFwhmArcsec / FWHM_PER_SIGMA;
  if (entrance.kind === 'fibre') return -Math.expm1(-((entrance.diameterArcsec / 2) ** 2) / (2 * sigma * sigma));
  return 1 - erfc(entrance.widthArcsec / (2 * Math.SQRT2 * sigma));
}

/**
 * Sky area (arcsec²) the entrance collects: the fibre's disc, or for a slit its width times
 * twice the seeing FWHM (the length a spectrum is extracted over; Crest's choice).
 */
export function entranceSkyAreaArcsec2(entrance: Entrance, seeingFwhmArcsec: number): number {
  if (entrance.kind === 'fibre') return Math.PI * (entrance.diameterArcsec / 2) ** 2;
  return entrance.widthArcsec * 2 * seeingFwhmArcsec;
}
