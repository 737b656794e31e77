// Time scales: UTC -> TAI -> TT -> TDB, and Julian dates.
import { DAY_MS, DAY_SEC, JD_J2000, JD_UNIX_EPOCH, TT_MINUS_TAI_SEC } from './constants.js';

/**
 * TAI - UTC in seconds from each leap second's UTC start (IERS Bulletin C; table of leap seconds
 * since 1972, from memory, cross-checked against the IERS list: 37 s since 2017-01-01).
 * Dates before 1972 use 10 s, a simplification: Crest plans future observations.
 */
const LEAP_SECONDS: [string, number][] = [
  ['1972-01-01', 10],
  ['1972-07-01', 11],
  ['1973-01-01', 12],
  ['1974-01-01', 13],
  ['1975-01-01', 14],
  ['1976-01-01', 15],
  ['1977-01-01', 16],
  ['1978-01-01', 17],
  ['1979-01-01', 18],
  ['1980-01-01', 19],
  ['1981-07-01', 20],
  ['1982-07-01', 21],
  ['1983-07-01', 22],
  ['1985-07-01', 23],
  ['1988-01-01', 24],
  ['1990-01-01', 25],
  ['1991-01-01', 26],
  ['1992-07-01', 27],
  ['1993-07-01', 28],
  ['1994-07-01', 29],
  ['1996-01-01', 30],
  ['1997-07-01', 31],
  ['1999-01-01', 32],
  ['2006-01-01', 33],
  ['2009-01-01', 34],
  ['2012-07-01', 35],
  ['2015-07-01', 36],
  ['2017-01-01', 37],
];
const LEAP_TABLE = LEAP_SECONDS.map(([day, sec]) => [Date.parse(`${day}T00:00:00Z`), sec] as const);

/** TAI - UTC (s) at an instant; later leap seconds (none announced) are not known. */
export function taiMinusUtcSec(date: Date): number {
  const ms = date.getTime();
  let value = LEAP_TABLE[0]![1];
  for (const [startMs, sec] of LEAP_TABLE) if (ms >= startMs) value = sec;
  return value;
}

/** TT - UTC (s): TT = TAI + 32.184 s (IAU 1991 Resolution A4). */
export function ttMinusUtcSec(date: Date): number {
  return taiMinusUtcSec(date) + TT_MINUS_TAI_SEC;
}

/** Julian date of a UTC instant (the JD counts days from noon; the Unix epoch is JD 2440587.5). */
export function jdUtc(date: Date): number {
  return JD_UNIX_EPOCH + date.getTime() / DAY_MS;
}

/** Julian date in TT of a UTC instant. */
export function jdTt(date: Date): number {
  return jdUtc(date) + ttMinusUtcSec(date) / DAY_SEC;
}

/**
 * TDB - TT (s) at a TT Julian date: the leading periodic terms of Fairhead & Bretagnon (1990) as
 * given by Kaplan 2005 (USNO Circular 179, eq. 2.6), from memory; good to about 10 microseconds.
 */
export function tdbMinusTtSec(jdTT: number): number {
  const t = (jdTT - JD_J2000) / 36_525;
  return (
    0.001657 * Math.sin(628.3076 * t + 6.2401) +
    0.000022 * Math.sin(575.3385 * t + 4.297) +
    0.000014 * Math.sin(1256.6152 * t + 6.1969) +
    0.000005 * Math.sin(606.9777 * t + 4.0212) +
    0.000005 * Math.sin(52.9691 * t + 0.4444) +
    0.000002 * Math.sin(21.3299 * t + 5.5431) +
    0.00001 * t * Math.sin(628.3076 * t + 4.249)
  );
}

/** Julian date in TDB of a UTC instant. */
export function jdTdb(date: Date): number {
  const tt = jdTt(date);
  return tt + tdbMinusTtSec(tt) / DAY_SEC;
}

/** Julian years (TT) from J2000.0 to a UTC instant. */
export function julianYearsSinceJ2000(date: Date): number {
  return (jdTt(date) - JD_J2000) / 365.25;
}
