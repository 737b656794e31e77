import { type FrequencyGrid, gridFrequency } from './frequency-grid.js';

/** A local maximum of a periodogram. */
export interface Peak {
  /** Grid index of the local maximum. */
  index: number;
  /** Frequency refined by a parabola through the three grid points around the maximum, cycles/day. */
  freqPerDay: number;
  periodDays: number;
  /** Power at the grid point. */
  power: number;
}

/**
 * The `top` highest distinct peaks, highest first: local maxima of the power (a point higher than
 * its left neighbour and at least as high as its right one), so neighbouring grid points on the
 * flank of one peak are never listed twice. The frequency of each is refined by the vertex of the
 * parabola through the three points around it (common practice).
 */
export function findPeaks(power: ArrayLike<number>, grid: FrequencyGrid, top: number): Peak[] {
  const peaks: Peak[] = [];
  const last = power.length - 1;
  for (let k = 0; k <= last; k++) {
    const here = power[k]!;
    const left = k > 0 ? power[k - 1]! : -Infinity;
    const right = k < last ? power[k + 1]! : -Infinity;
    if (!(here > left && here >= right)) continue;
    let shift = 0;
    if (k > 0 && k < last) {
      const curvature = left - 2 * here + right;
      if (curvature < 0) shift = (0.5 * (left - right)) / curvature;
    }
    const freqPerDay = gridFrequency(grid, k + shift);
    peaks.push({ index: k, freqPerDay, periodDays: 1 / freqPerDay, power: here });
  }
  peaks.sort((a, b) => b.power - a.power || a.index - b.index);
  return peaks.slice(0, top);
}

/** Index of the highest power (the first one on ties). */
export function argMax(values: ArrayLike<number>): number {
  let best = 0;
  for (let k = 1; k < values.length; k++) if (values[k]! > values[best]!) best = k;
  return best;
}
