import { Body, type Observer } from 'astronomy-engine';
import { bodyAltitudeDeg } from '../../sky/crossings.js';

/** One step of a night chart's sky strip: the Sun's altitude at its middle. */
export interface SunStep {
  startMs: number;
  endMs: number;
  sunAltitudeDeg: number;
}

/**
 * The sky strip of a night chart: [fromMs, toMs] cut into steps of `stepMs`, each with the Sun's
 * geometric topocentric altitude at its middle (astronomy-engine, src/sky/crossings.ts), so the
 * strip shades day, civil, nautical and astronomical twilight and night by the Sun itself.
 */
export function sunSteps(observer: Observer, fromMs: number, toMs: number, stepMs: number): SunStep[] {
  const steps: SunStep[] = [];
  for (let start = fromMs; start < toMs; start += stepMs) {
    const end = Math.min(toMs, start + stepMs);
    steps.push({ startMs: start, endMs: end, sunAltitudeDeg: bodyAltitudeDeg(Body.Sun, observer, new Date((start + end) / 2)) });
  }
  return steps;
}

/** The Moon's geometric altitude (deg) at each instant, null while it is below the horizon. */
export function moonAltitudes(observer: Observer, instantsMs: number[]): (number | null)[] {
  return instantsMs.map((t) => {
    const alt = bodyAltitudeDeg(Body.Moon, observer, new Date(t));
    return alt >= 0 ? alt : null;
  });
}
