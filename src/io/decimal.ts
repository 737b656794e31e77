/** A plain decimal number such as `-12`, `4.5`, `.5` or `2.4e6`. */
const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The number a decimal text stands for (surrounding blanks allowed); NaN for anything else.
 * Unlike Number(), it refuses hexadecimal (`0x10`), binary, `Infinity` and blank text, and
 * gives NaN rather than Infinity when the number is too large for a double.
 */
export function parseDecimal(text: string): number {
  const t = text.trim();
  if (!DECIMAL.test(t)) return Number.NaN;
  const value = Number(t);
  return Number.isFinite(value) ? value : Number.NaN;
}
