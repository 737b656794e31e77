// A star of the campaign as the information model sees it: its planet rows with their
// ephemerides and K, its jitter split into a white and a nightly part (or quasi-periodic activity
// when it has a rotation period), and the span of the campaign. Used by the planner, the report
// and the commands that read plans, so all of them judge visits by one model.
import { DateTime } from 'luxon';
import type { Target } from '../model.js';
import type { Campaign } from './campaign.js';
import { targetKMps } from '../orbit/target-k.js';
import { buildStarModel, type StarModel } from '../rv/information-model.js';
import { starNoise } from '../rv/star-noise.js';

/** The rows of a star that are planets to measure: an ephemeris and a K. */
export function planetRows(rows: Target[]): Target[] {
  return rows.filter((t) => t.ephemeris && targetKMps(t) !== undefined);
}

/** First and last instant of the campaign window as JD (noon of the first day to noon after the last; BJD within minutes). */
export function campaignSpanBjdTdb(campaign: Pick<Campaign, 'window' | 'site'>): [number, number] {
  const jd = (iso: string) => DateTime.fromISO(iso, { zone: campaign.site.timeZone }).toMillis() / 86_400_000 + 2_440_587.5;
  return [jd(campaign.window.start), jd(campaign.window.end) + 1];
}

/** The information model of a star with planets, or undefined when it has none. */
export function starModel(rows: Target[], campaign: Pick<Campaign, 'noise' | 'window' | 'site'>): StarModel | undefined {
  const planets = planetRows(rows);
  if (planets.length === 0) return undefined;
  const noise = starNoise(rows[0]!, campaign.noise.nightlyJitterFraction);
  return buildStarModel({
    planets: planets.map((t) => ({
      id: t.id,
      kMps: targetKMps(t)!,
      periodDays: t.ephemeris!.periodDays,
      tcBjdTdb: t.ephemeris!.tcBjdTdb,
      periodErrDays: t.ephemeris!.periodErrDays,
      tcErrDays: t.ephemeris!.tcErrDays,
      ecc: t.planet!.ecc,
      omegaDeg: t.planet!.omegaDeg,
      ...(t.planet!.eccPriorSigma !== undefined ? { eccPriorSigma: t.planet!.eccPriorSigma } : {}),
    })),
    nightlyJitterMps: noise.nightlyJitterMps,
    ...(noise.activity ? { activity: noise.activity } : {}),
    spanBjdTdb: campaignSpanBjdTdb(campaign),
  });
}

/** The campaign's rows grouped by star, in the order stars first appear. */
export function starsOf(targets: Target[]): Map<string, Target[]> {
  const stars = new Map<string, Target[]>();
  for (const t of targets) stars.set(t.starId, [...(stars.get(t.starId) ?? []), t]);
  return stars;
}
