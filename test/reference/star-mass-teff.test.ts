// The dwarf mass–Teff table of src/rv/star-defaults.ts (recalled from memory) against the published
// sequence: E. Mamajek, "A Modern Mean Dwarf Stellar Color and Effective Temperature Sequence",
// version 2024.05.15 (EEM_dwarf_UBVIJHK_colors_Teff.txt in the author's repository
// emamajek/SpectralType), the continuation of Pecaut & Mamajek 2013 (ApJS 208, 9) Table 5.
// Rows copied once: [spectral type, Teff (K), mass (M_sun)].
import { describe, expect, it } from 'vitest';
import { massFromTeffSun } from '../../src/rv/star-defaults.js';

const SEQUENCE: [string, number, number][] = [
  ['F0V', 7220, 1.6],
  ['F5V', 6550, 1.32],
  ['F8V', 6180, 1.16],
  ['G0V', 5930, 1.07],
  ['G2V', 5770, 1.0],
  ['G5V', 5660, 0.98],
  ['G8V', 5480, 0.93],
  ['K0V', 5290, 0.86],
  ['K2V', 5100, 0.82],
  ['K3V', 4870, 0.76],
  ['K5V', 4440, 0.7],
  ['K7V', 4090, 0.64],
  ['M0V', 3850, 0.585],
  ['M2V', 3560, 0.45],
  ['M3V', 3430, 0.36],
  ['M4V', 3210, 0.24],
  ['M5V', 3060, 0.155],
  ['M5.5V', 2930, 0.122],
];

describe('dwarf mass from Teff against the Mamajek sequence (2024.05.15)', () => {
  it.each(SEQUENCE)('%s (%i K): %f M_sun within 0.035 M_sun', (_type, teffK, massSun) => {
    expect(Math.abs(massFromTeffSun(teffK) - massSun)).toBeLessThan(0.035);
  });
});
