// Case (e) of the Monte Carlo check of the claimed σ_K (test/support/monte-carlo-k.ts): a fitted eccentricity.
import { describe, it } from 'vitest';
import type { StarInput } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { BJD0, MONTE_CARLO_TITLE, expectClaimedSigmaK, onePerNight, stalePlanet } from '../support/monte-carlo-k.js';

describe(MONTE_CARLO_TITLE, () => {
  it('(e) an eccentric planet (e = 0.3) with e cos ω, e sin ω fitted', () => {
    const span: [number, number] = [BJD0, BJD0 + 120];
    const planet = { ...stalePlanet('b', 8, 9.7, 0.08, span, 700, 0), ecc: 0.3, omegaDeg: 40, eccPriorSigma: 0.1 };
    const star: StarInput = { planets: [planet], nightlyJitterMps: 0, spanBjdTdb: span };
    const visits = onePerNight(createRng(81), span, 25, 2);
    expectClaimedSigmaK('(e) eccentric', star, visits, 800);
  });
});
