import { fapBaluev, fapContext, fapIndependent, fapSingle, powerAtFap, type FapContext } from './fap.js';
import { frequencyGrid, gridFrequency, type FrequencyGrid, type FrequencyGridOptions } from './frequency-grid.js';
import { findPeaks } from './periodogram-peaks.js';
import { glsAt, glsPeriodogram } from './periodogram.js';

/** One of the best peaks of a search, with the sinusoid fitted there and its false-alarm probabilities. */
export interface RankedPeak {
  rank: number;
  periodDays: number;
  freqPerDay: number;
  power: number;
  /** Semi-amplitude of the sinusoid fitted at this period, m/s. */
  amplitudeMps: number;
  /** A time (BJD_TDB) of maximum fitted velocity. */
  timeOfMaxBjdTdb: number;
  /** Over the band, Baluev 2008. */
  fapBaluev: number;
  /** Over the band, from the number of independent frequencies. */
  fapIndependent: number;
  /** At this one frequency, chosen in advance. */
  fapSingle: number;
}

export interface PeriodogramSearch {
  grid: FrequencyGrid;
  fap: FapContext;
  /** Power of a peak with a given band FAP (Baluev 2008). */
  levels: { fap: number; power: number }[];
  peaks: RankedPeak[];
  /** Power at every grid frequency. */
  power: Float64Array;
}

/** FAP levels printed beside the peaks. */
export const FAP_LEVELS = [0.1, 0.01, 0.001];

/**
 * Periodogram of one series and its `top` best distinct peaks. Each peak's frequency is refined
 * between grid points (parabola), its power and fitted sinusoid evaluated there, and kept at the
 * grid point instead if refining did not raise the power.
 */
export function searchPeriodogram(
  timesDays: ArrayLike<number>,
  valuesMps: ArrayLike<number>,
  rvErrorsMps: ArrayLike<number>,
  options: FrequencyGridOptions & { top?: number } = {},
): PeriodogramSearch {
  const grid = frequencyGrid(timesDays, options);
  const power = glsPeriodogram(timesDays, valuesMps, rvErrorsMps, grid);
  const fap = fapContext(timesDays, rvErrorsMps, grid);
  const peaks = findPeaks(power, grid, options.top ?? 5).map((peak, i): RankedPeak => {
    const refined = glsAt(timesDays, valuesMps, rvErrorsMps, peak.freqPerDay);
    const fit = refined.power >= peak.power ? refined : glsAt(timesDays, valuesMps, rvErrorsMps, gridFrequency(grid, peak.index));
    return {
      rank: i + 1,
      periodDays: 1 / fit.freqPerDay,
      freqPerDay: fit.freqPerDay,
      power: fit.power,
      amplitudeMps: fit.amplitudeMps,
      timeOfMaxBjdTdb: fit.timeOfMaxBjdTdb,
      fapBaluev: fapBaluev(fit.power, fap),
      fapIndependent: fapIndependent(fit.power, fap),
      fapSingle: fapSingle(fit.power, fap.n),
    };
  });
  const levels = FAP_LEVELS.map((level) => ({ fap: level, power: powerAtFap(level, fap) }));
  return { grid, fap, levels, peaks, power };
}
