// What to observe now: for the observer at the telescope, the stars that can start at a given
// instant ranked by what one visit adds (the exact utility gain of the plan's objective per hour,
// given every visit already made), and the order of the rest of that night (the optimiser on the
// night's remaining visits). Nothing before the instant is counted as planned.
import type { Campaign } from './campaign.js';
import { compileProblem } from '../schedule/compile.js';
import { optimiseSchedule } from '../schedule/optimise.js';
import { PlanState } from '../schedule/state.js';
import { SLOT_STEP_MIN, type SlotDetail } from './candidates.js';
import { eveningDate } from './observed-visits.js';
import { planInputs } from './plan-inputs.js';

/** The search grid the plan's objective uses (optimise.ts default). */
const OVERSHOOT = 0.1;
/** Phases within this of a quadrature or a conjunction are called so (Crest's wording). */
const NEAR_CYCLES = 0.08;

export interface NextChoice {
  starId: string;
  /** Start of the visit block (UTC ms) and its length (s). */
  startMs: number;
  durationSec: number;
  /** Exact utility gain of the visit, and per hour of telescope time. */
  gain: number;
  gainPerHour: number;
  /** Per planet or search of the star: K/sigma_K (a search: its completeness) before and after the visit, and its goal. */
  effects: { targetId: string; before: number; after: number; goalSignificance: number }[];
  airmass: number;
  /** Minutes left in the star's window from the visit's start. */
  windowLeftMin: number;
  moonSeparationDeg: number;
  /** Why, in words: phases, goal, Moon. */
  why: string[];
}

export interface NextAnswer {
  atMs: number;
  localDate: string;
  /** Stars that can start within SLOT_STEP_MIN of the instant, best first. */
  now: NextChoice[];
  /** The rest of the night as the optimiser orders it, from the instant on. */
  tonight: { starId: string; startMs: number; durationSec: number }[];
}

function phaseWords(d: SlotDetail): string[] {
  const name = (id: string) => (d.phases.length > 1 ? `${id} ` : '');
  return d.phases.map((p) => {
    const q = Math.min(Math.abs(p.phase - 0.25), Math.abs(p.phase - 0.75));
    const c = Math.min(p.phase, 1 - p.phase);
    const where = q <= NEAR_CYCLES ? 'near quadrature' : c <= NEAR_CYCLES ? 'near conjunction, little on K' : 'between quadrature and conjunction';
    return `${name(p.targetId)}phase ${p.phase.toFixed(2)}±${p.phaseErr.toFixed(2)} ${where}`;
  });
}

/** The best stars to start at `at` and the order of the rest of that night, for the campaign as observed so far. */
export function nextVisits(given: Campaign, at: Date): NextAnswer {
  const localDate = eveningDate(at, given.site.timeZone);
  // One night: the evening of `at`, granted; the RVs and visits so far as the campaign holds them.
  const night: Campaign = { ...given, window: { start: localDate, end: localDate }, time: { mode: 'given-nights', dates: [localDate] }, lostDates: [] };
  const inputs = planInputs(night, { now: at });
  const { problem, candidates, detail } = inputs;
  const c = compileProblem(problem);
  const state = new PlanState(c, Infinity, OVERSHOOT);
  for (let n = 0; n < c.nightCount; n++) state.openNight(n);
  const candidateOf = new Map(candidates.map((d) => [d.slot.slotId, d]));
  const firstOfStar = new Map<number, number>();
  const latestStartMs = at.getTime() + SLOT_STEP_MIN * 60_000;
  for (let j = 0; j < c.slotCount; j++) {
    if (c.startMs[j]! >= latestStartMs) continue;
    const t = c.slotTarget[j]!;
    // canAdd: a star with visitsPerNight > 1 may already have them all tonight (prior visits).
    if (!firstOfStar.has(t) && state.canAdd(j)) firstOfStar.set(t, j);
  }
  const ratios = (t: number) => {
    const star = problem.targets[t]!;
    const out = star.planets.map((p, i) => ({
      targetId: p.id,
      ratio: state.planetFractionOfGoal(c.planetFrom[t]! + i) * p.goalSignificance,
      goalSignificance: p.goalSignificance,
      measure: 'K/sigma_K',
      digits: 1,
    }));
    if (star.search)
      out.push({
        targetId: star.search.id,
        ratio: state.searchCompleteness(t, 0, 0),
        goalSignificance: star.search.goalCompleteness,
        measure: 'completeness',
        digits: 2,
      });
    return out;
  };
  const choices: NextChoice[] = [];
  for (const [t, j] of firstOfStar) {
    const d = detail(candidateOf.get(problem.slots[c.slotSource[j]!]!.slotId)!);
    const gain = state.gain(j);
    const before = ratios(t);
    state.add(j);
    const after = ratios(t);
    state.remove(j);
    const window = inputs.windows.find(
      (w) => w.targetId === d.slot.targetId && w.localDate === localDate && w.start.getTime() <= d.slot.startMs && w.end.getTime() >= d.slot.startMs,
    )!;
    // A star with one planet or search is named once, by its line.
    const name = (id: string) => (before.length > 1 ? `${id} ` : '');
    const goalWords = before.map((b) =>
      b.ratio >= b.goalSignificance
        ? `${name(b.targetId)}goal reached (${b.measure} ${b.ratio.toFixed(b.digits)})`
        : `${name(b.targetId)}${b.measure} ${b.ratio.toFixed(b.digits)} of ${b.goalSignificance}`,
    );
    choices.push({
      starId: d.slot.targetId,
      startMs: d.slot.startMs,
      durationSec: d.slot.durationSec,
      gain,
      gainPerHour: gain / c.hours[j]!,
      effects: before.map((b, i) => ({ targetId: b.targetId, before: b.ratio, after: after[i]!.ratio, goalSignificance: b.goalSignificance })),
      airmass: d.airmass,
      windowLeftMin: (window.end.getTime() - d.slot.startMs) / 60_000,
      moonSeparationDeg: d.moonSeparationDeg,
      why: [...phaseWords(d), ...goalWords, `Moon ${d.moonSeparationDeg.toFixed(0)}° away`],
    });
  }
  choices.sort((a, b) => b.gainPerHour - a.gainPerHour || a.starId.localeCompare(b.starId));
  const bySlot = new Map(problem.slots.map((s) => [s.slotId, s]));
  const tonight = optimiseSchedule(problem, { seed: given.seed })
    .slotIds.map((id) => bySlot.get(id)!)
    .map((s) => ({ starId: s.targetId, startMs: s.startMs, durationSec: s.durationSec }));
  return { atMs: at.getTime(), localDate, now: choices, tonight };
}
