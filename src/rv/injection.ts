import { radialVelocityMps } from '../orbit/rv-curve.js';
import { semiAmplitudeMps } from '../orbit/semi-amplitude.js';
import { fapBaluev, fapContext, type FapContext } from './fap.js';
import {
  DEFAULT_MAX_PERIOD_PER_BASELINE,
  DEFAULT_MIN_PERIOD_DAYS,
  baselineDays,
  frequencyGrid,
  gridFrequency,
  type FrequencyGrid,
  type FrequencyGridOptions,
} from './frequency-grid.js';
import { argMax } from './periodogram-peaks.js';
import { glsKernel, type GlsKernel } from './periodogram.js';
import { createRng, deriveSeed, type Rng } from './random.js';

/**
 * Injection–recovery: how often a blind periodogram search of given visits finds a planet of a
 * given period and m sin i. For each cell of a (period × mass) grid, `trialsPerCell` times:
 * a Keplerian signal with random phase (and, if asked, random eccentricity and ω) is sampled at
 * the visit times, Gaussian noise of each visit's σ_eff is added, the GLS periodogram is computed,
 * and the trial counts as a detection when the highest peak lies within the frequency resolution
 * 1/T of the injected frequency AND its false-alarm probability over the band (Baluev 2008) is
 * below the threshold (common practice for detection-limit maps, e.g. Cumming et al. 2008,
 * PASP 120, 531, from memory).
 */
export type EccentricityModel =
  | { distribution: 'fixed'; value: number }
  /** e uniform in [0, max], ω uniform in [0°, 360°). */
  | { distribution: 'uniform'; max: number };

export interface InjectionInput {
  /** Visit times, BJD_TDB days. */
  timesBjdTdb: number[];
  /** Each visit's effective σ (photon noise, floor and jitter together), m/s: noise and weights 1/σ². */
  rvErrorsMps: number[];
  periodsDays: number[];
  msinisEarth: number[];
  starMassSun: number;
  trialsPerCell: number;
  seed: number;
  /** Detection threshold on the band FAP (default 0.01). */
  fapThreshold?: number;
  /** Default: circular orbits. */
  eccentricity?: EccentricityModel;
  /**
   * Search band. Defaults: the periodogram defaults (1.5 d to twice the baseline, oversampling 10),
   * widened to 0.9 × the shortest and 1.1 × the longest injected period when those fall outside.
   */
  grid?: FrequencyGridOptions;
}

/** Everything a cell needs, prepared once: a worker thread rebuilds it from the same input. */
export interface InjectionSetup {
  input: InjectionInput;
  grid: FrequencyGrid;
  kernel: GlsKernel;
  fap: FapContext;
  fapThreshold: number;
}

export interface InjectionMap {
  periodsDays: number[];
  msinisEarth: number[];
  trialsPerCell: number;
  fapThreshold: number;
  /** detection[i][j]: fraction of trials detected at periodsDays[i], msinisEarth[j]. */
  detection: number[][];
  /** Semi-amplitude of each cell for a circular orbit, m/s (the eccentric K is larger by 1/√(1 − e²)). */
  kCircularMps: number[][];
  grid: FrequencyGrid;
}

export const DEFAULT_FAP_THRESHOLD = 0.01;

function checkInput(input: InjectionInput): void {
  const { timesBjdTdb, rvErrorsMps, periodsDays, msinisEarth, trialsPerCell, starMassSun } = input;
  if (timesBjdTdb.length !== rvErrorsMps.length) throw new RangeError(`times and sigma differ in length: ${timesBjdTdb.length} and ${rvErrorsMps.length}`);
  if (periodsDays.length === 0 || msinisEarth.length === 0) throw new RangeError('need at least one period and one mass');
  if (!periodsDays.every((p) => p > 0) || !msinisEarth.every((m) => m > 0) || !(starMassSun > 0)) throw new RangeError('periods and masses must be positive');
  if (!Number.isInteger(trialsPerCell) || trialsPerCell < 1) throw new RangeError(`trialsPerCell must be a positive integer, got ${trialsPerCell}`);
  const e = input.eccentricity;
  const eMax = e === undefined ? 0 : e.distribution === 'fixed' ? e.value : e.max;
  if (!(eMax >= 0 && eMax < 1)) throw new RangeError(`eccentricity must lie in [0, 1), got ${eMax}`);
}

/** The periodogram grid of an injection map: the defaults, widened to cover the injected periods. */
export function injectionGrid(input: InjectionInput): FrequencyGrid {
  const baseline = baselineDays(input.timesBjdTdb);
  return frequencyGrid(input.timesBjdTdb, {
    ...input.grid,
    minPeriodDays: input.grid?.minPeriodDays ?? Math.min(DEFAULT_MIN_PERIOD_DAYS, 0.9 * Math.min(...input.periodsDays)),
    maxPeriodDays: input.grid?.maxPeriodDays ?? Math.max(DEFAULT_MAX_PERIOD_PER_BASELINE * baseline, 1.1 * Math.max(...input.periodsDays)),
  });
}

/** Builds the grid, the periodogram kernel and the FAP context shared by every cell. */
export function prepareInjection(input: InjectionInput): InjectionSetup {
  checkInput(input);
  const grid = injectionGrid(input);
  return {
    input,
    grid,
    kernel: glsKernel(input.timesBjdTdb, input.rvErrorsMps, grid),
    fap: fapContext(input.timesBjdTdb, input.rvErrorsMps, grid),
    fapThreshold: input.fapThreshold ?? DEFAULT_FAP_THRESHOLD,
  };
}

function drawEccentricity(model: EccentricityModel | undefined, rng: Rng): { ecc: number; omegaDeg: number } {
  if (model === undefined) return { ecc: 0, omegaDeg: 90 };
  const ecc = model.distribution === 'fixed' ? model.value : model.max * rng.uniform();
  return { ecc, omegaDeg: 360 * rng.uniform() };
}

/**
 * Detection probability of one cell (period index i, mass index j). Its random stream is seeded
 * from (seed, cell index), so a cell gives the same answer whichever thread or order runs it.
 */
export function detectionProbability(setup: InjectionSetup, i: number, j: number): number {
  const { input, grid, kernel, fap, fapThreshold } = setup;
  const { timesBjdTdb, rvErrorsMps, periodsDays, msinisEarth, starMassSun, trialsPerCell } = input;
  const periodDays = periodsDays[i]!;
  const rng = createRng(deriveSeed(input.seed, i * msinisEarth.length + j));
  const toleranceFreq = 1 / grid.baselineDays;
  const values = new Float64Array(timesBjdTdb.length);
  const power = new Float64Array(grid.count);
  let detected = 0;
  for (let trial = 0; trial < trialsPerCell; trial++) {
    const { ecc, omegaDeg } = drawEccentricity(input.eccentricity, rng);
    const kMps = semiAmplitudeMps({ starMassSun, planetMassEarth: msinisEarth[j]!, periodDays, ecc });
    // Random phase: the periastron time uniform over one period.
    const orbit = { kMps, periodDays, ecc, omegaDeg, periastronBjdTdb: timesBjdTdb[0]! + periodDays * rng.uniform() };
    for (let n = 0; n < values.length; n++) values[n] = radialVelocityMps(orbit, timesBjdTdb[n]!) + rvErrorsMps[n]! * rng.normal();
    kernel.power(values, power);
    const best = argMax(power);
    const nearInjected = Math.abs(gridFrequency(grid, best) - 1 / periodDays) < toleranceFreq;
    if (nearInjected && fapBaluev(power[best]!, fap) < fapThreshold) detected++;
  }
  return detected / trialsPerCell;
}

/** The full map, one cell after another (a pure function of its input). */
export function injectionRecovery(input: InjectionInput): InjectionMap {
  const setup = prepareInjection(input);
  const masses = input.msinisEarth.length;
  const flat = Array.from({ length: input.periodsDays.length * masses }, (_, cell) => detectionProbability(setup, Math.floor(cell / masses), cell % masses));
  return injectionMapFromCells(setup, flat);
}

/** Cell values flat in cell order (period index · masses + mass index) as rows per period. */
export function rowsOfCells(flat: number[], periods: number, masses: number): number[][] {
  return Array.from({ length: periods }, (_, i) => flat.slice(i * masses, (i + 1) * masses));
}

/** The map from every cell's detection probability, flat in cell order (period index · masses + mass index). */
export function injectionMapFromCells(setup: InjectionSetup, flat: number[]): InjectionMap {
  const { periodsDays, msinisEarth, starMassSun } = setup.input;
  return {
    periodsDays,
    msinisEarth,
    trialsPerCell: setup.input.trialsPerCell,
    fapThreshold: setup.fapThreshold,
    detection: rowsOfCells(flat, periodsDays.length, msinisEarth.length),
    kCircularMps: periodsDays.map((periodDays) => msinisEarth.map((planetMassEarth) => semiAmplitudeMps({ starMassSun, planetMassEarth, periodDays }))),
    grid: setup.grid,
  };
}
