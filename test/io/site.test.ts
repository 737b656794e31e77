import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { SITES_DIR } from '../../src/io/paths.js';
import { readBundledSites } from '../../src/io/site-list.js';
import { parseSite } from '../../src/io/site.js';

const GOOD = {
  id: 'cerro-example',
  name: 'Cerro Example',
  latitudeDeg: -30.5,
  longitudeDeg: -70.2,
  elevationM: 2300,
  timeZone: 'America/Santiago',
  clearFraction: 0.75,
  sourceNote: 'invented for a test',
};

describe('site files', () => {
  const sites = readBundledSites();

  it('reads every bundled file: at least eight, both hemispheres, ids equal to file names', () => {
    const files = readdirSync(SITES_DIR).filter((f) => f.endsWith('.json'));
    expect(sites.length).toBe(files.length);
    expect(sites.length).toBeGreaterThanOrEqual(8);
    expect(sites.filter((s) => s.latitudeDeg > 0).length).toBeGreaterThan(0);
    expect(sites.filter((s) => s.latitudeDeg < 0).length).toBeGreaterThan(0);
    for (const s of sites) expect(path.basename(s.file, '.json')).toBe(s.id);
  });

  it.each(readBundledSites().map((s) => [s.id, s] as const))('%s keeps civil time within two hours of its longitude', (_id, site) => {
    // Common practice: zone time at these observatories is within ~2 h of local mean solar time
    // (longitude / 15 h, east positive); a sign error in the longitude would miss by many hours.
    const offsetHours = DateTime.fromISO('2027-01-15T12:00:00Z').setZone(site.timeZone).offset / 60;
    expect(Math.abs(offsetHours - site.longitudeDeg / 15)).toBeLessThan(2);
  });

  it('gives every bundled site a median seeing in the schema range, with its source in the note', () => {
    const references = readFileSync('docs/references.md', 'utf8');
    for (const s of sites) {
      expect(s.medianSeeingArcsec, s.id).toBeGreaterThanOrEqual(0.2);
      expect(s.medianSeeingArcsec, s.id).toBeLessThanOrEqual(5);
      // The note states the same value, then says what was measured and where it was read.
      const stated = /Median seeing (\d+(?:\.\d+)?) arcsec/.exec(s.sourceNote);
      expect(Number(stated?.[1]), s.id).toBe(s.medianSeeingArcsec);
      // The note names a source entry of docs/references.md, or says the value is from memory.
      const keys = [...s.sourceNote.matchAll(/\[([A-Za-z0-9-]+)\]/g)].map((m) => m[1]!);
      expect(keys.length > 0 || s.sourceNote.includes('from memory'), s.id).toBe(true);
      for (const key of keys) expect(references, `${s.id} cites [${key}]`).toContain(`- [${key}]`);
    }
  });

  it('defaults the minimum altitude to 20 degrees and sorts the horizon by azimuth', () => {
    const site = parseSite(
      {
        ...GOOD,
        horizon: [
          { azimuthDeg: 200, altitudeDeg: 15 },
          { azimuthDeg: 10, altitudeDeg: 5 },
        ],
      },
      'x.json',
    );
    expect(site.minAltitudeDeg).toBe(20);
    expect(site.horizon!.map((p) => p.azimuthDeg)).toEqual([10, 200]);
  });

  it.each([
    ['latitude out of range', { latitudeDeg: 95 }, /^x\.json: latitudeDeg = 95: degrees from -90 to \+90$/],
    ['longitude out of range', { longitudeDeg: 200 }, /^x\.json: longitudeDeg = 200: degrees from -180 to \+180, east positive$/],
    ['unknown time zone', { timeZone: 'Mars/Olympus' }, /^x\.json: timeZone = "Mars\/Olympus": an IANA time-zone name/],
    ['eleven monthly clear fractions', { clearFraction: Array(11).fill(0.5) }, /^x\.json: clearFraction = \[.*: twelve monthly values$/],
    [
      'a horizon point out of range',
      {
        horizon: [
          { azimuthDeg: 0, altitudeDeg: 5 },
          { azimuthDeg: 400, altitudeDeg: 5 },
        ],
      },
      /^x\.json: horizon\[1\]\.azimuthDeg = 400: degrees from 0 to 360$/,
    ],
    ['a misspelt key', { elevation: 2300 }, /^x\.json: elevation = 2300: unknown key/],
    ['missing name', { name: undefined }, /^x\.json: name = \(missing\): required/],
  ])('names the key of a bad value: %s', (_name, change, message) => {
    expect(() => parseSite({ ...GOOD, ...change }, 'x.json')).toThrow(message);
  });
});
