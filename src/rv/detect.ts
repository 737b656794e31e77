// Detectability of a Keplerian signal of known period and phase with a free offset: σ_K after N
// visits, visits needed for K/σ_K = n, the probability of a detection at small N, and the
// smallest detectable m sin i. The instrument floor is a term of σ_K that does not average down:
// σ_K² = σ²/E[S] + (σ_floor/n)², so K/σ_K never exceeds n K/σ_floor and no K at or below the floor
// reaches K/σ_K = n, however many visits (Crest's rule, README "Noise model").

import { planetMassFromKEarth } from '../orbit/minimum-mass.js';
import { standardNormalMean } from './gauss-hermite.js';
import { normalCdf } from './normal-cdf.js';

/**
 * 'random': visits at random orbital phases; 'quadrature': visits split evenly between the two
 * quadratures (phases 0.25 and 0.75), the best any schedule can do for K.
 */
export type PhaseLayout = 'random' | 'quadrature';
export const PHASE_LAYOUTS: readonly PhaseLayout[] = ['random', 'quadrature'];

/** Fewest visits for any fit: the offset γ and K. */
export const MIN_VISITS = 2;

/**
 * Least squares for v = γ + K s(t) with known phase gives Var(K̂) = σ² / S, S = Σ (s_i − s̄)².
 * Balanced quadratures (s = ±1) give S = N. Uniform random phases (s = sin 2πφ, E s² = 1/2,
 * E s⁴ = 3/8) give E S = (N − 1)/2 and Var S = N/8 + 1/4 − 3/(8N) (derived in README, "Noise
 * model"; checked against simulation in test/rv/detect-small-n.test.ts).
 */
export function phaseSumMoments(visits: number, layout: PhaseLayout): { mean: number; variance: number } {
  if (layout === 'quadrature') return { mean: visits, variance: 0 };
  return { mean: (visits - 1) / 2, variance: visits / 8 + 1 / 4 - 3 / (8 * visits) };
}

/** The floor's term of σ_K (m/s) for a goal of n: σ_floor / n, so that K = σ_floor is the limit of K = n σ_K. */
export function floorOnKMps(floorMps: number, goalSignificance: number): number {
  return floorMps / goalSignificance;
}

/**
 * σ_K (m/s) after N visits: √(σ² / E[S] + floorOnK²). σ is the scatter that averages down (photon
 * and jitter); floorOnK (floorOnKMps) is the floor's term, which no number of visits removes.
 */
export function sigmaKMps(whiteSigmaMps: number, visits: number, layout: PhaseLayout, floorOnK = 0): number {
  return Math.sqrt(whiteSigmaMps ** 2 / phaseSumMoments(visits, layout).mean + floorOnK ** 2);
}

/**
 * Visits (not rounded) for K/σ_K = n: solve K² = n² σ²/E[S] + f², i.e. E[S] = n²σ² / (K² − f²)
 * with f the floor: N = 2 E[S] + 1 at random phases, N = E[S] at quadratures. Infinity when K ≤ f.
 */
export function visitsExact(kMps: number, whiteSigmaMps: number, goalSignificance: number, layout: PhaseLayout, floorMps = 0): number {
  const room = kMps ** 2 - floorMps ** 2;
  if (room <= 0) return Infinity;
  const sumNeeded = (goalSignificance * whiteSigmaMps) ** 2 / room;
  return layout === 'random' ? 2 * sumNeeded + 1 : sumNeeded;
}

/** Visits needed for K/σ_K ≥ n (visitsExact rounded up, at least MIN_VISITS; Infinity when out of reach). */
export function visitsNeeded(kMps: number, whiteSigmaMps: number, goalSignificance: number, layout: PhaseLayout, floorMps = 0): number {
  const exact = visitsExact(kMps, whiteSigmaMps, goalSignificance, layout, floorMps);
  // The small allowance keeps an exact 50.000000001 (rounding in the arithmetic) at 50.
  return Number.isFinite(exact) ? Math.max(MIN_VISITS, Math.ceil(exact - 1e-9)) : Infinity;
}

/**
 * Probability that K̂/σ_K exceeds n when K̂ is normal with mean K and spread σ_K:
 * P = Φ(K/σ_K − n) (for a σ_K known in advance, e.g. from the planned phases).
 */
export function detectionProbabilityKnownPhase(kMps: number, sigmaK: number, goalSignificance: number): number {
  return normalCdf(kMps / sigmaK - goalSignificance);
}

/**
 * Probability of K̂/σ_K > n after N visits, averaged over the phases the visits fall at:
 * P = E_S[Φ(K / √(σ²/S + (f/n)²) − n)], f the floor. At random phases S is given the gamma distribution with
 * E S and Var S of phaseSumMoments, taken by the cube-root normal approximation [WilsonHilferty1931]
 * and 20-point Gauss–Hermite; within 0.03 of a
 * free-offset Monte Carlo for N ≥ 5 (test/rv/detect-small-n.test.ts). At quadratures S = N.
 */
export function detectionProbability(kMps: number, whiteSigmaMps: number, visits: number, goalSignificance: number, layout: PhaseLayout, floorMps = 0): number {
  const floorOnK = floorOnKMps(floorMps, goalSignificance);
  const at = (s: number) => (s <= 0 ? 0 : normalCdf(kMps / Math.sqrt(whiteSigmaMps ** 2 / s + floorOnK ** 2) - goalSignificance));
  const { mean, variance } = phaseSumMoments(visits, layout);
  if (variance === 0) return at(mean);
  const shape = (mean * mean) / variance;
  const c = 1 / (9 * shape);
  return standardNormalMean((z) => at(mean * Math.max(0, 1 - c + z * Math.sqrt(c)) ** 3));
}

/** The smallest K (m/s) reaching K/σ_K = n with N visits: K = n σ_K, always above the floor. */
export function minimumDetectableKMps(whiteSigmaMps: number, visits: number, goalSignificance: number, layout: PhaseLayout, floorMps = 0): number {
  return goalSignificance * sigmaKMps(whiteSigmaMps, visits, layout, floorOnKMps(floorMps, goalSignificance));
}

/** The K (m/s) detected with probability `level` after N visits (bisection; P rises with K). */
export function kAtProbabilityMps(
  whiteSigmaMps: number,
  visits: number,
  goalSignificance: number,
  layout: PhaseLayout,
  floorMps: number,
  level: number,
): number {
  let lo = 0;
  let hi = 2 * minimumDetectableKMps(whiteSigmaMps, visits, goalSignificance, layout, floorMps) + 1e-9;
  while (detectionProbability(hi, whiteSigmaMps, visits, goalSignificance, layout, floorMps) < level) hi *= 2;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (detectionProbability(mid, whiteSigmaMps, visits, goalSignificance, layout, floorMps) < level) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** Completeness levels of the mass limits: half and nine in ten of such planets detected. */
export const COMPLETENESS_LEVELS = [0.5, 0.9] as const;

export interface MassLimitRow {
  periodDays: number;
  /** Smallest detectable K (K/σ_K = n in expectation) at random phases, and the m sin i it means. */
  kMinRandomMps: number;
  massMinRandomEarth: number;
  /** The same at ideal quadratures. */
  kMinQuadratureMps: number;
  massMinQuadratureEarth: number;
  /** m sin i detected in 50% and in 90% of campaigns at random phases. */
  mass50RandomEarth: number;
  mass90RandomEarth: number;
}

export interface MassLimitInput {
  starMassSun: number;
  /** Per-visit scatter that averages down (m/s). */
  whiteSigmaMps: number;
  /** Instrument floor (m/s), a term of σ_K that does not average down; default 0. */
  floorMps?: number;
  visits: number;
  goalSignificance: number;
  periodsDays: readonly number[];
  ecc?: number;
}

/**
 * Minimum detectable m sin i against period: K_min = n σ_K(N), and the K detected with 50% and
 * 90% probability, turned into masses with the exact inverse of K (src/orbit/minimum-mass.ts).
 */
export function massLimitTable(input: MassLimitInput): MassLimitRow[] {
  const { starMassSun, whiteSigmaMps, visits, goalSignificance, ecc = 0, floorMps = 0 } = input;
  const kRandom = minimumDetectableKMps(whiteSigmaMps, visits, goalSignificance, 'random', floorMps);
  const kQuad = minimumDetectableKMps(whiteSigmaMps, visits, goalSignificance, 'quadrature', floorMps);
  const [k50, k90] = COMPLETENESS_LEVELS.map((level) => kAtProbabilityMps(whiteSigmaMps, visits, goalSignificance, 'random', floorMps, level)) as [
    number,
    number,
  ];
  const mass = (kMps: number, periodDays: number) => planetMassFromKEarth({ starMassSun, kMps, periodDays, ecc });
  return input.periodsDays.map((periodDays) => ({
    periodDays,
    kMinRandomMps: kRandom,
    massMinRandomEarth: mass(kRandom, periodDays),
    kMinQuadratureMps: kQuad,
    massMinQuadratureEarth: mass(kQuad, periodDays),
    mass50RandomEarth: mass(k50, periodDays),
    mass90RandomEarth: mass(k90, periodDays),
  }));
}

/**
 * A logarithmic period grid on the 1–2–5 series (1, 2, 5, 10, 20, ...) from minDays to maxDays
 * inclusive: round numbers, three to a decade (common practice for log axes).
 */
export function periodGridDays(minDays: number, maxDays: number): number[] {
  const grid: number[] = [];
  for (let decade = Math.floor(Math.log10(minDays)); 10 ** decade <= maxDays; decade++) {
    for (const step of [1, 2, 5]) {
      // Rounded to 12 significant figures so that 10^-1 · 2 prints as 0.2.
      const p = Number((step * 10 ** decade).toPrecision(12));
      if (p >= minDays && p <= maxDays) grid.push(p);
    }
  }
  return grid;
}
