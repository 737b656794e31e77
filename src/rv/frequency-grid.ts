import { validationError } from '../errors.js';

/**
 * The frequency grid of a periodogram: uniform in frequency, step 1/(T · oversample) with T the
 * baseline of the series, from 1/maxPeriod to 1/minPeriod (frequencies in cycles per day).
 *
 * A peak of a series of baseline T has a width of about 1/T in frequency (common practice); an
 * oversampling factor of 5 to 10 puts several grid points on every peak so its height is not
 * missed (VanderPlas 2018, ApJS 236, 16, section 7.1, recommends 5 to 10).
 */
export const DEFAULT_OVERSAMPLE = 10;
/** Default shortest period (days): with one visit per night, shorter periods are dominated by the one-day alias. */
export const DEFAULT_MIN_PERIOD_DAYS = 1.5;
/** Default longest period as a multiple of the baseline. */
export const DEFAULT_MAX_PERIOD_PER_BASELINE = 2;

export interface FrequencyGridOptions {
  /** Shortest period searched, days (default 1.5). */
  minPeriodDays?: number;
  /** Longest period searched, days (default twice the baseline). */
  maxPeriodDays?: number;
  /** Grid points per resolution element 1/T (default 10). */
  oversample?: number;
}

/** A uniform frequency grid: f_k = startPerDay + k · stepPerDay, k = 0 … count − 1. */
export interface FrequencyGrid {
  startPerDay: number;
  stepPerDay: number;
  count: number;
  baselineDays: number;
  minPeriodDays: number;
  maxPeriodDays: number;
  oversample: number;
}

/** Time span of the series, days. */
export function baselineDays(timesDays: ArrayLike<number>): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < timesDays.length; i++) {
    const t = timesDays[i]!;
    if (t < lo) lo = t;
    if (t > hi) hi = t;
  }
  return hi - lo;
}

/** The grid for a series; throws ValidationError on options that leave no frequency to search. */
export function frequencyGrid(timesDays: ArrayLike<number>, options: FrequencyGridOptions = {}): FrequencyGrid {
  const baseline = baselineDays(timesDays);
  if (!(baseline > 0)) throw validationError('timesDays', timesDays.length, 'at least two distinct times');
  const oversample = options.oversample ?? DEFAULT_OVERSAMPLE;
  const minPeriodDays = options.minPeriodDays ?? DEFAULT_MIN_PERIOD_DAYS;
  const maxPeriodDays = options.maxPeriodDays ?? DEFAULT_MAX_PERIOD_PER_BASELINE * baseline;
  if (!(oversample > 0)) throw validationError('oversample', oversample, 'a positive number');
  if (!(minPeriodDays > 0 && maxPeriodDays > minPeriodDays)) {
    throw validationError('minPeriodDays', minPeriodDays, `more than 0 and below maxPeriodDays (${maxPeriodDays})`);
  }
  const startPerDay = 1 / maxPeriodDays;
  const stepPerDay = 1 / (baseline * oversample);
  const count = Math.floor((1 / minPeriodDays - startPerDay) / stepPerDay) + 1;
  return { startPerDay, stepPerDay, count, baselineDays: baseline, minPeriodDays, maxPeriodDays, oversample };
}

/** Frequency of grid point k, cycles per day. */
export function gridFrequency(grid: FrequencyGrid, k: number): number {
  return grid.startPerDay + k * grid.stepPerDay;
}
