import { describe, expect, it } from 'vitest';
import { bjdTdbOnTrack, starBjdTdb } from '../../src/astro/bjd.js';
import { DAY_SEC } from '../../src/astro/constants.js';
import { earthTrack } from '../../src/astro/earth-track.js';
import { properMotionVectorJ2000 } from '../../src/astro/position.js';
import { julianYearsSinceJ2000 } from '../../src/astro/time-scales.js';
import { createRng } from '../../src/rv/random.js';

const HOUR_MS = 3_600_000;

describe('BJD_TDB on an interpolated Earth track', () => {
  it('is within 1 ms of the direct computation over random nights, spans, directions and proper motions (2026-2036)', () => {
    const rng = createRng(20261204);
    const fromMs = Date.UTC(2026, 0, 1);
    const toMs = Date.UTC(2036, 0, 1);
    let worstSec = 0;
    for (let night = 0; night < 150; night++) {
      const startMs = fromMs + rng.uniform() * (toMs - fromMs);
      // Dark spans from 4 h to 20 h: the longer ones use three or more nodes.
      const endMs = startMs + (4 + 16 * rng.uniform()) * HOUR_MS;
      const track = earthTrack(startMs, endMs);
      // A direction uniform on the sphere, proper motion up to 5"/yr in each coordinate, epoch 2016.
      const star = {
        raDeg: 360 * rng.uniform(),
        decDeg: (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI,
        pmRaMasYr: 10_000 * (rng.uniform() - 0.5),
        pmDecMasYr: 10_000 * (rng.uniform() - 0.5),
        epochYear: 2016,
      };
      const middle = new Date((startMs + endMs) / 2);
      const n = properMotionVectorJ2000(star, 2000 + julianYearsSinceJ2000(middle));
      for (let k = 0; k < 8; k++) {
        const at = new Date(startMs + rng.uniform() * (endMs - startMs));
        worstSec = Math.max(worstSec, Math.abs(bjdTdbOnTrack(track, at, n) - starBjdTdb(at, star)) * DAY_SEC);
      }
    }
    console.log(`worst |interpolated - direct| BJD_TDB over 1200 instants: ${(worstSec * 1e6).toFixed(1)} µs`);
    expect(worstSec).toBeLessThan(0.001);
  });

  it('refuses an instant outside the track', () => {
    const startMs = Date.UTC(2027, 5, 1, 22);
    const track = earthTrack(startMs, startMs + 8 * HOUR_MS);
    expect(() => bjdTdbOnTrack(track, new Date(startMs - 60_000), [1, 0, 0])).toThrow(RangeError);
    expect(() => bjdTdbOnTrack(track, new Date(startMs + 9 * HOUR_MS), [1, 0, 0])).toThrow(RangeError);
  });
});
