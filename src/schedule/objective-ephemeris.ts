// Information on K for a planet with an ephemeris (circular orbit), with a free offset gamma.
//
// Model: v_i = gamma + K s_i + noise, s_i = -sin(2 pi phi_i) with phi = 0 at mid-transit
// (docs/references.md [Kepler-RV]; the star falls after transit). Least squares with weights
// w_i = 1/sigma_eff,i^2 and gamma free gives Var(K^) = 1/I with
//   I = sum w_i (s_i - sbar_w)^2 = sum w s^2 - (sum w s)^2 / sum w
// (docs/references.md [Visits-needed]: Var(K^) = sigma^2 / sum (s_i - sbar)^2, weighted form).
//
// Phase uncertainty: each visit's phase is phi_i + eps_i with eps_i ~ N(0, sigma_i^2), taken as
// independent between visits. For a Gaussian eps, E[cos(a eps)] = exp(-a^2 sigma^2 / 2)
// (the normal characteristic function, common practice), so
//   m_i = E[s_i]   = -sin(2 pi phi_i) exp(-2 pi^2 sigma_i^2)
//   q_i = E[s_i^2] = 1/2 - 1/2 cos(4 pi phi_i) exp(-8 pi^2 sigma_i^2)   (s^2 = (1 - cos 4 pi phi)/2).
// With independent errors E[s_i s_j] = m_i m_j for i != j, hence
//   E[(sum w s)^2] = (sum w m)^2 + sum w^2 (q - m^2)
//   E[I] = sum w q - ((sum w m)^2 + sum w^2 (q - m^2)) / sum w.
// With sigma = 0 this is I itself; with sigma -> infinity it tends to (1 - w_i/W) sum w / 2, the
// random-phase information (sigma_K ~ sigma sqrt(2/N), docs/references.md [Visits-needed]). Four running sums
// (W, A = sum w m, B = sum w q, C = sum w^2 (q - m^2)) make adding or removing a visit O(1).

/** Expected signal moments of one visit: mean m and mean square q of s = -sin(2 pi phase). */
export function signalMoments(phaseCycles: number, phaseErrCycles: number): { m: number; q: number } {
  const angle = 2 * Math.PI * phaseCycles;
  const s2 = phaseErrCycles * phaseErrCycles;
  const m = -Math.sin(angle) * Math.exp(-2 * Math.PI * Math.PI * s2);
  const q = 0.5 - 0.5 * Math.cos(2 * angle) * Math.exp(-8 * Math.PI * Math.PI * s2);
  return { m, q };
}

/** Running sums of one ephemeris target's visits, stored at `offset` in a shared Float64Array. */
export const EPHEMERIS_STATS = 4;

/** Adds (sign = 1) or removes (sign = -1) a visit of weight w and moments (m, q). */
export function updateEphemerisStats(stats: Float64Array, offset: number, w: number, m: number, q: number, sign: number): void {
  stats[offset] += sign * w;
  stats[offset + 1] += sign * w * m;
  stats[offset + 2] += sign * w * q;
  stats[offset + 3] += sign * w * w * (q - m * m);
}

/** E[I] from the running sums, optionally with one visit (w, m, q) added (sign 1) or removed (-1); never negative. */
export function ephemerisInformation(stats: Float64Array, offset: number, sign = 0, w = 0, m = 0, q = 0): number {
  const W = stats[offset]! + sign * w;
  if (W <= 1e-12 * stats[offset]!) return 0;
  const A = stats[offset + 1]! + sign * w * m;
  const B = stats[offset + 2]! + sign * w * q;
  const C = stats[offset + 3]! + sign * w * w * (q - m * m);
  const info = B - (A * A + C) / W;
  // Removing visits by subtraction leaves rounding residue of order 1e-16 W: clamp it.
  return info > 1e-12 * W ? info : 0;
}
