// The best periodogram peak of a blind-search star's RVs so far, and whether it is significant.
// Offered to the plan only: nothing adopts it as a planet.
import { validationError } from '../errors.js';
import { baselineDays } from './frequency-grid.js';
import { searchPeriodogram } from './periodogram-search.js';

/** FAP below which a peak is flagged as significant (common practice: 1%). */
export const BLIND_PEAK_FAP = 0.01;
/** Fewest points: the FAP of a floating-offset sinusoid needs N − 4 ≥ 1 (as for an RV series file). */
export const BLIND_PEAK_MIN_POINTS = 5;

export interface BlindPeak {
  periodDays: number;
  /** Semi-amplitude of the sinusoid fitted at the peak, m/s. */
  kMps: number;
  /** False-alarm probability over the searched band [Baluev2008]. */
  fap: number;
  /** fap < the level asked for. */
  significant: boolean;
  fapLevel: number;
}

/**
 * The highest GLS peak ([GLS], [FAP]) of the RVs between periodMinDays and periodMaxDays, weights
 * 1/(σ² + jitter²). Each instrument's weighted mean is subtracted first, so that offsets between
 * instruments make no peak (common practice). Undefined with fewer than BLIND_PEAK_MIN_POINTS points
 * or times that span nothing.
 */
export function blindPeak(
  points: { bjdTdb: number; rvMps: number; rvErrorMps: number; instrument: string }[],
  range: { periodMinDays: number; periodMaxDays: number },
  jitterMps: number,
  fapLevel = BLIND_PEAK_FAP,
): BlindPeak | undefined {
  if (!(fapLevel > 0 && fapLevel < 1)) throw validationError('fapLevel', fapLevel, 'a probability between 0 and 1');
  const times = points.map((pt) => pt.bjdTdb);
  if (points.length < BLIND_PEAK_MIN_POINTS || !(baselineDays(times) > 0)) return undefined;
  const sigma = points.map((pt) => Math.sqrt(pt.rvErrorMps ** 2 + jitterMps ** 2));
  const means = new Map<string, { sum: number; weight: number }>();
  points.forEach((pt, i) => {
    const m = means.get(pt.instrument) ?? { sum: 0, weight: 0 };
    m.sum += pt.rvMps / sigma[i]! ** 2;
    m.weight += 1 / sigma[i]! ** 2;
    means.set(pt.instrument, m);
  });
  const values = points.map((pt) => pt.rvMps - means.get(pt.instrument)!.sum / means.get(pt.instrument)!.weight);
  const search = searchPeriodogram(times, values, sigma, { minPeriodDays: range.periodMinDays, maxPeriodDays: range.periodMaxDays, top: 1 });
  const peak = search.peaks[0];
  if (!peak) return undefined;
  return { periodDays: peak.periodDays, kMps: peak.amplitudeMps, fap: peak.fapBaluev, significant: peak.fapBaluev < fapLevel, fapLevel };
}
