// How the star itself changes the photon-noise RV precision at fixed magnitude and exposure:
// rotation (line width) and spectral type (number and depth of lines). Both are ratios against
// the instrument's reference star, so the reference point is reproduced exactly.

import { interpolateTable } from './star-defaults.js';

/**
 * Line-width factor σ(v sin i) / σ(v sin i_ref) = ((w0² + v sin i²) / (w0² + v sin i_ref²))^(3/4).
 *
 * Derived from the information content of a Gaussian line (docs/references.md [Line-width]): a line of
 * fixed equivalent width W and Gaussian width s has depth ∝ W / s, and the RV information
 * ∫ (dF/dv)² dv ∝ depth² / s ∝ W² / s³ (Bouchy, Pepe & Queloz 2001, A&A 374, 733, eq. for Q).
 * So σ ∝ s^(3/2) = (s²)^(3/4), with s² = w0² + (v sin i)² when rotation is treated as a Gaussian
 * broadening added in quadrature to the intrinsic-plus-instrumental width w0. An approximation:
 * a real rotation profile is not Gaussian, and blends make fast rotators worse still.
 */
export function lineWidthFactor(vsiniKms: number, referenceVsiniKms: number, lineWidthKms: number): number {
  const w0Squared = lineWidthKms ** 2;
  return ((w0Squared + vsiniKms ** 2) / (w0Squared + referenceVsiniKms ** 2)) ** 0.75;
}

/** Where the spectral-type factor came from, for the budget. */
export type SpectralTypeSource = 'built-in curve (from memory)' | 'instrument profile teffFactors';

/** Centre and width (K) of the smooth turn-up of the built-in curve above ~6200 K. */
const HOT_TURN_K = 6200;
const HOT_WIDTH_K = 200;
/** Slopes of the built-in curve: gentle trend per 1000 K, and the extra steepening for hot stars. */
const TREND_PER_KK = 0.25;
const HOT_PER_KK = 1.0;

/**
 * Built-in relative photon-noise σ against Teff at fixed V magnitude and v sin i, for an optical
 * spectrograph (unnormalised; only ratios are used). Smooth (infinitely differentiable):
 *   ln f(T) = 0.25 (T / 1000 K) + 1.0 · softplus((T − 6200 K) / 200 K) · 0.2
 * i.e. a gentle loss of lines towards hotter stars (cooler stars have more and deeper lines) and a
 * steep loss above ~6200 K (docs/references.md [Spectral-type]). The shape and its coefficients are
 * from memory (the trend seen in instrument exposure-time calculators), not fitted to a
 * published table: relative to 5300 K the curve gives about 0.64 at 3500 K, 0.82 at 4500 K,
 * 1.27 at 6000 K, 1.9 at 6500 K, 3.4 at 7000 K and 12 at 8000 K. An instrument profile's
 * `teffFactors` replaces it.
 */
export function builtInTeffCurve(teffK: number): number {
  const x = (teffK - HOT_TURN_K) / HOT_WIDTH_K;
  // softplus(x) = ln(1 + e^x), written to stay finite for large x.
  const softplus = x > 30 ? x : Math.log1p(Math.exp(x));
  return Math.exp((TREND_PER_KK * teffK) / 1000 + (HOT_PER_KK * softplus * HOT_WIDTH_K) / 1000);
}

/**
 * Spectral-type factor σ(Teff) / σ(Teff_ref) at fixed V and v sin i: the built-in curve, or the
 * instrument profile's [teffK, factor] pairs interpolated linearly (clamped at the ends). Either
 * way it is divided by its value at the reference Teff, so the reference star gets exactly 1.
 */
export function spectralTypeFactor(
  teffK: number,
  referenceTeffK: number,
  teffFactors?: readonly (readonly [number, number])[],
): { factor: number; source: SpectralTypeSource } {
  if (teffFactors && teffFactors.length >= 2) {
    return {
      factor: interpolateTable(teffFactors, teffK) / interpolateTable(teffFactors, referenceTeffK),
      source: 'instrument profile teffFactors',
    };
  }
  return { factor: builtInTeffCurve(teffK) / builtInTeffCurve(referenceTeffK), source: 'built-in curve (from memory)' };
}
