// Documented defaults for star data a target list leaves out. Each filled value is flagged
// as estimated in the output.

/**
 * Main-sequence mass (solar masses) against effective temperature (K), dwarf stars.
 * Approximate values after the Pecaut & Mamajek (2013, ApJS 208, 9) dwarf sequence, from memory.
 */
const MASS_BY_TEFF: readonly [number, number][] = [
  [2900, 0.1],
  [3050, 0.16],
  [3200, 0.23],
  [3400, 0.37],
  [3560, 0.44],
  [3850, 0.57],
  [4050, 0.63],
  [4440, 0.7],
  [4830, 0.78],
  [5270, 0.88],
  [5660, 0.98],
  [5770, 1.0],
  [5920, 1.06],
  [6100, 1.13],
  [6510, 1.33],
  [7220, 1.61],
  [8180, 1.9],
  [9700, 2.4],
];

/** Linear interpolation in a sorted [x, y] table, clamped at both ends. */
export function interpolateTable(table: readonly (readonly [number, number])[], x: number): number {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (x <= first[0]) return first[1];
  if (x >= last[0]) return last[1];
  let i = 1;
  while (table[i]![0] < x) i++;
  const [x0, y0] = table[i - 1]!;
  const [x1, y1] = table[i]!;
  return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

export function massFromTeffSun(teffK: number): number {
  return interpolateTable(MASS_BY_TEFF, teffK);
}

/**
 * Dwarf surface gravity log g (cgs) against Teff (K), after the mean dwarf sequence of
 * [PecautMamajek2013] (rounded, from memory).
 */
const LOGG_BY_TEFF: readonly [number, number][] = [
  [3000, 5.0],
  [3500, 4.85],
  [4000, 4.7],
  [4500, 4.6],
  [5000, 4.55],
  [5500, 4.5],
  [5800, 4.44],
  [6200, 4.35],
  [6500, 4.25],
  [7000, 4.2],
];

export function dwarfLoggFromTeff(teffK: number): number {
  return interpolateTable(LOGG_BY_TEFF, teffK);
}

/** A slowly rotating, inactive dwarf (common practice). */
export const DEFAULT_VSINI_KMS = 2;
