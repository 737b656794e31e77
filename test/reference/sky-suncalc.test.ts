// Sunrise, sunset and twilight against a second general-purpose library, suncalc 2.0.2 (a dev
// dependency; its own method follows Meeus-style low-precision solar formulas, good to ~1 min).
import path from 'node:path';
import * as SunCalc from 'suncalc';
import { describe, expect, it } from 'vitest';
import { readSite } from '../../src/io/site.js';
import { SITES_DIR } from '../../src/io/paths.js';
import { localNoon, nextLocalDate } from '../../src/sky/local-time.js';
import { computeNight } from '../../src/sky/nights.js';

const SITES = ['la-silla', 'mauna-kea', 'roque-muchachos', 'siding-spring', 'sutherland', 'calar-alto'];
const DATES = Array.from({ length: 12 }, (_, m) => `2027-${String(m + 1).padStart(2, '0')}-15`);

describe('nights against suncalc (docs/references.md [Night-crosscheck]: within 2 minutes away from the poles)', () => {
  for (const id of SITES) {
    it(`${id}: sunset, sunrise and the three twilights on twelve dates`, () => {
      const site = readSite(path.join(SITES_DIR, `${id}.json`));
      for (const date of DATES) {
        const night = computeNight(site, date, 'nautical');
        const evening = SunCalc.getTimes(localNoon(date, site.timeZone), site.latitudeDeg, site.longitudeDeg);
        const morning = SunCalc.getTimes(localNoon(nextLocalDate(date), site.timeZone), site.latitudeDeg, site.longitudeDeg);
        const pairs: [string, Date | null, Date | null][] = [
          ['sunset', night.sunset, evening.sunset],
          ['civil dusk', night.civil.dusk, evening.dusk],
          ['nautical dusk', night.nautical.dusk, evening.nauticalDusk],
          ['astronomical dusk', night.astronomical.dusk, evening.night],
          ['astronomical dawn', night.astronomical.dawn, morning.nightEnd],
          ['nautical dawn', night.nautical.dawn, morning.nauticalDawn],
          ['civil dawn', night.civil.dawn, morning.dawn],
          ['sunrise', night.sunrise, morning.sunrise],
        ];
        for (const [name, ours, theirs] of pairs) {
          expect(ours, `${id} ${date} ${name}`).not.toBeNull();
          expect(Math.abs(ours!.getTime() - theirs!.getTime()) / 60_000, `${id} ${date} ${name}`).toBeLessThan(2);
        }
      }
    });
  }
});
