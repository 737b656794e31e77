// How the star's spectral type changes the photon-noise RV precision at fixed magnitude in the
// instrument's band: the number and depth of lines (the RV information content), per unit flux.

import { interpolateTable } from './star-defaults.js';

/** Spectral region of an instrument: which information table applies. */
export type SpectralRegion = 'optical' | 'near-infrared';

export interface TeffInformationTable {
  region: SpectralRegion;
  /** The band the table's magnitude is fixed in. */
  fixedBand: 'V' | 'J';
  /** [Teff K, σ relative to the table's reference Teff] pairs, ascending in Teff. */
  points: readonly (readonly [number, number])[];
  /** Inside this range the table is trusted; between it and the ends a warning is given. */
  trusted: { minK: number; maxK: number };
  source: string;
}

/**
 * Optical (≈380–690 nm), σ at fixed V relative to a G2 dwarf (5800 K). Shape after the RV
 * photon limits of F–M dwarfs in [ReinersZechmeister2020] (optical setup, slow rotators; read
 * from their figures, from memory) with the K-dwarf point set by the two published anchors of
 * the 1 m/s class: 0.90 m/s for a G2 dwarf at V = 6 in 60 s [HARPSOverview] and 1 m/s for a
 * K dwarf at V = 7.5 in 60 s [Dumusque2011], i.e. σ(K)/σ(G2) ≈ 0.56 at fixed V.
 * Hotter than ~7000 K the lines thin out and rotation takes over: the table ends at 8000 K.
 */
const OPTICAL: TeffInformationTable = {
  region: 'optical',
  fixedBand: 'V',
  points: [
    [3000, 0.55],
    [3300, 0.46],
    [3600, 0.42],
    [4000, 0.42],
    [4500, 0.46],
    [5000, 0.56],
    [5300, 0.68],
    [5800, 1.0],
    [6200, 1.35],
    [6500, 1.75],
    [7000, 2.9],
    [7500, 4.6],
    [8000, 7.5],
  ],
  trusted: { minK: 3300, maxK: 7000 },
  source: '[ReinersZechmeister2020] shape, anchored to [HARPSOverview] and [Dumusque2011]',
};

/**
 * Near-infrared (≈960–1800 nm, Y J H), σ at fixed J relative to an M2 dwarf (3500 K). Shape
 * after the near-infrared RV information of M dwarfs in [Figueira2016] and the F–M photon
 * limits of [ReinersZechmeister2020] (near-infrared setup); values from memory: cooler M dwarfs
 * carry more information per J-band photon, FGK stars much less.
 */
const NEAR_INFRARED: TeffInformationTable = {
  region: 'near-infrared',
  fixedBand: 'J',
  points: [
    [2800, 0.6],
    [3000, 0.7],
    [3300, 0.85],
    [3500, 1.0],
    [3800, 1.2],
    [4200, 1.5],
    [5000, 2.2],
    [5800, 3.0],
    [6500, 4.5],
  ],
  trusted: { minK: 3000, maxK: 5000 },
  source: '[Figueira2016] and [ReinersZechmeister2020] shape, from memory',
};

export function teffInformationTable(region: SpectralRegion): TeffInformationTable {
  return region === 'optical' ? OPTICAL : NEAR_INFRARED;
}

/** The hard range of a table: outside it the factor means nothing. */
export function tableRangeK(table: TeffInformationTable): { minK: number; maxK: number } {
  return { minK: table.points[0]![0], maxK: table.points[table.points.length - 1]![0] };
}

export interface TeffFactor {
  /** σ(Teff) / σ(Teff_ref) at fixed magnitude in the table's band. */
  factor: number;
  source: string;
  /** Set when Teff lies outside the trusted range (but inside the table). */
  warning?: string;
}

/**
 * σ(Teff)/σ(Teff_ref), interpolated linearly in the table (or the instrument profile's own
 * [Teff, factor] pairs when it gives them). Teff outside the table's range throws a RangeError
 * (callers turn it into an input error naming the target).
 */
export function teffFactor(teffK: number, referenceTeffK: number, region: SpectralRegion, override?: readonly (readonly [number, number])[]): TeffFactor {
  const table = teffInformationTable(region);
  const points = override ?? table.points;
  const { minK, maxK } = override ? { minK: points[0]![0], maxK: points[points.length - 1]![0] } : tableRangeK(table);
  if (teffK < minK || teffK > maxK) {
    throw new RangeError(`outside ${minK}-${maxK} K, the range of the ${region} RV-information table: no photon-noise estimate there`);
  }
  const factor = interpolateTable(points, teffK) / interpolateTable(points, referenceTeffK);
  const source = override ? 'instrument profile teffFactors' : table.source;
  if (!override && (teffK < table.trusted.minK || teffK > table.trusted.maxK)) {
    return {
      factor,
      source,
      warning: `Teff ${teffK} K is outside ${table.trusted.minK}-${table.trusted.maxK} K, where the ${region} RV-information table is reliable`,
    };
  }
  return { factor, source };
}
