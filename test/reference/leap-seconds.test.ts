// TAI − UTC against ERFA's table of leap seconds (pyerfa 2.0 erfa.dat, which follows IERS
// Bulletin C), computed once for the first day of every month 1972–2026: these are the months
// where it changes, with its value from that day on.
import { describe, expect, it } from 'vitest';
import { taiMinusUtcSec } from '../../src/astro/time-scales.js';

const CHANGES: [string, number][] = [
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

describe('TAI − UTC against erfa.dat (IERS Bulletin C)', () => {
  it('is 10 s from 1972-01-01', () => {
    expect(taiMinusUtcSec(new Date('1972-01-01T00:00:00Z'))).toBe(10);
  });

  it.each(CHANGES)('changes on %s to %i s (one second earlier it is one second less)', (day, sec) => {
    const start = Date.parse(`${day}T00:00:00Z`);
    expect(taiMinusUtcSec(new Date(start))).toBe(sec);
    expect(taiMinusUtcSec(new Date(start - 1000))).toBe(sec - 1);
  });

  it('stays 37 s to the end of 2026 (no leap second announced since)', () => {
    expect(taiMinusUtcSec(new Date('2026-12-31T23:59:59Z'))).toBe(37);
  });
});
