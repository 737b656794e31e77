// Local dates and times at a site (IANA zone through luxon). Pure: no clock is read.
import { DateTime } from 'luxon';

/** The UTC instant of 12:00 local time on a local date (YYYY-MM-DD) in an IANA zone. */
export function localNoon(localDate: string, timeZone: string): Date {
  return DateTime.fromISO(`${localDate}T12:00:00`, { zone: timeZone }).toJSDate();
}

/** The local date after `localDate` (calendar arithmetic, no zone involved). */
export function nextLocalDate(localDate: string): string {
  return DateTime.fromISO(localDate, { zone: 'UTC' }).plus({ days: 1 }).toISODate()!;
}

/** Every local date from `from` to `to` inclusive (YYYY-MM-DD); empty when `to` is before `from`. */
export function localDateRange(from: string, to: string): string[] {
  const dates: string[] = [];
  for (let d = from; d <= to; d = nextLocalDate(d)) dates.push(d);
  return dates;
}

/** The local calendar date of an instant in a zone. */
export function localDateOf(date: Date, timeZone: string): string {
  return DateTime.fromJSDate(date, { zone: timeZone }).toISODate()!;
}

/** `HH:mm` of an instant, in the zone or in UTC; a dash for null. */
export function clockTime(date: Date | null, timeZone: string, utc = false): string {
  if (!date) return '-';
  return DateTime.fromJSDate(date, { zone: utc ? 'UTC' : timeZone }).toFormat('HH:mm');
}

/** ISO 8601 with the zone's offset (or Z in UTC), to the second; null stays null. */
export function isoTime(date: Date | null, timeZone: string, utc = false): string | null {
  if (!date) return null;
  return DateTime.fromMillis(Math.round(date.getTime() / 1000) * 1000, { zone: utc ? 'UTC' : timeZone }).toISO({ suppressMilliseconds: true });
}
