import { describe, expect, it } from 'vitest';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import { referenceUtility, scheduleViolations } from '../../reference/schedule.js';
import { onePlanetStar } from '../support/one-planet.js';
import type { CandidateSlot, ScheduleProblem } from '../../src/schedule/types.js';

const DAY_MS = 86_400_000;
const T0 = Date.UTC(2027, 2, 1, 2);

/**
 * Hours mode: an ephemeris target whose visits are long and a search target whose visits are
 * short. The search target's first visits alone are worth almost nothing (three are needed to
 * fit offset, sine and cosine), so a purely myopic greedy would never start it. The optimiser must
 * do at least as well as a simple feasible alternative built by hand: the search target on every
 * other night and the rest of the budget to the ephemeris target.
 */
function problem(): ScheduleProblem {
  const slots: CandidateSlot[] = [];
  const nights = Array.from({ length: 30 }, (_, n) => ({ index: n, localDate: `n${n}`, clearProbability: 1, hoursAvailable: 8 }));
  for (let n = 0; n < 30; n++) {
    const eStart = T0 + n * DAY_MS;
    slots.push({ slotId: `e${n}`, targetId: 'E', nightIndex: n, startMs: eStart, durationSec: 3600, whiteSigmaMps: 2, midBjdTdb: (eStart - T0) / DAY_MS });
    const sStart = eStart + 2 * 3_600_000;
    slots.push({ slotId: `s${n}`, targetId: 'S', nightIndex: n, startMs: sStart, durationSec: 300, whiteSigmaMps: 2, midBjdTdb: (sStart - T0) / DAY_MS });
  }
  return {
    nights,
    targets: [
      // One day a night, 1/0.37 days per cycle: the phase steps by 0.37 cycles a night, as before.
      onePlanetStar('E', { kMps: 2, periodDays: 1 / 0.37, tcBjdTdb: 0 }, [0, 30]),
      { id: 'S', planets: [], search: { id: 'S', priority: 1, kMps: 3, goalCompleteness: 0.5, periodMinDays: 2, periodMaxDays: 20 } },
    ],
    slots,
    time: { mode: 'hours', hours: 6 },
    constraints: { minSpacingHours: 0, onePerNight: true },
  };
}

describe('a search target competing for an hours budget', () => {
  it('is started, and the plan beats a simple hand-made alternative (property: never worse than a feasible schedule)', () => {
    const p = problem();
    const settings = { overshootWeight: 0.1 };
    const result = optimiseSchedule(p, { seed: 1 });
    const byId = new Map(p.slots.map((s) => [s.slotId, s]));
    const chosen = result.slotIds.map((id) => byId.get(id)!);
    expect(scheduleViolations(p, chosen)).toEqual([]);
    const alternative = [
      ...p.slots.filter((s) => s.targetId === 'S' && Number(s.slotId.slice(1)) % 2 === 0),
      ...p.slots.filter((s) => s.targetId === 'E').slice(0, 3),
    ];
    expect(scheduleViolations(p, alternative)).toEqual([]);
    expect(chosen.filter((s) => s.targetId === 'S').length).toBeGreaterThanOrEqual(3);
    expect(referenceUtility(p, chosen, settings)).toBeGreaterThanOrEqual(referenceUtility(p, alternative, settings) - 1e-9);
  });
});
