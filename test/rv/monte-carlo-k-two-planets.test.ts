// Case (c) of the Monte Carlo check of the claimed σ_K (test/support/monte-carlo-k.ts): two planets.
import { describe, it } from 'vitest';
import type { StarInput } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { BJD0, MONTE_CARLO_TITLE, expectClaimedSigmaK, onePerNight, stalePlanet } from '../support/monte-carlo-k.js';

describe(MONTE_CARLO_TITLE, () => {
  it('(c) two planets, both fitted', () => {
    const span: [number, number] = [BJD0, BJD0 + 150];
    const star: StarInput = {
      planets: [stalePlanet('b', 7, 4.73, 0.1, span, 800, 0), stalePlanet('c', 5, 17.3, 0.08, span, 600, 0.37)],
      nightlyJitterMps: 0,
      spanBjdTdb: span,
    };
    const visits = onePerNight(createRng(61), span, 30, 2.5);
    expectClaimedSigmaK('(c) two planets', star, visits, 600);
  });
});
