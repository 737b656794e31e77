// How far a written star place (sexagesimal RA and Dec) lies from the catalogue place moved by the
// proper motion since its epoch, by small angles (common practice; independent of the module's
// vectors): the offsets east (RA × cos δ) and north, in mas.
import type { Target } from '../../src/model.js';
import { parseDecDeg, parseRaDeg } from '../../src/io/sexagesimal.js';

export function placeOffsetMas(star: Target, raText: string, decText: string, atUtc: string): { eastMas: number; northMas: number; cosDec: number } {
  // Julian years from J2000.0 (2000-01-01 12:00), then from the catalogue's epoch.
  const years = (Date.parse(atUtc) - Date.UTC(2000, 0, 1, 12)) / (365.25 * 86_400_000) + 2000 - star.epochYear;
  const cosDec = Math.cos((star.decDeg * Math.PI) / 180);
  const eastMas = (((parseRaDeg(raText) - star.raDeg + 540) % 360) - 180) * 3.6e6 * cosDec - star.pmRaMasYr * years;
  const northMas = (parseDecDeg(decText) - star.decDeg) * 3.6e6 - star.pmDecMasYr * years;
  return { eastMas, northMas, cosDec };
}
