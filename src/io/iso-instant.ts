/** Date and time with an explicit zone: `2027-03-14T02:10:00Z`, `2027-03-14T04:10+02:00` [ISO8601]. */
const INSTANT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(Z|[+-](\d{2}):(\d{2}))$/;

/**
 * The instant (ms since 1970, UTC) an ISO 8601 date-time with `Z` or a `±hh:mm` offset stands
 * for; NaN for anything else, including a date or time that does not exist (2027-02-30,
 * 25:00, an offset beyond ±18:00) and a time without a zone, which would be ambiguous.
 */
export function isoInstantMs(text: string): number {
  const m = INSTANT.exec(text.trim());
  if (!m) return Number.NaN;
  const [year, month, day, hour, minute, second] = [1, 2, 3, 4, 5, 6].map((i) => Number(m[i] ?? 0)) as [number, number, number, number, number, number];
  const fraction = Number(m[7] ?? 0);
  const local = Date.UTC(year, month - 1, day, hour, minute, second);
  const check = new Date(local);
  if (check.getUTCFullYear() !== year || check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day) return Number.NaN;
  if (hour > 23 || minute > 59 || second > 59) return Number.NaN;
  const offsetMin = m[8] === 'Z' ? 0 : (m[8]!.startsWith('-') ? -1 : 1) * (Number(m[9]) * 60 + Number(m[10]));
  if (Math.abs(offsetMin) > 18 * 60 || Number(m[10] ?? 0) > 59) return Number.NaN;
  return local + fraction * 1000 - offsetMin * 60_000;
}
