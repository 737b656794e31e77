// Helpers shared by detection-probability maps (injection–recovery and known-phase): log-spaced
// axes and the mass at which a row of the map reaches a detection level.

/** `count` values from `min` to `max` inclusive, evenly spaced in log (one value: `min`). */
export function logSpaced(min: number, max: number, count: number): number[] {
  if (!(min > 0 && max >= min) || !Number.isInteger(count) || count < 1) throw new RangeError(`bad log grid: ${min} to ${max}, ${count} points`);
  if (count === 1) return [min];
  const ratio = Math.log(max / min);
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? max : min * Math.exp((ratio * i) / (count - 1))));
}

/** Where a detection level is reached along one period's row of masses. */
export type LevelMass =
  | { where: 'inside'; msiniEarth: number }
  /** Already reached at the smallest mass of the grid: only an upper bound is known. */
  | { where: 'below grid' }
  /** Not reached at the largest mass of the grid. */
  | { where: 'above grid' };

/**
 * The smallest m sin i at which the detection probability reaches `level`, along one row of a map
 * (masses ascending): the first grid mass j with p_j ≥ level, interpolated linearly in log mass
 * against the previous grid point (common practice for detection-limit curves). Monte Carlo noise
 * can make a row dip after its first crossing; the first crossing is the one reported.
 */
export function levelMass(msinisEarth: number[], probabilities: number[], level: number): LevelMass {
  const j = probabilities.findIndex((p) => p >= level);
  if (j < 0) return { where: 'above grid' };
  if (j === 0) return { where: 'below grid' };
  const p0 = probabilities[j - 1]!,
    p1 = probabilities[j]!;
  const l0 = Math.log(msinisEarth[j - 1]!),
    l1 = Math.log(msinisEarth[j]!);
  return { where: 'inside', msiniEarth: Math.exp(l0 + ((level - p0) / (p1 - p0)) * (l1 - l0)) };
}

/** The detection levels every map reports: 50% and 90%. */
export const DETECTION_LEVELS = [0.5, 0.9] as const;

export interface LevelRow {
  periodDays: number;
  levels: { level: number; mass: LevelMass }[];
}

/** The 50% and 90% detection mass of every period of a map (detection[i][j]: period i, mass j). */
export function levelRows(periodsDays: number[], msinisEarth: number[], detection: number[][]): LevelRow[] {
  return periodsDays.map((periodDays, i) => ({
    periodDays,
    levels: DETECTION_LEVELS.map((level) => ({ level, mass: levelMass(msinisEarth, detection[i]!, level) })),
  }));
}
