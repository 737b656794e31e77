// Magnitudes in the bands a target list leaves out, from V and Teff on the dwarf sequence.

import type { BandId } from './bands.js';
import { interpolateTable } from './star-defaults.js';

/**
 * Mean dwarf colours V − X against Teff (K) for X = R, I (Cousins), J, H (2MASS) and Gaia G,
 * after the main-sequence table of [PecautMamajek2013]; the numbers are rounded values from
 * memory (about ±0.1 mag), enough for an exposure estimate, not for photometry.
 */
const COLOUR_TEFF_K = [3000, 3300, 3600, 4000, 4500, 5000, 5500, 5770, 6000, 6500, 7000];
const V_MINUS: Record<Exclude<BandId, 'V'>, number[]> = {
  R: [1.4, 1.13, 0.95, 0.78, 0.6, 0.49, 0.4, 0.36, 0.33, 0.26, 0.17],
  I: [3.1, 2.5, 2.0, 1.52, 1.16, 0.95, 0.78, 0.7, 0.65, 0.52, 0.33],
  J: [5.0, 4.1, 3.4, 2.6, 2.0, 1.62, 1.3, 1.15, 1.05, 0.83, 0.55],
  H: [5.6, 4.7, 4.05, 3.25, 2.62, 2.1, 1.65, 1.45, 1.32, 1.03, 0.65],
  G: [1.8, 1.3, 0.95, 0.65, 0.42, 0.3, 0.22, 0.19, 0.15, 0.1, 0.05],
};

/** The range of the colour table (K); outside it the colours are held at the end values. */
export const COLOUR_TABLE_TEFF_K = { min: COLOUR_TEFF_K[0]!, max: COLOUR_TEFF_K[COLOUR_TEFF_K.length - 1]! };

/** V − X for a dwarf of this Teff (0 for X = V), interpolated linearly, clamped at the ends. */
export function dwarfColour(bandId: BandId, teffK: number): number {
  if (bandId === 'V') return 0;
  const column = V_MINUS[bandId];
  return interpolateTable(
    COLOUR_TEFF_K.map((t, i) => [t, column[i]!] as const),
    teffK,
  );
}

/** What the precision model needs to know of a star's brightness. */
export interface StarBrightness {
  vmag: number;
  teffK: number;
  /** Magnitudes given in other bands (a target list's `jmag`, ...). */
  mags?: Partial<Record<BandId, number>>;
}

/** The star's magnitude in a band: as given, else V − (V − X)(Teff), flagged as estimated. */
export function magnitudeIn(star: StarBrightness, bandId: BandId): { mag: number; estimated: boolean } {
  const given = bandId === 'V' ? star.vmag : star.mags?.[bandId];
  if (given !== undefined) return { mag: given, estimated: false };
  return { mag: star.vmag - dwarfColour(bandId, star.teffK), estimated: true };
}
