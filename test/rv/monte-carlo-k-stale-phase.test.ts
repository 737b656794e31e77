// Case (a) of the Monte Carlo check of the claimed σ_K (test/support/monte-carlo-k.ts): a stale phase.
import { describe, it } from 'vitest';
import type { StarInput } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { BJD0, MONTE_CARLO_TITLE, expectClaimedSigmaK, onePerNight, stalePlanet } from '../support/monte-carlo-k.js';

describe(MONTE_CARLO_TITLE, () => {
  for (const [c, phaseErr] of [0.05, 0.1, 0.15].entries()) {
    it(`(a) one circular planet, phase error ${phaseErr} cycles at the span's end, 20 visits one per night`, () => {
      const span: [number, number] = [BJD0, BJD0 + 120];
      const star: StarInput = { planets: [stalePlanet('b', 5, 7.31, phaseErr, span, 900, 0)], nightlyJitterMps: 0, spanBjdTdb: span };
      // The same 20 visits for the three phase errors.
      const visits = onePerNight(createRng(40), span, 20, 3);
      expectClaimedSigmaK(`(a) phase error ${phaseErr}`, star, visits, 400 + c);
    });
  }
});
