// Colours of the report. The categorical colours start with the Okabe–Ito palette, chosen to stay
// distinguishable under the common forms of colour-vision deficiency (Okabe & Ito 2008, "Color
// Universal Design", jfly.uni-koeln.de/color; recommended by Wong 2011, Nature Methods 8, 441).
import { generatedColours } from './generated-colours.js';

/** Okabe–Ito colours, in the order stars receive them (yellow last: it is faint on white). */
export const OKABE_ITO = {
  blue: '#0072B2',
  vermillion: '#D55E00',
  bluishGreen: '#009E73',
  reddishPurple: '#CC79A7',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  black: '#000000',
  yellow: '#F0E442',
} as const;

export const CATEGORY_COLOURS: readonly string[] = Object.values(OKABE_ITO);

/**
 * `count` different colours: the eight Okabe–Ito colours first, then generated ones (different
 * hues and lightness, generated-colours.ts), none repeated.
 */
export function distinctColours(count: number): string[] {
  const first = CATEGORY_COLOURS.slice(0, count);
  return count <= first.length ? first : [...first, ...generatedColours(count - first.length, new Set(first.map((c) => c.toLowerCase())))];
}

/** Ink and paper of our own style: near-black text, warm grey rules, a pale blue accent. */
export const INK = '#1d2430';
export const MUTED = '#5b6472';
export const RULE = '#c9ccd1';
export const ACCENT_PALE = '#dcebf5';
export const CAUTION_PALE = '#fbecd9';
/** The altitudes below the airmass limit on a night chart: a pale warm fill. */
export const BELOW_LIMIT_PALE = '#f4efe4';

/**
 * The sky strip of a night chart, by the Sun's altitude (deg): deep blue at astronomical night
 * (−18° and lower), through nautical and civil twilight, to pale day at the horizon and above.
 */
export const SUN_ALTITUDE_STOPS = { altitudesDeg: [-18, -12, -6, 0], colours: ['#1f2a44', '#3f5378', '#9fb3cf', '#f6efd9'] } as const;
