import { DateTime } from 'luxon';
import type { Site } from '../model.js';

/** Month-day bounds of the two semesters, `MM-DD`; B may run into the next year. */
export type Semesters = NonNullable<Site['semesters']>;

/**
 * Default semester boundaries when a site file gives none: A from 1 February to 31 July,
 * B from 1 August to 31 January (a convention used by several observatories; common practice).
 */
export const DEFAULT_SEMESTERS: Semesters = { A: { start: '02-01', end: '07-31' }, B: { start: '08-01', end: '01-31' } };

/** The dates of semester `2027A` / `2027B` at a site: an end before the start falls in the next year. */
export function semesterWindow(label: string, semesters: Semesters = DEFAULT_SEMESTERS): { start: string; end: string } {
  const year = Number(label.slice(0, 4));
  const bounds = semesters[label.slice(4) as 'A' | 'B'];
  const start = `${year}-${bounds.start}`;
  const endYear = bounds.end < bounds.start ? year + 1 : year;
  const end = DateTime.fromISO(`${endYear}-${bounds.end}`).toISODate()!;
  return { start, end };
}
