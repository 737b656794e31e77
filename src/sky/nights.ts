// One Night per local evening: Sun set and rise, twilights, the dark span and the Moon.
import { Body, type Observer } from 'astronomy-engine';
import { SUNRISE_ALTITUDE_DEG, TWILIGHT_ALTITUDE_DEG } from '../astro/constants.js';
import { moonIlluminatedFraction, observerOf } from '../astro/bodies.js';
import type { Night, Site, TwilightLevel } from '../model.js';
import { belowSpans, type BelowSpan } from './crossings.js';
import { localDateRange, localNoon, nextLocalDate } from './local-time.js';

/**
 * The Moon counts as up when its topocentric centre is above -0.833 deg = -(34' + 16'): standard
 * refraction at the horizon plus the Sun's semidiameter, the rise/set altitude of
 * [Meeus1998 ch. 15] for a topocentric position. The Moon's mean semidiameter is 15.5', so its
 * upper limb is then 0.5' below the horizon. The same altitude is used for rise, set and "up"
 * everywhere in Crest.
 */
export const MOON_UP_ALTITUDE_DEG = -0.833;

/** The night's noon-to-noon search range in ms (local noon of the evening to local noon next day). */
export function nightRangeMs(site: Site, localDate: string): { fromMs: number; toMs: number } {
  return { fromMs: localNoon(localDate, site.timeZone).getTime(), toMs: localNoon(nextLocalDate(localDate), site.timeZone).getTime() };
}

interface LevelResult {
  dusk: Date | null;
  dawn: Date | null;
  /** The longest span below the level in the noon-to-noon range, or null. */
  span: BelowSpan | null;
  /** Why dusk or dawn is null, or undefined. */
  why?: string;
}

/**
 * The Sun below one level: the longest span below it between the two local noons. Its ends are
 * dusk and dawn when they are crossings; null when the Sun never gets that low (no span) or
 * stays below all day (the span is the whole range).
 */
function level(observer: Observer, altitudeDeg: number, fromMs: number, toMs: number, name: string): LevelResult {
  const spans = belowSpans(Body.Sun, observer, altitudeDeg, fromMs, toMs);
  if (spans.length === 0) return { dusk: null, dawn: null, span: null, why: `Sun never below ${altitudeDeg} deg (${name})` };
  const span = spans.reduce((a, b) => (b.endMs - b.startMs > a.endMs - a.startMs ? b : a));
  const dusk = span.startIsCrossing ? new Date(span.startMs) : null;
  const dawn = span.endIsCrossing ? new Date(span.endMs) : null;
  const why =
    !dusk && !dawn
      ? `Sun below ${altitudeDeg} deg all day (${name})`
      : !dusk || !dawn
        ? `Sun already below ${altitudeDeg} deg at a local noon (${name})`
        : undefined;
  return { dusk, dawn, span, why };
}

/** The first rise or set of a body inside [fromMs, toMs], from its spans below the horizon. */
function firstCrossing(spans: BelowSpan[], kind: 'rise' | 'set', fromMs: number, toMs: number): Date | null {
  const times = spans
    .flatMap((s) => (kind === 'rise' ? (s.endIsCrossing ? [s.endMs] : []) : s.startIsCrossing ? [s.startMs] : []))
    .filter((t) => t >= fromMs && t <= toMs);
  return times.length ? new Date(Math.min(...times)) : null;
}

/**
 * The Moon's illumination for one night, whether it is up in [darkStart, darkEnd], and its rise
 * and set between sunset and sunrise (the events an observer plans around; null when the Moon
 * does not rise or set then). Without a sunset or sunrise the local noons bound the search.
 */
function moonOfNight(
  observer: Observer,
  range: { fromMs: number; toMs: number },
  night: { startMs: number; endMs: number },
  dark: { startMs: number; endMs: number } | null,
): Night['moon'] {
  const spans = belowSpans(Body.Moon, observer, MOON_UP_ALTITUDE_DEG, range.fromMs, range.toMs);
  const midMs = dark ? (dark.startMs + dark.endMs) / 2 : (range.fromMs + range.toMs) / 2;
  const upDuringDark = dark !== null && !spans.some((s) => s.startMs <= dark.startMs && s.endMs >= dark.endMs);
  return {
    illumination: moonIlluminatedFraction(new Date(midMs)),
    rise: firstCrossing(spans, 'rise', night.startMs, night.endMs),
    set: firstCrossing(spans, 'set', night.startMs, night.endMs),
    upDuringDark,
  };
}

/** One Night for one local date (the evening's date at the site). */
export function computeNight(site: Site, localDate: string, twilight: TwilightLevel): Night {
  const observer = observerOf(site);
  const { fromMs, toMs } = nightRangeMs(site, localDate);
  const sun = level(observer, SUNRISE_ALTITUDE_DEG, fromMs, toMs, 'sunset/sunrise');
  const civil = level(observer, TWILIGHT_ALTITUDE_DEG.civil, fromMs, toMs, 'civil');
  const nautical = level(observer, TWILIGHT_ALTITUDE_DEG.nautical, fromMs, toMs, 'nautical');
  const astronomical = level(observer, TWILIGHT_ALTITUDE_DEG.astronomical, fromMs, toMs, 'astronomical');
  const chosen = { civil, nautical, astronomical }[twilight];
  const dark = chosen.span ? { startMs: chosen.span.startMs, endMs: chosen.span.endMs } : null;
  const notes = [sun, civil, nautical, astronomical].flatMap((l) => (l.why ? [l.why] : []));
  const night: Night = {
    localDate,
    sunset: sun.dusk,
    sunrise: sun.dawn,
    civil: { dusk: civil.dusk, dawn: civil.dawn },
    nautical: { dusk: nautical.dusk, dawn: nautical.dawn },
    astronomical: { dusk: astronomical.dusk, dawn: astronomical.dawn },
    darkStart: dark ? new Date(dark.startMs) : null,
    darkEnd: dark ? new Date(dark.endMs) : null,
    darkHours: dark ? (dark.endMs - dark.startMs) / 3_600_000 : 0,
    moon: moonOfNight(observer, { fromMs, toMs }, { startMs: sun.dusk?.getTime() ?? fromMs, endMs: sun.dawn?.getTime() ?? toMs }, dark),
  };
  if (notes.length) night.note = notes.join('; ');
  return night;
}

/**
 * One Night per local date from `fromLocalDate` to `toLocalDate` inclusive (YYYY-MM-DD, the
 * evening's date in the site's zone). Each night runs from local noon to the next local noon, so
 * a daylight-saving change makes that range 23 or 25 hours and nothing else. The dark span is the
 * longest span with the Sun below the chosen twilight level in that range.
 */
export function computeNights(site: Site, fromLocalDate: string, toLocalDate: string, twilight: TwilightLevel): Night[] {
  return localDateRange(fromLocalDate, toLocalDate).map((d) => computeNight(site, d, twilight));
}
