// Caps on what one star gets: with maxVisits or maxHours the optimiser never gives a star more
// (checked by the slow reference's own constraint list), in every time model, and the time a
// capped star no longer takes goes to the others.
import { describe, expect, it } from 'vitest';
import { scheduleViolations } from '../../reference/schedule.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import { optimiseSchedule } from '../../src/schedule/optimise.js';
import type { ScheduleProblem, ScheduleTimeModel } from '../../src/schedule/types.js';

const settings = { overshootWeight: 0.1 };

function problem(time: ScheduleTimeModel, seed: number): ScheduleProblem {
  return syntheticProblem({
    targets: 5,
    nights: 30,
    slotsPerNight: 3,
    searchFraction: 0.4,
    visibleFraction: 0.8,
    time,
    minSpacingHours: 20,
    onePerNight: true,
    nightHours: 6,
    seed,
    phaseErrors: true,
  });
}

/** Visits and hours per star of a result. */
function perStar(p: ScheduleProblem, slotIds: string[]) {
  const byId = new Map(p.slots.map((s) => [s.slotId, s]));
  const visits = slotIds.map((id) => byId.get(id)!);
  const of = (id: string) => visits.filter((v) => v.targetId === id);
  return { visits, count: (id: string) => of(id).length, hours: (id: string) => of(id).reduce((s, v) => s + v.durationSec / 3600, 0) };
}

describe('per-star caps', () => {
  const times: ScheduleTimeModel[] = [{ mode: 'hours', hours: 12 }, { mode: 'choose-nights', nights: 12 }, { mode: 'given-nights' }];
  for (const time of times) {
    it(`hold in ${time.mode} mode, and freed time goes to the other stars where time is scarce`, () => {
      const base = problem(time, 11);
      const free = optimiseSchedule(base, { seed: 1, ...settings });
      const free_ = perStar(base, free.slotIds);
      // The star the plan gives most visits, capped at half of them and at 60% of its hours.
      const top = base.targets.map((t) => t.id).sort((a, b) => free_.count(b) - free_.count(a))[0]!;
      const maxVisits = Math.floor(free_.count(top) / 2);
      expect(maxVisits).toBeGreaterThan(1);
      const maxHours = 0.6 * free_.hours(top);
      const capped: ScheduleProblem = { ...base, targets: base.targets.map((t) => (t.id === top ? { ...t, maxVisits, maxHours } : t)) };
      const result = optimiseSchedule(capped, { seed: 1, ...settings });
      const got = perStar(capped, result.slotIds);
      expect(scheduleViolations(capped, got.visits)).toEqual([]);
      expect(got.count(top)).toBeLessThanOrEqual(maxVisits);
      expect(got.hours(top)).toBeLessThanOrEqual(maxHours + 1e-9);
      // The uncapped plan breaks the caps, so the reference would have caught a planner that ignored them.
      expect(scheduleViolations(capped, free_.visits).length).toBeGreaterThan(0);
      const others = (s: ReturnType<typeof perStar>) => base.targets.filter((t) => t.id !== top).reduce((sum, t) => sum + s.count(t.id), 0);
      // Where time is the limit (an hours budget, a number of nights) the others take what the capped
      // star leaves; with every night granted they are held by their one visit a night instead.
      if (time.mode !== 'given-nights') expect(others(got)).toBeGreaterThan(others(free_));
    });
  }
});
