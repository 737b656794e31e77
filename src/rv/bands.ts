// Photometric bands a target list or an instrument profile may use, with the effective
// wavelength and the photon flux of a zero-magnitude star ([Bessell1998]; Gaia G [Jordi2010]).

import type { BandId } from '../model.js';

export { BANDS, type BandId } from '../model.js';

export interface Band {
  id: BandId;
  /** Effective wavelength (nm). */
  wavelengthNm: number;
  /** Flux density of a zero-magnitude star, f_λ (erg cm⁻² s⁻¹ Å⁻¹). */
  zeroPointErgCm2SA: number;
}

/**
 * Effective wavelengths and f_λ zero points: V, R, I, J, H from [Bessell1998] (Table A2, Vega
 * system), Gaia G from [Jordi2010] (approximate, from memory).
 */
const TABLE: Record<BandId, Band> = {
  V: { id: 'V', wavelengthNm: 545, zeroPointErgCm2SA: 3.631e-9 },
  R: { id: 'R', wavelengthNm: 641, zeroPointErgCm2SA: 2.177e-9 },
  I: { id: 'I', wavelengthNm: 798, zeroPointErgCm2SA: 1.126e-9 },
  J: { id: 'J', wavelengthNm: 1220, zeroPointErgCm2SA: 3.147e-10 },
  H: { id: 'H', wavelengthNm: 1630, zeroPointErgCm2SA: 1.138e-10 },
  G: { id: 'G', wavelengthNm: 640, zeroPointErgCm2SA: 2.5e-9 },
};

export function band(id: BandId): Band {
  return TABLE[id];
}

/** Planck constant times the speed of light (J m), CODATA 2018 exact values. */
const HC_JM = 6.62607015e-34 * 299792458;

/**
 * Photons s⁻¹ m⁻² nm⁻¹ from a zero-magnitude star in the band: f_λ λ / (hc), with
 * 1 erg cm⁻² s⁻¹ Å⁻¹ = 10⁻² W m⁻² nm⁻¹ (common practice).
 */
export function zeroPointPhotonFlux(id: BandId): number {
  const b = TABLE[id];
  return (b.zeroPointErgCm2SA * 1e-2 * b.wavelengthNm * 1e-9) / HC_JM;
}
