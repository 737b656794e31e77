import { Body, Observer, SearchRiseSet } from 'astronomy-engine';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSite } from '../../src/io/site.js';
import { SITES_DIR } from '../../src/io/paths.js';
import { computeNights } from '../../src/sky/nights.js';

// Moonrise and moonset of each night, against astronomy-engine's own rise/set search (a second
// method: it searches the Moon's topocentric altitude with its actual semidiameter and standard
// refraction). Our horizon is a fixed -0.833 deg for the Moon's centre, so 3 minutes of slack.
const SLACK_MS = 3 * 60_000;

describe('moonrise and moonset between sunset and sunrise', () => {
  for (const id of ['la-silla', 'calar-alto']) {
    it(`match astronomy-engine's search at ${id} over 40 nights`, () => {
      const site = readSite(path.join(SITES_DIR, `${id}.json`));
      const observer = new Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
      for (const night of computeNights(site, '2027-03-01', '2027-04-09', 'nautical')) {
        const from = night.sunset!;
        const to = night.sunrise!;
        for (const [direction, ours] of [
          [1, night.moon.rise],
          [-1, night.moon.set],
        ] as const) {
          const found = SearchRiseSet(Body.Moon, observer, direction, from, 1);
          if (ours === null) {
            expect(found === null || found.date.getTime() > to.getTime() - SLACK_MS, `${night.localDate} ${direction}`).toBe(true);
          } else {
            expect(found, `${night.localDate} ${direction}`).not.toBeNull();
            expect(Math.abs(found!.date.getTime() - ours.getTime())).toBeLessThan(SLACK_MS);
            expect(ours.getTime()).toBeGreaterThanOrEqual(from.getTime());
            expect(ours.getTime()).toBeLessThanOrEqual(to.getTime());
          }
        }
      }
    });
  }
});
