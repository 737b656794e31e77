// How rotation changes the photon-noise RV precision at fixed magnitude and exposure, and the
// line width it acts on, which follows from the instrument's resolving power.

/** Speed of light (km/s), exact (SI). */
const C_KMS = 299792.458;

/**
 * Gaussian-equivalent width (km/s) of a slowly rotating FGK dwarf's lines before the instrument:
 * thermal, micro- and macroturbulent broadening together. 4.3 km/s makes w0 = 5 km/s at
 * R = 115,000 and ≈7.9 km/s at R = 45,000 (Crest's calibration; [BeattyGaudi2015] treat the same
 * sum of intrinsic and instrumental widths).
 */
export const INTRINSIC_LINE_WIDTH_KMS = 4.3;

/**
 * Width w0 (km/s) of the observed lines of a non-rotating star: intrinsic width and the
 * instrumental profile c/R added in quadrature ([BeattyGaudi2015], Gaussian profiles).
 */
export function lineWidthKms(resolvingPower: number, intrinsicKms = INTRINSIC_LINE_WIDTH_KMS): number {
  return Math.hypot(intrinsicKms, C_KMS / resolvingPower);
}

/**
 * Line-width factor σ(v sin i) / σ(v sin i_ref) = ((w0² + v sin i²) / (w0² + v sin i_ref²))^(3/4).
 *
 * Derived from the information content of a Gaussian line: a line of fixed equivalent width W and
 * Gaussian width s has depth ∝ W / s, and the RV information ∫ (dF/dv)² dv ∝ depth² / s ∝ W² / s³
 * ([Bouchy2001]); so σ ∝ s^(3/2), the Θ^(3/2) law of [BeattyGaudi2015], with s² = w0² + (v sin i)²
 * when rotation is treated as a Gaussian broadening added in quadrature. An approximation: a real
 * rotation profile is not Gaussian, and blends make fast rotators worse still.
 */
export function lineWidthFactor(vsiniKms: number, referenceVsiniKms: number, widthKms: number): number {
  const w0Squared = widthKms ** 2;
  return ((w0Squared + vsiniKms ** 2) / (w0Squared + referenceVsiniKms ** 2)) ** 0.75;
}
