import { describe, expect, it } from 'vitest';
import { referenceCompleteness } from '../../reference/search-completeness.js';
import { syntheticProblem } from '../../reference/synthetic.js';
import { createRng } from '../../src/rv/random.js';
import { compileProblem } from '../../src/schedule/compile.js';
import { PlanState } from '../../src/schedule/state.js';

// Searches and ephemeris stars over 30 nights; onePerNight off so that random sets may hold any slots.
const problem = syntheticProblem({
  targets: 6,
  nights: 30,
  slotsPerNight: 3,
  searchFraction: 0.5,
  visibleFraction: 0.8,
  time: { mode: 'given-nights' },
  minSpacingHours: 0,
  onePerNight: false,
  nightHours: 8,
  seed: 21,
  phaseErrors: true,
});
const c = compileProblem(problem);
const searchStars = c.grids.flatMap((grid, t) => (grid ? [t] : []));

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

/** A state holding `slots`, every night open. */
function stateWith(slots: Iterable<number>): PlanState {
  const state = new PlanState(c, Infinity, 0.1);
  for (let n = 0; n < c.nightCount; n++) state.openNight(n);
  for (const j of slots) state.add(j);
  return state;
}

describe('the incremental search objective against a recomputation from scratch', () => {
  it('has search stars with enough visits for a non-zero completeness', () => {
    expect(searchStars.length).toBeGreaterThanOrEqual(2);
  });

  it('running sums updated visit by visit give the completeness of direct sums (1e-9 relative), after adds and removals', () => {
    const rng = createRng(5);
    for (let trial = 0; trial < 8; trial++) {
      const chosen: number[] = [];
      for (let j = 0; j < c.slotCount; j++) if (rng.uniform() < 0.15 + 0.05 * trial) chosen.push(j);
      const dropped = new Set(chosen.filter(() => rng.uniform() < 0.3));
      const state = stateWith(chosen);
      for (const j of dropped) state.remove(j);
      for (const t of searchStars) {
        const mine = chosen.filter((j) => !dropped.has(j) && c.slotTarget[j] === t);
        // From scratch: sin and cos of every frequency at every visit, the 3x3 matrix inverted, the threshold by 60 bisections.
        const expected = referenceCompleteness(
          c.grids[t]!,
          mine.map((j) => c.midBjdTdb[j]!),
          mine.map((j) => c.weight[j]!),
          'scheduler',
        );
        if (mine.length >= 8) expect(expected).toBeGreaterThan(0);
        expect(relative(state.searchCompleteness(t, 0, 0), expected)).toBeLessThan(1e-9);
      }
    }
  });

  it('a priced visit equals the completeness of the set with the visit added, from scratch (1e-9 relative)', () => {
    const rng = createRng(9);
    const chosen: number[] = [];
    for (let j = 0; j < c.slotCount; j++) if (rng.uniform() < 0.3) chosen.push(j);
    const state = stateWith(chosen);
    for (const t of searchStars) {
      const mine = chosen.filter((j) => c.slotTarget[j] === t);
      const trial = Array.from(c.targetSlots[t]!).filter((j) => !chosen.includes(j));
      for (const j of trial.slice(0, 6)) {
        const withJ = [...mine, j];
        const expected = referenceCompleteness(
          c.grids[t]!,
          withJ.map((i) => c.midBjdTdb[i]!),
          withJ.map((i) => c.weight[i]!),
          'scheduler',
        );
        expect(relative(state.searchCompleteness(t, 1, j), expected)).toBeLessThan(1e-9);
      }
    }
  });

  it('a gain kept from an earlier visit of the same set (a move tried and undone), or priced after a move, equals the gain priced afresh', () => {
    const rng = createRng(13);
    const base: number[] = [];
    for (let j = 0; j < c.slotCount; j++) if (rng.uniform() < 0.25) base.push(j);
    const state = stateWith(base);
    const open = Array.from({ length: c.slotCount }, (_, j) => j).filter((j) => !base.includes(j));
    // Price every open slot, then try moves and undo them: each star's set returns to the base set.
    for (const j of open) state.gain(j);
    for (let move = 0; move < 20; move++) {
      const j = open[Math.floor(rng.uniform() * open.length)]!;
      const out = base[Math.floor(rng.uniform() * base.length)]!;
      state.add(j);
      state.remove(out);
      const moved = stateWith([...base.filter((k) => k !== out), j]);
      for (const k of open) if (k !== j) expect(Math.abs(state.gain(k) - moved.gain(k))).toBeLessThan(1e-9 * Math.abs(moved.utility));
      state.add(out);
      state.remove(j);
    }
    const fresh = stateWith(base);
    let compared = 0;
    for (const j of open) {
      expect(Math.abs(state.gain(j) - fresh.gain(j))).toBeLessThan(1e-9 * Math.abs(fresh.utility));
      if (fresh.gain(j) !== 0) compared++;
    }
    expect(compared).toBeGreaterThan(10);
    expect(relative(state.utility, fresh.utility)).toBeLessThan(1e-9);
  });
});
