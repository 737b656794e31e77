import type { Night } from '../../model.js';

export type SkyState = 'day' | 'civil twilight' | 'nautical twilight' | 'astronomical twilight' | 'night';
export const SKY_STATES: readonly SkyState[] = ['day', 'civil twilight', 'nautical twilight', 'astronomical twilight', 'night'];

export interface SkyBand {
  state: SkyState;
  startMs: number;
  endMs: number;
}

/**
 * The sky's state between two instants from a night's Sun crossings (sunset, the civil, nautical
 * and astronomical twilight edges, and their dawn mirrors): one band per state change, so a
 * night where the Sun never reaches a level simply has no band of that level.
 */
export function skyBands(night: Night, fromMs: number, toMs: number): SkyBand[] {
  const events: { at: Date | null; before: SkyState; after: SkyState }[] = [
    { at: night.sunset, before: 'day', after: 'civil twilight' },
    { at: night.civil.dusk, before: 'civil twilight', after: 'nautical twilight' },
    { at: night.nautical.dusk, before: 'nautical twilight', after: 'astronomical twilight' },
    { at: night.astronomical.dusk, before: 'astronomical twilight', after: 'night' },
    { at: night.astronomical.dawn, before: 'night', after: 'astronomical twilight' },
    { at: night.nautical.dawn, before: 'astronomical twilight', after: 'nautical twilight' },
    { at: night.civil.dawn, before: 'nautical twilight', after: 'civil twilight' },
    { at: night.sunrise, before: 'civil twilight', after: 'day' },
  ];
  const crossings = events
    .filter((e): e is { at: Date; before: SkyState; after: SkyState } => e.at !== null)
    .map((e) => ({ ms: e.at.getTime(), before: e.before, after: e.after }))
    .sort((a, b) => a.ms - b.ms);
  const bands: SkyBand[] = [];
  let state: SkyState = crossings[0]?.before ?? (night.darkHours > 0 ? 'night' : 'day');
  let start = fromMs;
  for (const c of crossings) {
    if (c.ms > start && c.ms < toMs) {
      bands.push({ state, startMs: start, endMs: c.ms });
      start = c.ms;
    }
    state = c.after;
  }
  if (toMs > start) bands.push({ state, startMs: start, endMs: toMs });
  return bands;
}
