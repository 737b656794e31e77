// Per-visit RV precision: photon noise scaled from the instrument's reference point, combined
// with the instrument floor and the star's jitter. Every factor is kept so a user can see where
// the budget goes.

import type { Instrument } from '../model.js';
import { lineWidthFactor, spectralTypeFactor, type SpectralTypeSource } from './star-factors.js';

/** The star as the precision model sees it. */
export interface PrecisionStar {
  vmag: number;
  teffK: number;
  vsiniKms: number;
  jitterMps: number;
}

export interface PrecisionOptions {
  /**
   * Telescope aperture (m) feeding the same spectrograph, for "what if it were on a larger
   * telescope". Omitted: the instrument's own aperture, where its reference point was measured.
   */
  apertureM?: number;
}

/** Multiplicative factors on the reference photon noise; 1 means "as at the reference point". */
export interface PrecisionFactors {
  /** 10^(0.2 (V − V_ref)). */
  magnitude: number;
  /** (t / t_ref)^(−1/2). */
  exposure: number;
  /** (D / D_ref)^(−1). */
  aperture: number;
  /** 10^(0.2 k (X − 1)): the reference point is taken at the zenith. */
  extinction: number;
  /** ((w0² + v sin i²) / (w0² + v sin i_ref²))^(3/4). */
  lineWidth: number;
  /** σ(Teff) / σ(Teff_ref) at fixed V and v sin i. */
  spectralType: number;
}

export interface PrecisionBudget {
  instrumentId: string;
  exposureSec: number;
  airmass: number;
  apertureM: number;
  /** The instrument's photon-noise σ at its reference point (m/s). */
  referenceSigmaMps: number;
  factors: PrecisionFactors;
  spectralTypeSource: SpectralTypeSource;
  /** referenceSigmaMps times every factor. */
  photonMps: number;
  floorMps: number;
  /** √(photon² + floor²): what the instrument delivers for this star in one visit. */
  visitMps: number;
  jitterMps: number;
  /** √(visit² + jitter²): the scatter to expect about a Keplerian. */
  effMps: number;
}

/**
 * Photon noise of one visit (m/s) and its factors. σ ∝ 1/√(photons) (Bouchy, Pepe & Queloz 2001,
 * A&A 374, 733), hence σ = σ_ref · 10^(0.2 (V − V_ref)) · (t/t_ref)^(−1/2) · (D/D_ref)^(−1)
 * · 10^(0.2 k (X − 1)) · line-width factor · spectral-type factor (docs/references.md
 * [Photon-noise]); the reference point is at airmass 1.
 */
export function photonNoise(
  instrument: Instrument,
  star: Pick<PrecisionStar, 'vmag' | 'teffK' | 'vsiniKms'>,
  exposureSec: number,
  airmass: number,
  options: PrecisionOptions = {},
): { photonMps: number; factors: PrecisionFactors; spectralTypeSource: SpectralTypeSource; apertureM: number } {
  const ref = instrument.reference;
  const apertureM = options.apertureM ?? instrument.apertureM;
  const spectral = spectralTypeFactor(star.teffK, ref.teffK, instrument.teffFactors);
  const factors: PrecisionFactors = {
    magnitude: 10 ** (0.2 * (star.vmag - ref.vmag)),
    exposure: (exposureSec / ref.exposureSec) ** -0.5,
    aperture: instrument.apertureM / apertureM,
    extinction: 10 ** (0.2 * instrument.extinctionMagPerAirmass * (airmass - 1)),
    lineWidth: lineWidthFactor(star.vsiniKms, ref.vsiniKms, instrument.lineWidthKms),
    spectralType: spectral.factor,
  };
  const product = Object.values(factors).reduce((a, b) => a * b, 1);
  return { photonMps: ref.sigmaMps * product, factors, spectralTypeSource: spectral.source, apertureM };
}

/** Quadrature sum √(Σ x²) of independent noise terms (common practice). */
export function quadratureSum(...terms: number[]): number {
  return Math.sqrt(terms.reduce((sum, x) => sum + x * x, 0));
}

/**
 * The precision budget of one visit: σ_visit² = σ_photon² + σ_floor², σ_eff² = σ_visit² + σ_jitter²
 * (docs/references.md [Noise-budget]; common practice).
 */
export function visitPrecision(
  instrument: Instrument,
  star: PrecisionStar,
  exposureSec: number,
  airmass: number,
  options: PrecisionOptions = {},
): PrecisionBudget {
  const photon = photonNoise(instrument, star, exposureSec, airmass, options);
  const visitMps = quadratureSum(photon.photonMps, instrument.floorMps);
  return {
    instrumentId: instrument.id,
    exposureSec,
    airmass,
    apertureM: photon.apertureM,
    referenceSigmaMps: instrument.reference.sigmaMps,
    factors: photon.factors,
    spectralTypeSource: photon.spectralTypeSource,
    photonMps: photon.photonMps,
    floorMps: instrument.floorMps,
    visitMps,
    jitterMps: star.jitterMps,
    effMps: quadratureSum(visitMps, star.jitterMps),
  };
}
