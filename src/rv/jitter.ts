// Default stellar jitter from what a target list says about the star: Teff, rotation, activity
// and surface gravity. Each term is independent and they add in quadrature (common practice);
// a jitter given in the target list always wins over this.

import { interpolateTable } from './star-defaults.js';

export interface JitterStar {
  teffK: number;
  /** v sin i (km/s) when the target list gives it; a default v sin i says nothing about activity. */
  vsiniKms?: number;
  logRhk?: number;
  logg?: number;
}

export interface JitterEstimate {
  jitterMps: number;
  /** The terms used, each with its source, e.g. "quiet 1.5 (after [Wright2005])". */
  source: string;
}

/**
 * Quiet-star level (m/s) for a star of unknown activity: ~1.5 m/s for quiet G and K dwarfs, ~2 m/s
 * for M dwarfs, rising to several m/s for F stars (after [Wright2005], from memory).
 */
export function quietJitterMps(teffK: number): number {
  if (teffK < 3900) return 2;
  if (teffK < 6000) return 1.5;
  return interpolateTable(
    [
      [6000, 1.5],
      [6500, 3],
      [7000, 5],
    ],
    teffK,
  );
}

/** Below this v sin i (km/s) rotation is not resolved and says little about activity (Crest's choice). */
export const ROTATION_RESOLVED_KMS = 3;

/**
 * Rotation-driven jitter (m/s), [Saar1998]: ∝ v sin i in G and K stars, ∝ (v sin i)^1.3 in F stars;
 * scaled so a G star at 9 km/s gets 32 m/s, the middle of their 20–45 m/s for v sin i ≈ 8–10 km/s.
 */
export function rotationJitterMps(teffK: number, vsiniKms: number): number {
  if (vsiniKms < ROTATION_RESOLVED_KMS) return 0;
  const atNine = 32;
  return teffK >= 6000 ? atNine * (vsiniKms / 9) ** 1.3 : atNine * (vsiniKms / 9);
}

/** Quiet chromosphere (log R'HK) below which activity adds nothing here: the Sun's mean level, from memory. */
export const QUIET_LOG_RHK = -4.95;

/**
 * Activity-driven jitter (m/s) from log R'HK, [Santos2000]: σ = a (R'HK · 10^5)^b with
 * (a, b) = (9.2, 0.75) for F, (7.9, 0.55) for G, (7.8, 0.13) for K dwarfs (coefficients from
 * memory). Their σ includes the quiet level and the instrument of the day, so only the excess over
 * the relation at QUIET_LOG_RHK is taken (Crest's choice), added to the quiet level in quadrature.
 */
export function activityJitterMps(teffK: number, logRhk: number): number {
  const [a, b] = teffK >= 6000 ? [9.2, 0.75] : teffK >= 5200 ? [7.9, 0.55] : [7.8, 0.13];
  const sigma = (x: number) => a * (10 ** x * 1e5) ** b;
  return Math.sqrt(Math.max(0, sigma(logRhk) ** 2 - sigma(QUIET_LOG_RHK) ** 2));
}

/** Solar surface gravity, log g in cgs (IAU 2015 nominal: 27400 cm/s²). */
const LOG_G_SUN = Math.log10(27400);
const TEFF_SUN_K = 5772;

/**
 * p-mode amplitude (m/s) from log g and Teff, [KjeldsenBedding1995]: v_osc = 23.4 cm/s · (L/L☉)/(M/M☉),
 * with L/M = (Teff/Teff☉)^4 · g☉/g. Tens of cm/s for dwarfs, metres per second for giants.
 */
export function oscillationJitterMps(teffK: number, logg: number): number {
  return 0.234 * (teffK / TEFF_SUN_K) ** 4 * 10 ** (LOG_G_SUN - logg);
}

/**
 * The default jitter: quiet level, with rotation (given v sin i), activity (given log R'HK) and
 * oscillations (given log g; a dwarf's are part of the quiet level) in quadrature.
 */
export function defaultJitter(star: JitterStar): JitterEstimate {
  const terms: [string, number][] = [['quiet [Wright2005]', quietJitterMps(star.teffK)]];
  if (star.vsiniKms !== undefined && star.vsiniKms >= ROTATION_RESOLVED_KMS) terms.push(['rotation [Saar1998]', rotationJitterMps(star.teffK, star.vsiniKms)]);
  if (star.logRhk !== undefined) terms.push(["activity log R'HK [Santos2000]", activityJitterMps(star.teffK, star.logRhk)]);
  if (star.logg !== undefined) terms.push(['oscillations log g [KjeldsenBedding1995]', oscillationJitterMps(star.teffK, star.logg)]);
  const jitterMps = Math.sqrt(terms.reduce((s, [, v]) => s + v * v, 0));
  return { jitterMps, source: terms.map(([name, v]) => `${name} ${v.toFixed(2)}`).join(' + ') };
}
