// A slow, independent reference for carrying one instrument's measured precision over to
// another: photon counts per pixel from first principles and σ from the line-width law.
//
// σ ∝ Θ^(3/2) / (W √I) per line ([BeattyGaudi2015]); with I the photons per unit velocity
// (S/N² per pixel over the pixel's velocity width) and a number of lines proportional to the
// logarithmic wavelength coverage, σ ∝ Θ^(3/2) √(Δv_pixel / ln(λmax/λmin)) / (S/N per pixel).

import type { Instrument } from '../../src/rv/instrument.js';

const C_KMS = 299792.458;

export interface TransferView {
  resolvingPower: number;
  pixelsPerResolutionElement: number;
  coverageNm: [number, number];
  /** Width of a slow rotator's lines (km/s). */
  lineWidthKms: number;
}

/** σ at S/N per pixel `snrB` on B, from σ at `snrA` on A, for the same star. */
export function transferSigmaMps(a: TransferView, sigmaA: number, snrA: number, b: TransferView, snrB: number): number {
  const dv = (x: TransferView) => C_KMS / x.resolvingPower / x.pixelsPerResolutionElement;
  const lines = (x: TransferView) => Math.log(x.coverageNm[1] / x.coverageNm[0]);
  return sigmaA * (snrA / snrB) * (b.lineWidthKms / a.lineWidthKms) ** 1.5 * Math.sqrt((dv(b) / dv(a)) * (lines(a) / lines(b)));
}

/**
 * Electrons per pixel for a star of magnitude `mag` in V (photon flux of V = 0: about 1000 photons
 * s⁻¹ cm⁻² Å⁻¹ at 550 nm, common practice), with an overall efficiency and a centred Gaussian seeing
 * disc in a fibre.
 */
export function electronsPerPixel(
  instrument: Instrument,
  mag: number,
  exposureSec: number,
  airmass: number,
  seeingAtAirmassArcsec: number,
  efficiency: number,
): number {
  const photonsCm2SA = 1000 * 10 ** (-0.4 * (mag + instrument.extinctionMagPerAirmass * airmass));
  const areaCm2 = (Math.PI * (instrument.apertureM * 100) ** 2) / 4;
  const pixelA = (10 * instrument.wavelengthNm) / (instrument.resolvingPower * instrument.pixelsPerResolutionElement);
  const sigma = seeingAtAirmassArcsec / 2.3548;
  const d = instrument.entrance.kind === 'fibre' ? instrument.entrance.diameterArcsec : NaN;
  const coupling = 1 - Math.exp(-((d / 2) ** 2) / (2 * sigma * sigma));
  return photonsCm2SA * areaCm2 * pixelA * coupling * exposureSec * efficiency;
}
