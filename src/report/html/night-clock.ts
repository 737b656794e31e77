import type { Site } from '../../model.js';
import { clockTime } from '../../sky/local-time.js';
import { localSiderealDeg, siteClock } from '../../sky/target-position.js';

/** One tick of a night chart's time ruler: the same instant on the three clocks. */
export interface ClockTick {
  tMs: number;
  local: string;
  utc: string;
  /** Local apparent sidereal time, HH:MM. */
  lst: string;
}

const hhmm = (hours: number) => {
  const minutes = Math.round((((hours % 24) + 24) % 24) * 60) % 1440;
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
};

/**
 * Local time, UTC and local sidereal time at each instant. LST = GAST + east longitude, GAST from
 * astronomy-engine's SiderealTime at the night's middle, advanced at the sidereal rate
 * (src/sky/target-position.ts).
 */
export function clockTicks(site: Pick<Site, 'latitudeDeg' | 'longitudeDeg' | 'elevationM' | 'timeZone'>, instantsMs: number[]): ClockTick[] {
  if (!instantsMs.length) return [];
  const clock = siteClock(site, new Date((instantsMs[0]! + instantsMs.at(-1)!) / 2));
  return instantsMs.map((tMs) => ({
    tMs,
    local: clockTime(new Date(tMs), site.timeZone),
    utc: clockTime(new Date(tMs), site.timeZone, true),
    lst: hhmm(localSiderealDeg(clock, tMs) / 15),
  }));
}
