// Quasi-periodic covariance of stellar activity in RVs: a squared exponential (spots grow and
// decay over the coherence time λ) times a periodic term (they come round with the rotation
// period P_rot) (docs/references.md [Haywood2014], [Rajpaul2015]):
//   k(Δt) = h² exp(−Δt² / (2 λ²) − sin²(π Δt / P_rot) / (2 w²)),
// with h the activity amplitude (m/s) and w = 0.5 the usual harmonic complexity (one or two
// spots per rotation). Crest holds activity constant within a night, so Δt is between nights.
import type { ActivityInput } from './information-model.js';

/** Harmonic complexity w of the periodic term. */
export const ACTIVITY_HARMONIC_SCALE = 0.5;

/** k(Δt) above, in (m/s)². */
export function activityCovariance(activity: ActivityInput, dtDays: number): number {
  const { amplitudeMps: h, rotationDays, coherenceDays } = activity;
  const periodic = Math.sin((Math.PI * dtDays) / rotationDays) / ACTIVITY_HARMONIC_SCALE;
  return h * h * Math.exp(-(dtDays * dtDays) / (2 * coherenceDays * coherenceDays) - 0.5 * periodic * periodic);
}
