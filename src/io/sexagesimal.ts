// Angles written as decimal degrees or sexagesimal text (common practice in star catalogues).
import { parseDecimal } from './decimal.js';

const SEXAGESIMAL = /^([+-]?)(\d{1,3})[:\s](\d{1,2})(?:[:\s](\d{1,2}(?:\.\d*)?))?$/;

function parseParts(text: string): { sign: number; value: number } | undefined {
  const m = SEXAGESIMAL.exec(text.trim());
  if (!m) return undefined;
  const minutes = Number(m[3]);
  const seconds = m[4] === undefined ? 0 : Number(m[4]);
  if (minutes >= 60 || seconds >= 60) return undefined;
  return { sign: m[1] === '-' ? -1 : 1, value: Number(m[2]) + minutes / 60 + seconds / 3600 };
}

/** Right ascension in degrees from `hh:mm:ss.s` (hours) or decimal degrees; NaN if malformed. */
export function parseRaDeg(text: string): number {
  const t = text.trim();
  const decimal = parseDecimal(t);
  if (!Number.isNaN(decimal)) return decimal;
  const parts = parseParts(t);
  if (!parts || parts.sign < 0 || t.startsWith('+')) return Number.NaN;
  return parts.value * 15;
}

/** Declination in degrees from `±dd:mm:ss` or decimal degrees; NaN if malformed. */
export function parseDecDeg(text: string): number {
  const t = text.trim();
  const decimal = parseDecimal(t);
  if (!Number.isNaN(decimal)) return decimal;
  const parts = parseParts(t);
  return parts ? parts.sign * parts.value : Number.NaN;
}
