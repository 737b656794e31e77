import { describe, expect, it } from 'vitest';
import { detectionProbability, injectionRecovery, prepareInjection, type InjectionInput } from '../../src/rv/injection.js';
import { createRng } from '../../src/rv/random.js';

/**
 * 30 visits on randomly chosen nights over ~90 days, σ_eff 1.5 to 2.5 m/s (an invented schedule;
 * irregular on purpose: a strictly regular cadence makes aliases as high as the true peak).
 */
function schedule(): Pick<InjectionInput, 'timesBjdTdb' | 'rvErrorsMps'> {
  const rng = createRng(3);
  const nights = new Set<number>();
  while (nights.size < 30) nights.add(Math.floor(90 * rng.uniform()));
  const timesBjdTdb = [...nights].sort((a, b) => a - b).map((night) => 2_461_200.6 + night + 0.2 * rng.uniform());
  return { timesBjdTdb, rvErrorsMps: timesBjdTdb.map(() => 1.5 + rng.uniform()) };
}

const binomialSe = (q: number, trials: number) => Math.sqrt(Math.max(q * (1 - q), 0.25 / trials) / trials);

describe('injection–recovery', () => {
  const input: InjectionInput = {
    ...schedule(),
    periodsDays: [11.3],
    msinisEarth: [1, 4, 6, 8, 12, 40],
    starMassSun: 0.8,
    trialsPerCell: 120,
    seed: 5,
  };

  it('detection probability rises with mass at fixed period', () => {
    const map = injectionRecovery(input);
    const row = map.detection[0]!;
    // Property: a larger signal at the same period and noise is found at least as often, up to
    // sampling error (2 binomial standard errors of the difference).
    for (let j = 1; j < row.length; j++) {
      expect(row[j]!).toBeGreaterThanOrEqual(row[j - 1]! - 2 * Math.SQRT2 * binomialSe(row[j]!, input.trialsPerCell));
    }
    // K ≈ 0.3 m/s (1 Earth mass) is far below σ/√N: almost never found; K ≈ 13 m/s (40 Earth masses) always.
    expect(row[0]).toBeLessThan(0.05);
    expect(row[row.length - 1]).toBeGreaterThan(0.95);
    expect(row.some((p) => p > 0.1 && p < 0.9)).toBe(true);
  });

  it('is reproducible and each cell is independent of the order cells run in', () => {
    const small: InjectionInput = { ...input, periodsDays: [5, 23], msinisEarth: [8, 16], trialsPerCell: 30 };
    const map = injectionRecovery(small);
    expect(injectionRecovery(small).detection).toEqual(map.detection);
    const setup = prepareInjection(small);
    expect(detectionProbability(setup, 1, 0)).toBe(map.detection[1]![0]);
    expect(injectionRecovery({ ...small, seed: 6 }).detection).not.toEqual(map.detection);
  });

  it('finds strong moderately eccentric signals and not negligible ones', () => {
    // Property: for e ≤ 0.5 most of the power of a Keplerian curve stays at the orbital frequency
    // (common practice), so a signal 6 times the noise is still found; a 0.3 m/s one is not.
    const map = injectionRecovery({ ...input, msinisEarth: [1, 40], trialsPerCell: 60, eccentricity: { distribution: 'uniform', max: 0.5 } });
    expect(map.detection[0]![0]).toBeLessThan(0.05);
    expect(map.detection[0]![1]).toBeGreaterThan(0.95);
  });

  it('misses most strongly eccentric signals that are always found on circular orbits', () => {
    // Property: at e = 0.9 the curve is a narrow spike near periastron (half of the orbit's RV
    // range within ~5% of the period, common practice) that 30 visits mostly miss, so the same
    // masses found every time on circular orbits are found in well under half the trials.
    const masses = { ...input, msinisEarth: [12, 40], trialsPerCell: 60 };
    const circular = injectionRecovery(masses).detection[0]!;
    const eccentric = injectionRecovery({ ...masses, eccentricity: { distribution: 'fixed', value: 0.9 } }).detection[0]!;
    for (const p of circular) expect(p).toBeGreaterThan(0.95);
    for (const p of eccentric) expect(p).toBeLessThan(0.5);
  });

  it('rejects inputs that make no map', () => {
    expect(() => prepareInjection({ ...input, trialsPerCell: 0 })).toThrow(RangeError);
    expect(() => prepareInjection({ ...input, eccentricity: { distribution: 'fixed', value: 1 } })).toThrow(RangeError);
  });
});
