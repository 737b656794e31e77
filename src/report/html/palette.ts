// Colours of the report. The categorical colours are the Okabe–Ito palette, chosen to stay
// distinguishable under the common forms of colour-vision deficiency (Okabe & Ito 2008, "Color
// Universal Design", jfly.uni-koeln.de/color; recommended by Wong 2011, Nature Methods 8, 441).

/** Okabe–Ito colours, in the order targets receive them (yellow last: it is faint on white). */
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

/** Ink and paper of our own style: near-black text, warm grey rules, a pale blue accent. */
export const INK = '#1d2430';
export const MUTED = '#5b6472';
export const RULE = '#c9ccd1';
export const ACCENT_PALE = '#dcebf5';
export const CAUTION_PALE = '#fbecd9';

/** Sky shades from daylight to full night, for twilight bands (lighter = brighter sky). */
export const SKY_SHADES = {
  day: '#ffffff',
  civil: '#eef1f5',
  nautical: '#e0e5ec',
  astronomical: '#d0d7e1',
  night: '#bfc9d6',
} as const;
