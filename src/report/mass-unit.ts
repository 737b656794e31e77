// Planet masses as the text outputs show them: Earth masses (M⊕) by default, Jupiter masses (MJup)
// on request; files (JSON, CSV) keep Earth masses, as their field names say.
import { EARTH_PER_JUPITER } from '../astro/constants.js';

export const MASS_UNITS = ['earth', 'jupiter'] as const;
export type MassUnit = (typeof MASS_UNITS)[number];

export const MASS_SYMBOL: Record<MassUnit, string> = { earth: 'M⊕', jupiter: 'MJup' };

/** Decimals a printed mass takes: 0.1 M⊕, 0.001 MJup (a third of an Earth mass). */
export const MASS_DECIMALS: Record<MassUnit, number> = { earth: 1, jupiter: 3 };

/** A mass given in Earth masses, in `unit`. */
export function massInUnit(earth: number, unit: MassUnit): number {
  return unit === 'jupiter' ? earth / EARTH_PER_JUPITER : earth;
}

/** A mass given in `unit`, in Earth masses. */
export function massInEarth(value: number, unit: MassUnit): number {
  return unit === 'jupiter' ? value * EARTH_PER_JUPITER : value;
}
