// The campaign's observed rows as visits the plan can count: times on both scales, the evening
// they belong to, and the white noise the information model gives them.
import { DateTime } from 'luxon';
import { starBjdTdb } from '../astro/bjd.js';
import type { Target } from '../model.js';
import type { Campaign } from './campaign.js';
import type { ObservedVisit } from './plan-schema.js';
import { visitPrecision } from '../rv/precision.js';
import { whiteSigmaMps } from '../rv/star-noise.js';
import { TYPICAL_AIRMASS } from '../rv/target-detect.js';
import type { StarSetup } from './candidates.js';

const DAY_MS = 86_400_000;
const JD_UNIX_EPOCH = 2_440_587.5;

/** UTC of a BJD_TDB towards a star: the barycentric correction inverted by two fixed-point steps (it changes by < 1 ms over its own size). */
function utcOfBjdTdb(bjd: number, star: Target): Date {
  let ms = (bjd - JD_UNIX_EPOCH) * DAY_MS;
  for (let i = 0; i < 2; i++) ms -= (starBjdTdb(new Date(ms), star) - bjd) * DAY_MS;
  return new Date(Math.round(ms));
}

/** The local date of the evening a moment belongs to: its local time less 12 hours (common practice for observing nights). */
export function eveningDate(at: Date, timeZone: string): string {
  return DateTime.fromJSDate(at, { zone: timeZone }).minus({ hours: 12 }).toISODate()!;
}

/**
 * Every observed row with its star, both time scales and its white noise: the row's RV
 * uncertainty when given, else the campaign instrument's σ for the star at the typical
 * airmass, with the white part of the star's jitter (star-noise.ts). In time order.
 */
export function observedVisits(campaign: Campaign, stars: StarSetup[]): ObservedVisit[] {
  const observed = campaign.observed;
  if (!observed) return [];
  const starOf = new Map<string, StarSetup>();
  for (const s of stars) {
    starOf.set(s.starId, s);
    for (const row of s.rows) starOf.set(row.target.id, s);
  }
  // The instrument's σ for a star, once per star (it does not depend on the row).
  const starMps = new Map<string, number>();
  const instrumentMpsOf = (setup: StarSetup) => {
    if (!starMps.has(setup.starId)) {
      starMps.set(
        setup.starId,
        visitPrecision(campaign.instrument, setup.star, setup.exposure.exposureSec, TYPICAL_AIRMASS, { seeingArcsec: campaign.site.medianSeeingArcsec })
          .visitSigmaMps,
      );
    }
    return starMps.get(setup.starId)!;
  };
  const visits = observed.rows.map((row): ObservedVisit => {
    const setup = starOf.get(row.targetId)!;
    const at = row.midUtc !== undefined ? new Date(row.midUtc) : utcOfBjdTdb(row.midBjdTdb!, setup.star);
    const instrumentMps = row.rvErrorMps ?? instrumentMpsOf(setup);
    const visit: ObservedVisit = {
      targetId: row.targetId,
      starId: setup.starId,
      midBjdTdb: row.midBjdTdb ?? starBjdTdb(at, setup.star),
      midUtc: DateTime.fromJSDate(at, { zone: 'utc' }).toISO({ suppressMilliseconds: true })!,
      localDate: eveningDate(at, campaign.site.timeZone),
      instrument: row.instrument,
      whiteSigmaMps: whiteSigmaMps(instrumentMps, setup.noise),
      source: `${observed.file} row ${row.row}`,
    };
    if (row.rvMps !== undefined) visit.rvMps = row.rvMps;
    if (row.rvErrorMps !== undefined) visit.rvErrorMps = row.rvErrorMps;
    return visit;
  });
  return visits.sort((a, b) => a.midBjdTdb - b.midBjdTdb);
}
