// Case (d) of the Monte Carlo check of the claimed σ_K (test/support/monte-carlo-k.ts): activity.
import { describe, it } from 'vitest';
import type { StarInput } from '../../src/rv/information-model.js';
import { createRng } from '../../src/rv/random.js';
import { BJD0, MONTE_CARLO_TITLE, expectClaimedSigmaK, onePerNight, stalePlanet } from '../support/monte-carlo-k.js';

describe(MONTE_CARLO_TITLE, () => {
  it('(d) quasi-periodic activity across nights, with nightly jitter', () => {
    const span: [number, number] = [BJD0, BJD0 + 100];
    const star: StarInput = {
      planets: [stalePlanet('b', 6, 5.53, 0.1, span, 800, 0)],
      nightlyJitterMps: 1,
      activity: { amplitudeMps: 3, rotationDays: 24, coherenceDays: 40 },
      spanBjdTdb: span,
    };
    const visits = onePerNight(createRng(71), span, 24, 2);
    expectClaimedSigmaK('(d) activity', star, visits, 700);
  });
});
