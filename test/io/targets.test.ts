import { describe, expect, it } from 'vitest';
import { parseTargets } from '../../src/io/targets.js';
import { parseDecDeg, parseRaDeg } from '../../src/io/sexagesimal.js';

const header = 'id,ra,dec,vmag,teffK';

describe('target list', () => {
  it('reads sexagesimal and decimal coordinates', () => {
    const [a, b] = parseTargets(`${header}\nA,14:29:43.0,-62:40:46,11,3000\nB,217.43,-62.68,11,3000\n`, 't.csv');
    // 14h29m43s = 217.4292 deg; -62d40m46s = -62.6794 deg (arithmetic)
    expect(a!.raDeg).toBeCloseTo(217.42917, 5);
    expect(a!.decDeg).toBeCloseTo(-62.67944, 5);
    expect(b!.raDeg).toBe(217.43);
  });

  it('fills documented defaults and flags them as estimated', () => {
    const [t] = parseTargets(`${header}\nA,10:00:00,-10:00:00,9,5770\n`, 't.csv');
    expect(t!.massSun).toBeCloseTo(1.0, 2);
    expect(t!.estimated).toEqual(['massSun', 'vsiniKms', 'jitterMps']);
  });

  it('accepts case-insensitive headers and a negative zero-degree declination', () => {
    const [t] = parseTargets('ID,RA,DEC,VMAG,TEFFK\nA,01:00:00,-00:30:00,9,5000\n', 't.csv');
    expect(t!.decDeg).toBeCloseTo(-0.5, 9);
  });

  it.each([
    ['RA 25h', 'A,25:00:00,-10:00:00,9,5000', /row 1 \(line 2\): ra = "25:00:00"/],
    ['Dec +95', 'A,10:00:00,+95:00:00,9,5000', /dec = "\+95:00:00": declination/],
    ['bad number', 'A,10:00:00,-10:00:00,bright,5000', /vmag = "bright"/],
  ])('names the place of a bad value: %s', (_name, row, pattern) => {
    expect(() => parseTargets(`${header}\n${row}\n`, 't.csv')).toThrow(pattern);
  });

  it.each([
    ['0', /row 1 \(line 2\): visitsPerNight = "0": visits of the star in one night, a whole number from 1 to 12$/],
    ['2.5', /row 1 \(line 2\): visitsPerNight = "2.5": visits of the star in one night, a whole number from 1 to 12$/],
  ])('refuses visitsPerNight %s with one line', (value, pattern) => {
    expect(() => parseTargets(`id,ra,dec,vmag,teffK,visitsPerNight\nA,10:00:00,-10:00:00,9,5000,${value}\n`, 't.csv')).toThrow(pattern);
  });

  it('reads visitsPerNight as a star field, absent when not given', () => {
    const [a, b] = parseTargets('id,ra,dec,vmag,teffK,visitsPerNight\nA,10:00:00,-10:00:00,9,5000,3\nB,11:00:00,-10:00:00,9,5000,\n', 't.csv');
    expect([a!.visitsPerNight, b!.visitsPerNight]).toEqual([3, undefined]);
  });

  it('rejects sexagesimal with minutes of 60 or more', () => {
    expect(parseRaDeg('10:60:00')).toBeNaN();
    expect(parseDecDeg('-10:00:61')).toBeNaN();
  });
});

describe('per-target goal', () => {
  it('reads goalSignificance and rejects a non-positive one', () => {
    const [t] = parseTargets('id,ra,dec,vmag,teffK,goalSignificance\nA,10:00:00,-10:00:00,9,5000,3\n', 't.csv');
    expect(t!.goalSignificance).toBe(3);
    expect(() => parseTargets('id,ra,dec,vmag,teffK,goalSignificance\nA,10:00:00,-10:00:00,9,5000,0\n', 't.csv')).toThrow(/goalSignificance = "0"/);
  });
});

describe('transit duration', () => {
  it('goes with an ephemeris', () => {
    const head = 'id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,transitDurationHours';
    const [t] = parseTargets(`${head}\nA,10:00:00,-10:00:00,9,5000,3.2,2461400.5,2.5\n`, 't.csv');
    expect(t!.ephemeris!.transitDurationHours).toBe(2.5);
    expect(() => parseTargets(`${head}\nA,10:00:00,-10:00:00,9,5000,,,2.5\n`, 't.csv')).toThrow(/transitDurationHours = "2.5": needs periodDays/);
  });
});

describe('bands, activity, gravity and per-target exposure or sigma', () => {
  const cols = 'id,ra,dec,vmag,jmag,gmag,teffK,vsiniKms,logRhk,logg,exposureSec,visitSigmaMps';

  it("reads other bands, log R'HK, log g and a per-target exposure; the jitter follows the relations", () => {
    const [t] = parseTargets(`${cols}\nA,10:00:00,-10:00:00,9.1,7.6,8.9,5800,9,-4.6,4.3,600,\n`, 't.csv');
    expect(t!.mags).toEqual({ J: 7.6, G: 8.9 });
    expect(t!.logRhk).toBe(-4.6);
    expect(t!.logg).toBe(4.3);
    expect(t!.exposureSec).toBe(600);
    expect(t!.visitSigmaMps).toBeUndefined();
    expect(t!.jitterMps).toBeGreaterThan(20); // rotation at 9 km/s ([Saar1998])
    expect(t!.jitterSource).toMatch(/rotation \[Saar1998\].*activity/);
    expect(t!.estimated).toContain('jitterMps');
  });

  it('V may be left out when another band is given: estimated from the dwarf colours', () => {
    const [t] = parseTargets(`id,ra,dec,jmag,teffK\nM,10:00:00,-10:00:00,7.0,3500\n`, 't.csv');
    expect(t!.vmag).toBeGreaterThan(10);
    expect(t!.vmag).toBeLessThan(11); // V − J ≈ 3.6 for an M2 dwarf ([PecautMamajek2013], from memory)
    expect(t!.estimated).toContain('vmag');
  });

  it.each([
    [
      'no magnitude at all',
      'id,ra,dec,teffK\nA,10:00:00,-10:00:00,5000\n',
      /^t\.csv: row 1 \(line 2\): vmag = \(empty\): required: V magnitude .* or a magnitude in another band/,
    ],
    ['exposure and sigma both', `${cols}\nA,10:00:00,-10:00:00,9,,,5000,,,,600,2\n`, /visitSigmaMps = "2": give exposureSec or visitSigmaMps, not both$/],
    ['log g out of range', `${cols}\nA,10:00:00,-10:00:00,9,,,5000,,,7,,\n`, /logg = "7": surface gravity log g \(cgs\) from 0 to 6$/],
  ])('bad input: %s', (_name, text, message) => {
    expect(() => parseTargets(text, 't.csv')).toThrow(message);
  });
});
