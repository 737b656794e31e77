// When the Sun or the Moon is below an altitude: astronomy-engine's SearchAltitude, chained.
import { type Body, Equator, Horizon, MakeTime, SearchAltitude, type Observer } from 'astronomy-engine';
import { DAY_MS } from '../astro/constants.js';

/** A span below the altitude, clipped to the search range; `startIsCrossing` is false when clipped. */
export interface BelowSpan {
  startMs: number;
  endMs: number;
  startIsCrossing: boolean;
  endIsCrossing: boolean;
}

/** Geometric (unrefracted) altitude of the body's centre, topocentric: SearchAltitude's definition. */
export function bodyAltitudeDeg(body: Body, observer: Observer, date: Date): number {
  const time = MakeTime(date);
  const eq = Equator(body, time, observer, true, true);
  return Horizon(time, observer, eq.ra, eq.dec).altitude;
}

/**
 * Every span inside [fromMs, toMs] when the centre of `body` is below `altitudeDeg` (geometric,
 * topocentric), found by chaining astronomy-engine's SearchAltitude (it brackets the altitude's
 * extrema, so no crossing is missed however short the span).
 */
export function belowSpans(body: Body, observer: Observer, altitudeDeg: number, fromMs: number, toMs: number): BelowSpan[] {
  const spans: BelowSpan[] = [];
  let cursorMs = fromMs;
  let below = bodyAltitudeDeg(body, observer, new Date(fromMs)) < altitudeDeg;
  let spanStartMs = fromMs;
  let spanStartIsCrossing = false;
  while (cursorMs < toMs) {
    const found = SearchAltitude(body, observer, below ? +1 : -1, new Date(cursorMs), (toMs - cursorMs) / DAY_MS, altitudeDeg);
    const atMs = found ? found.date.getTime() : toMs;
    if (!found || atMs >= toMs) break;
    if (below) spans.push({ startMs: spanStartMs, endMs: atMs, startIsCrossing: spanStartIsCrossing, endIsCrossing: true });
    else {
      spanStartMs = atMs;
      spanStartIsCrossing = true;
    }
    below = !below;
    // Step past the root so the next search does not find it again.
    cursorMs = atMs + 1000;
  }
  if (below) spans.push({ startMs: spanStartMs, endMs: toMs, startIsCrossing: spanStartIsCrossing, endIsCrossing: false });
  return spans;
}
