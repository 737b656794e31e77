// The analytic completeness of a search (src/schedule/objective-search.ts) against injection–
// recovery on the same visits (src/rv/injection.ts through test/support/search-injection.ts: GLS,
// Baluev's 1% FAP over the same band, the highest peak within 1/T of the injected frequency,
// circular orbits, log-uniform periods, random phases), on random nightly visit sets and on
// visits the optimiser chose for a search alone.
import { describe, expect, it } from 'vitest';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { createRng } from '../../src/rv/random.js';
import { searchCompleteness, searchGrid, searchStatsLength, updateSearchStats } from '../../src/schedule/objective-search.js';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import type { CandidateSlot, ScheduleProblem } from '../../src/schedule/types.js';
import { injectedCompleteness, type SearchCase, type Visit } from '../support/search-injection.js';

const SEARCH: SearchCase = { periodMinDays: 2, periodMaxDays: 60, msiniEarth: 9, starMassSun: 0.8 };
const SPAN_DAYS = 90;
const SIGMA_MPS = 2;
const K_AT_MIN = semiAmplitudeMps({ starMassSun: SEARCH.starMassSun, planetMassEarth: SEARCH.msiniEarth, periodDays: SEARCH.periodMinDays });
/**
 * Measured (December 2026, these five sets): injection–recovery detects 0.06 to 0.12 more than the
 * proxy (0.068 against 0.001 at 12 nights, 0.375 against 0.280 at 20, 0.657 against 0.594 at 30;
 * planned 0.276 against 0.160 at 14, 0.618 against 0.539 at 24). The periodogram's highest peak
 * near the injected frequency is the largest of a few correlated powers, above the power at the
 * frequency itself that the proxy takes, and aliases (which the proxy does not count as losses)
 * cost less than that gains: the proxy is conservative. Bounds: the injected value at most 0.15
 * above the proxy and at most 0.03 below it (the binomial error of 1200 trials is 0.014).
 */
const ABOVE = 0.15;
const BELOW = 0.03;

/** Candidate times: one slot an hour for six hours each night over the span. */
const slotTimes = Array.from({ length: SPAN_DAYS * 6 }, (_, i) => Math.floor(i / 6) + 0.1 + (i % 6) / 24);

function analytic(times: number[]): number {
  const grid = searchGrid({ ...SEARCH, kMpsAtMin: K_AT_MIN, eps: 1e-3 / SIGMA_MPS ** 2, fromDays: 0, toDays: slotTimes[slotTimes.length - 1]! });
  const stats = new Float64Array(searchStatsLength(grid));
  for (const t of times) updateSearchStats(stats, 0, grid, 1 / SIGMA_MPS ** 2, t, 1);
  return searchCompleteness(stats, 0, grid);
}

const asVisits = (times: number[]): Visit[] => times.map((t) => ({ bjdTdb: t, sigmaMps: SIGMA_MPS, night: String(Math.floor(t)) }));

function randomNightly(count: number, seed: number): number[] {
  const rng = createRng(seed);
  const nights = Array.from({ length: SPAN_DAYS }, (_, n) => n);
  for (let i = nights.length - 1; i > 0; i--) {
    const k = Math.floor(rng.uniform() * (i + 1));
    [nights[i], nights[k]] = [nights[k]!, nights[i]!];
  }
  return nights
    .slice(0, count)
    .sort((a, b) => a - b)
    .map((n) => slotTimes[n * 6 + Math.floor(rng.uniform() * 6)]!);
}

function planned(count: number): number[] {
  const slots: CandidateSlot[] = slotTimes.map((t, i) => ({
    slotId: `s${i}`,
    targetId: 'S',
    nightIndex: Math.floor(t),
    startMs: t * 86_400_000,
    durationSec: 600,
    whiteSigmaMps: SIGMA_MPS,
    midBjdTdb: t,
  }));
  const problem: ScheduleProblem = {
    nights: Array.from({ length: SPAN_DAYS }, (_, n) => ({ index: n, localDate: `n${n}`, clearProbability: 1, hoursAvailable: 8 })),
    targets: [{ id: 'S', planets: [], search: { id: 'S', priority: 1, kMps: K_AT_MIN, goalCompleteness: 1, periodMinDays: 2, periodMaxDays: 60 } }],
    slots,
    time: { mode: 'hours', hours: (count * 600) / 3600 + 1e-6 },
    constraints: { minSpacingHours: 20, onePerNight: true },
  };
  const byId = new Map(slots.map((s) => [s.slotId, s.midBjdTdb]));
  return optimiseSchedule(problem, { seed: 1, restarts: 0 }).slotIds.map((id) => byId.get(id)!);
}

describe('analytic completeness against injection–recovery (same visits, same FAP)', () => {
  const cases: [string, () => number[]][] = [
    ['12 random nights', () => randomNightly(12, 1)],
    ['20 random nights', () => randomNightly(20, 2)],
    ['30 random nights', () => randomNightly(30, 3)],
    ['14 planned visits', () => planned(14)],
    ['24 planned visits', () => planned(24)],
  ];
  for (const [name, times] of cases) {
    it(name, () => {
      const t = times();
      const proxy = analytic(t);
      const injected = injectedCompleteness(asVisits(t), SEARCH, 300, 4, 11);
      const measured = injected.detected / injected.trials;
      console.log(`${name}: analytic ${proxy.toFixed(3)}, injected ${measured.toFixed(3)} (${injected.trials} trials)`);
      expect(measured - proxy).toBeLessThan(ABOVE);
      expect(proxy - measured).toBeLessThan(BELOW);
    });
  }
});
