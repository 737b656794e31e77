// A star's jitter as the information model needs it: a white part, a part shared by the visits
// of one night, and quasi-periodic activity across nights when the star has a rotation period.
import type { Target } from '../model.js';
import type { ActivityInput } from './information-model.js';
import { quadratureSum } from './precision.js';

/** Default fraction of the jitter variance shared within a night (Crest's choice; docs/references.md [Jitter-split]). */
export const DEFAULT_NIGHTLY_JITTER_FRACTION = 0.5;
/** Default coherence time of activity, in rotation periods (docs/references.md [Haywood2014]: spot lifetimes of one to a few rotations). */
export const DEFAULT_COHERENCE_ROTATIONS = 2;

export interface StarNoise {
  /** Jitter independent from visit to visit (m/s). */
  whiteJitterMps: number;
  /** Jitter shared by the visits of one night (m/s). */
  nightlyJitterMps: number;
  activity?: ActivityInput;
}

/**
 * The star's jitter J split as J² = J_white² + J_night²: a fraction f of the variance is shared
 * within a night. With a rotation period the shared part becomes quasi-periodic activity of
 * amplitude √f J (or the given activityMps, then on top of the nightly part).
 */
export function starNoise(star: Target, campaignFraction: number): StarNoise {
  const f = star.nightlyJitterFraction ?? campaignFraction;
  const whiteJitterMps = star.jitterMps * Math.sqrt(1 - f);
  const shared = star.jitterMps * Math.sqrt(f);
  if (star.rotationDays === undefined) return { whiteJitterMps, nightlyJitterMps: shared };
  const activity: ActivityInput = {
    amplitudeMps: star.activityMps ?? shared,
    rotationDays: star.rotationDays,
    coherenceDays: star.activityCoherenceDays ?? DEFAULT_COHERENCE_ROTATIONS * star.rotationDays,
  };
  return { whiteJitterMps, nightlyJitterMps: star.activityMps === undefined ? 0 : shared, activity };
}

/** A visit's white noise: photon and floor (σ_visit) with the white part of the jitter. */
export function whiteSigmaMps(visitSigmaMps: number, noise: StarNoise): number {
  return quadratureSum(visitSigmaMps, noise.whiteJitterMps);
}
