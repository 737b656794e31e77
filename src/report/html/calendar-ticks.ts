// Date ticks for the campaign calendar: whole weeks (Mondays) or whole months, each label with its year.

const DAY_MS = 86_400_000;

/** Tick steps from fine to coarse; each is tried until its ticks stand at least MIN_TICK_PX apart. */
const STEPS = [{ weeks: 1 }, { weeks: 2 }, { months: 1 }, { months: 2 }, { months: 3 }, { months: 6 }, { months: 12 }] as const;
const MIN_TICK_PX = 80;

export interface CalendarTicks {
  /** Tick instants, UTC midnights (ms). */
  values: number[];
  /** A d3 time format for the labels (vega's utcFormat): always with the year. */
  format: string;
}

function stepTicks(step: (typeof STEPS)[number], fromMs: number, toMs: number): number[] {
  const ticks: number[] = [];
  if ('weeks' in step) {
    // The first Monday on or after the start (getUTCDay: 0 is Sunday).
    const first = fromMs + ((8 - new Date(fromMs).getUTCDay()) % 7) * DAY_MS;
    for (let t = first; t <= toMs; t += step.weeks * 7 * DAY_MS) ticks.push(t);
    return ticks;
  }
  const start = new Date(fromMs);
  let month = start.getUTCFullYear() * 12 + start.getUTCMonth() + (start.getUTCDate() > 1 ? 1 : 0);
  month = Math.ceil(month / step.months) * step.months;
  for (let t = Date.UTC(Math.floor(month / 12), month % 12, 1); t <= toMs; month += step.months, t = Date.UTC(Math.floor(month / 12), month % 12, 1)) {
    ticks.push(t);
  }
  return ticks;
}

/**
 * The finest of weekly, fortnightly, monthly, ... ticks inside [fromMs, toMs] (UTC midnights) that
 * leave at least MIN_TICK_PX between labels on an axis `widthPx` wide; week ticks are labelled with
 * the day, month and year, month ticks with the month and year.
 */
export function calendarTicks(fromMs: number, toMs: number, widthPx: number): CalendarTicks {
  const pxPerMs = widthPx / Math.max(DAY_MS, toMs - fromMs);
  for (const step of STEPS) {
    const spacingMs = 'weeks' in step ? step.weeks * 7 * DAY_MS : step.months * 28 * DAY_MS;
    if (spacingMs * pxPerMs >= MIN_TICK_PX || step === STEPS.at(-1)) {
      const values = stepTicks(step, fromMs, toMs);
      if (values.length) return { values, format: 'weeks' in step ? '%-d %b %Y' : '%b %Y' };
    }
  }
  return { values: [fromMs], format: '%-d %b %Y' };
}
