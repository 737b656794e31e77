// Detectability of a Keplerian signal of known period and phase: σ_K after N visits, visits
// needed for K/σ_K = n, detection probability, and the smallest detectable m sin i.

import { planetMassFromKEarth } from '../orbit/minimum-mass.js';
import { normalCdf } from './normal-cdf.js';

/**
 * 'random': visits at random orbital phases; 'quadrature': visits split evenly between the two
 * quadratures (phases 0.25 and 0.75), the best any schedule can do for K.
 */
export type PhaseLayout = 'random' | 'quadrature';
export const PHASE_LAYOUTS: readonly PhaseLayout[] = ['random', 'quadrature'];

/**
 * Least squares for v = γ + K s(t) with known phase gives Var(K̂) = σ² / Σ (s_i − s̄)². Balanced
 * quadratures (s = ±1) reach σ²/N; uniform random phases give E Σ (s_i − s̄)² ≈ N/2, so
 * σ_K ≈ σ √(2/N) (docs/references.md [Visits-needed]; common practice).
 * Returns the factor c in σ_K = σ √(c/N).
 */
function layoutFactor(layout: PhaseLayout): number {
  return layout === 'random' ? 2 : 1;
}

/** σ_K (m/s) after `visits` visits of per-visit scatter σ, for a phase layout (see layoutFactor). */
export function sigmaKMps(sigmaMps: number, visits: number, layout: PhaseLayout): number {
  return sigmaMps * Math.sqrt(layoutFactor(layout) / visits);
}

/** Fewest visits for any fit: the offset γ and K. */
export const MIN_VISITS = 2;

/**
 * Visits needed for K/σ_K ≥ n: N = c (n σ / K)², rounded up, at least MIN_VISITS; c = 2 at random
 * phases, 1 at quadratures (docs/references.md [Visits-needed]).
 */
export function visitsNeeded(kMps: number, sigmaMps: number, significance: number, layout: PhaseLayout): number {
  const exact = layoutFactor(layout) * ((significance * sigmaMps) / kMps) ** 2;
  // The small allowance keeps an exact 50.000000001 (rounding in the arithmetic) at 50.
  return Math.max(MIN_VISITS, Math.ceil(exact - 1e-9));
}

/**
 * Probability that K̂/σ_K exceeds n when K̂ is normal with mean K and spread σ_K:
 * P = Φ(K/σ_K − n) (docs/references.md [Detection-probability]).
 */
export function detectionProbabilityKnownPhase(kMps: number, sigmaK: number, significance: number): number {
  return normalCdf(kMps / sigmaK - significance);
}

/** The smallest K (m/s) reaching K/σ_K = n with N visits: K = n σ_K. */
export function minimumDetectableKMps(sigmaMps: number, visits: number, significance: number, layout: PhaseLayout): number {
  return significance * sigmaKMps(sigmaMps, visits, layout);
}

export interface MassLimitRow {
  periodDays: number;
  /** Smallest detectable K at random phases, and the m sin i (Earth masses) it means. */
  kMinRandomMps: number;
  massMinRandomEarth: number;
  /** The same at ideal quadratures. */
  kMinQuadratureMps: number;
  massMinQuadratureEarth: number;
}

export interface MassLimitInput {
  starMassSun: number;
  /** Per-visit scatter σ_eff (m/s). */
  sigmaMps: number;
  visits: number;
  significance: number;
  periodsDays: readonly number[];
  ecc?: number;
}

/**
 * Minimum detectable m sin i against period: K_min = n σ_K(N) turned into a mass with the exact
 * inverse of K (src/orbit/minimum-mass.ts; Cumming, Marcy & Butler 1999).
 */
export function massLimitTable(input: MassLimitInput): MassLimitRow[] {
  const { starMassSun, sigmaMps, visits, significance, ecc = 0 } = input;
  const kRandom = minimumDetectableKMps(sigmaMps, visits, significance, 'random');
  const kQuad = minimumDetectableKMps(sigmaMps, visits, significance, 'quadrature');
  return input.periodsDays.map((periodDays) => ({
    periodDays,
    kMinRandomMps: kRandom,
    massMinRandomEarth: planetMassFromKEarth({ starMassSun, kMps: kRandom, periodDays, ecc }),
    kMinQuadratureMps: kQuad,
    massMinQuadratureEarth: planetMassFromKEarth({ starMassSun, kMps: kQuad, periodDays, ecc }),
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
