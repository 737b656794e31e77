// crest next against a brute-force choice: at a set of instants, the stars it offers are those the
// one-minute reference sampler finds inside their windows for the whole visit, and its first star
// has the largest utility gain per hour over every one of them, each gain recomputed from scratch
// with the slow reference (reference/schedule.ts: fresh information accumulators, the visits
// already made included). Invented campaign: the demo 18 days in (examples/under-way).
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { nextVisits } from '../../src/plan/next-visits.js';
import { planInputs } from '../../src/plan/plan-inputs.js';
import { referenceUtility } from '../../reference/schedule.js';
import { starBjdTdb } from '../../src/astro/bjd.js';
import { overlapsTransit } from '../../src/orbit/ephemeris.js';
import { starTargets, transitRule } from '../../src/plan/candidates.js';
import { referenceWindows } from '../../reference/sky-sampler.js';

const CAMPAIGN = path.join(path.dirname(fileURLToPath(import.meta.url)), '../../examples/under-way/campaign.yaml');
const SETTINGS = { overshootWeight: 0.1 };
/** Edge tolerance of the window comparison (minutes): the sampler steps by one minute. */
const EDGE_MIN = 2;
const INSTANTS = [
  '2027-03-21T00:30:00Z',
  '2027-03-21T03:40:00Z',
  '2027-03-21T07:20:00Z',
  '2027-03-22T05:10:00Z',
  '2027-04-02T02:00:00Z',
  '2027-04-20T09:30:00Z',
];

describe('crest next against brute force', () => {
  const campaign = readCampaign(CAMPAIGN);
  it.each(INSTANTS)('at %s', (iso) => {
    const at = new Date(iso);
    const answer = nextVisits(campaign, at);
    const inputs = planInputs(
      { ...campaign, window: { start: answer.localDate, end: answer.localDate }, time: { mode: 'given-nights', dates: [answer.localDate] }, lostDates: [] },
      { now: at },
    );
    const night = inputs.nights[0]!;
    const reference = referenceWindows(campaign.site, starTargets(inputs.stars), night, campaign.constraints);
    // Every offered visit lies inside a reference window of its star (within the sampler's step).
    for (const c of answer.now) {
      const inside = reference.some(
        (w) =>
          w.targetId === c.starId &&
          w.start.getTime() <= c.startMs + EDGE_MIN * 60_000 &&
          w.end.getTime() >= c.startMs + c.durationSec * 1000 - EDGE_MIN * 60_000,
      );
      expect(inside, `${c.starId} at ${iso}`).toBe(true);
    }
    // Every star the sampler finds open now for a whole visit (with margin) is offered.
    const offered = new Set(answer.now.map((c) => c.starId));
    for (const star of inputs.stars.filter((s) => s.scheduleTarget)) {
      const open = reference.some(
        (w) =>
          w.targetId === star.starId &&
          w.start.getTime() <= at.getTime() - EDGE_MIN * 60_000 &&
          w.end.getTime() >= at.getTime() + (star.durationSec + 600 + EDGE_MIN * 60) * 1000,
      );
      // Visits are kept out of predicted transits (candidates.ts): such a star is not open.
      const fromBjdTdb = starBjdTdb(at, star.star);
      const toBjdTdb = fromBjdTdb + (star.durationSec + 600) / 86_400;
      const inTransit = star.rows.some(
        (r) =>
          r.target.ephemeris?.transitDurationHours !== undefined && overlapsTransit(r.target.ephemeris, fromBjdTdb, toBjdTdb, transitRule(inputs.campaign)),
      );
      if (open && !inTransit) expect(offered.has(star.starId), `${star.starId} open at ${iso}`).toBe(true);
    }
    if (answer.now.length === 0) return;
    // The first choice has the largest gain per hour, each gain from scratch.
    const slotOf = new Map(inputs.problem.slots.map((s) => [s.slotId, s]));
    const base = referenceUtility(inputs.problem, [], SETTINGS);
    const perHour = answer.now.map((c) => {
      const slot = [...slotOf.values()].find((s) => s.targetId === c.starId && s.startMs === c.startMs)!;
      return { starId: c.starId, value: (referenceUtility(inputs.problem, [slot], SETTINGS) - base) / (slot.durationSec / 3600), claimed: c.gainPerHour };
    });
    for (const p of perHour) expect(p.claimed).toBeCloseTo(p.value, 9);
    const best = Math.max(...perHour.map((p) => p.value));
    expect(perHour[0]!.value).toBeCloseTo(best, 12);
  });

  it('says so when nothing is observable (daytime)', () => {
    const answer = nextVisits(campaign, new Date('2027-03-21T16:00:00Z'));
    expect(answer.now).toEqual([]);
  });
});
