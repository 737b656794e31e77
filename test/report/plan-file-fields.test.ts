// The text forms plan.csv and plan.ics use for a night and a star's place, against values worked
// out by hand and read back with the target list's own sexagesimal reader.
import { describe, expect, it } from 'vitest';
import { parseDecDeg, parseRaDeg } from '../../src/io/sexagesimal.js';
import { nightInterval } from '../../src/report/night-interval.js';
import { decText, raText } from '../../src/report/sexagesimal-text.js';

describe('nightInterval: ISO 8601 interval of the evening and morning dates, end abbreviated (ISO 8601:2004, 4.4.5)', () => {
  it.each([
    ['2027-03-03', '2027-03-03/04'],
    ['2027-03-31', '2027-03-31/04-01'],
    ['2027-12-31', '2027-12-31/2028-01-01'],
    ['2028-02-28', '2028-02-28/29'],
    ['2028-02-29', '2028-02-29/03-01'],
    ['2027-02-28', '2027-02-28/03-01'],
  ])('%s → %s', (evening, text) => {
    expect(nightInterval(evening)).toBe(text);
  });
});

describe('sexagesimal text', () => {
  it('Vega, ICRS J2000: RA 18h36m56.336s, Dec +38°47′01.28″ (catalogue values, from memory)', () => {
    const raDeg = (18 + 36 / 60 + 56.336 / 3600) * 15;
    const decDeg = 38 + 47 / 60 + 1.28 / 3600;
    expect(raText(raDeg)).toBe('18:36:56.336');
    expect(decText(decDeg)).toBe('+38:47:01.28');
  });

  it('rounding carries into minutes, hours and the next day; signs of small declinations', () => {
    expect(raText(0)).toBe('00:00:00.000');
    expect(raText(360 - 1e-9)).toBe('00:00:00.000');
    expect(raText(15 * (1 - 0.0004 / 3600))).toBe('01:00:00.000');
    expect(raText(-15)).toBe('23:00:00.000');
    expect(decText(-0.5)).toBe('-00:30:00.00');
    expect(decText(-1e-9)).toBe('+00:00:00.00');
    expect(decText(-(10 - 0.004 / 3600))).toBe('-10:00:00.00');
    expect(decText(-90)).toBe('-90:00:00.00');
  });

  it('reads back within half the last digit: 0.5 ms of RA (7.5 mas), 5 mas of Dec, over a spread of values', () => {
    for (let k = 0; k < 2000; k++) {
      // A deterministic spread (golden-ratio steps) over the sphere's ranges.
      const raDeg = ((k * 0.6180339887) % 1) * 360;
      const decDeg = ((k * 0.7548776662) % 1) * 180 - 90;
      expect(Math.abs(parseRaDeg(raText(raDeg)) - raDeg) * 3.6e6).toBeLessThanOrEqual(7.5 + 1e-6);
      expect(Math.abs(parseDecDeg(decText(decDeg)) - decDeg) * 3.6e6).toBeLessThanOrEqual(5 + 1e-6);
    }
  });
});
