// Case (b) of the Monte Carlo check of the claimed σ_K (test/support/monte-carlo-k.ts): nightly jitter.
import { describe, it } from 'vitest';
import type { StarInput } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { BJD0, MONTE_CARLO_TITLE, expectClaimedSigmaK, onePerNight, stalePlanet } from '../support/monte-carlo-k.js';

describe(MONTE_CARLO_TITLE, () => {
  it('(b) shared nightly jitter: 4 visits per night on 6 nights', () => {
    const span: [number, number] = [BJD0, BJD0 + 80];
    const star: StarInput = { planets: [stalePlanet('b', 10, 3.17, 0.1, span, 700, 0)], nightlyJitterMps: 3, spanBjdTdb: span };
    const rng = createRng(51);
    const visits = onePerNight(rng, span, 6, 2).flatMap((v) =>
      // Four visits spread over about five hours of the night.
      [0, 1, 2, 3].map((k) => ({ ...v, bjdTdb: BJD0 + v.night + 0.12 + 0.07 * k + 0.01 * rng.uniform() })),
    );
    expectClaimedSigmaK('(b) nightly jitter', star, visits, 500);
  });
});
