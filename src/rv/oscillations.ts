// Solar-like oscillations: the exposure that averages the p-mode shifts down.

/** Solar ν_max (μHz), the usual reference value (from memory, [KjeldsenBedding1995] scale). */
const NU_MAX_SUN_UHZ = 3090;
const LOG_G_SUN = Math.log10(27400);
const TEFF_SUN_K = 5772;
/** Stars hotter than this have thin convective envelopes and no solar-like p modes to average (common practice). */
export const SOLAR_LIKE_MAX_TEFF_K = 7000;

/** Frequency of maximum oscillation power: ν_max = ν_max☉ (g/g☉) (Teff/Teff☉)^(−1/2) ([KjeldsenBedding1995]). */
export function nuMaxMicroHz(teffK: number, logg: number): number {
  return NU_MAX_SUN_UHZ * 10 ** (logg - LOG_G_SUN) * (teffK / TEFF_SUN_K) ** -0.5;
}

/**
 * Shortest exposure (s) that averages the p modes: one period at ν_max, 1/ν_max. [Chaplin2019]
 * tune exposures to the star and find about 4 minutes enough for K dwarfs and longer for hotter
 * or evolved stars; 1/ν_max gives 5.4 min for the Sun and 3-4 min for K dwarfs, the same trend
 * (Crest's reading of their result). Undefined for stars without solar-like oscillations.
 */
export function oscillationMinExposureSec(teffK: number, logg: number): number | undefined {
  if (teffK > SOLAR_LIKE_MAX_TEFF_K) return undefined;
  return 1e6 / nuMaxMicroHz(teffK, logg);
}
