// Half nights (campaign time.halfNights, src/plan/half-nights.ts) on an example campaign with nightly
// jitter and several visits a night: every planned visit lies wholly inside the half of the dark
// time its night was planned for (the middle of the dark span recomputed here), halves count as
// half nights in the totals and the dark hours, a star keeps its visits-a-night count across the
// two halves, and sigma_K equals the slow dense Cramér–Rao reference (test/support/dense-information.ts)
// with one nightly noise term per calendar night, which a term per half would change.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { starModel, starsOf } from '../../src/plan/star-model.js';
import { nightMiddleJd } from '../../src/plan/visit-information.js';
import { denseKVariances } from '../support/dense-information.js';

describe('half nights', () => {
  const given = readCampaign(path.resolve('examples/several-a-night/campaign.yaml'));
  // 11 halves in a window of 8 nights: at least three nights are planned in both halves.
  const campaign = {
    ...given,
    window: { start: '2027-03-01', end: '2027-03-08' },
    time: { mode: 'choose-nights' as const, nights: 5.5, halfNights: true },
  };
  const plan = buildPlan(campaign, { weatherTrials: 200 });

  it('books each visit inside its planned half and counts halves as half nights', () => {
    const halves = plan.plannedHalves ?? [];
    expect(halves.length).toBeGreaterThan(0);
    expect(plan.totals.nights).toBe(plan.plannedDates.length - halves.length / 2);
    expect(plan.totals.nights).toBe(5.5);
    const half = new Map(halves.map((h) => [h.localDate, h.half]));
    let dark = 0;
    for (const date of plan.plannedDates) {
      const night = plan.nights.find((n) => n.localDate === date)!;
      const start = night.darkStart!.getTime();
      const end = night.darkEnd!.getTime();
      const middle = (start + end) / 2;
      const [from, to] = half.get(date) === 'first' ? [start, middle] : half.get(date) === 'second' ? [middle, end] : [start, end];
      dark += half.has(date) ? night.darkHours / 2 : night.darkHours;
      for (const v of plan.visits.filter((x) => x.localDate === date)) {
        const visitStart = Date.parse(v.startUtc);
        expect(visitStart).toBeGreaterThanOrEqual(from - 1);
        expect(visitStart + v.durationSec * 1000).toBeLessThanOrEqual(to + 1);
      }
    }
    expect(plan.totals.darkHours).toBeCloseTo(dark, 9);
    // Visits a night per star, over the whole calendar night.
    for (const t of campaign.targets) {
      const perDate = new Map<string, number>();
      for (const v of plan.visits.filter((x) => x.starId === t.starId)) perDate.set(v.localDate, (perDate.get(v.localDate) ?? 0) + 1);
      for (const count of perDate.values()) expect(count).toBeLessThanOrEqual(t.visitsPerNight ?? 1);
    }
  });

  it('gives sigma_K of the dense reference with one nightly term per calendar night', () => {
    const nightPos = new Map(plan.nights.map((n, i) => [n.localDate, i]));
    const middleOf = (date: string) => {
      const night = plan.nights[nightPos.get(date)!]!;
      return (night.darkStart!.getTime() + night.darkEnd!.getTime()) / 2;
    };
    let checked = 0;
    let perHalfDiffers = false;
    for (const [starId, rows] of starsOf(plan.campaign.targets)) {
      const model = starModel(rows, plan.campaign);
      const visits = plan.visits.filter((v) => v.starId === starId);
      if (!model || visits.length < 2) continue;
      const dense = (halves: boolean) =>
        denseKVariances(
          model,
          visits.map((v) => ({
            bjdTdb: v.midBjdTdb,
            whiteSigmaMps: v.whiteSigmaMps,
            // A noise term per half, for the contrast: key 2 n + (1 in the second half).
            night: halves ? 2 * nightPos.get(v.localDate)! + (Date.parse(v.startUtc) >= middleOf(v.localDate) ? 1 : 0) : nightPos.get(v.localDate)!,
            nightBjdTdb: nightMiddleJd(plan.nights[nightPos.get(v.localDate)!]),
          })),
        );
      const variance = dense(false);
      const perHalf = dense(true);
      model.planets.forEach((p, i) => {
        const summary = plan.targets.find((s) => s.targetId === p.input.id)!;
        expect(summary.sigmaKMps! / Math.sqrt(variance[i]!)).toBeCloseTo(1, 6);
        if (Math.abs(summary.sigmaKMps! / Math.sqrt(perHalf[i]!) - 1) > 1e-4) perHalfDiffers = true;
        checked++;
      });
    }
    expect(checked).toBe(3);
    // Not a trivial case: a nightly term per half would give another sigma_K.
    expect(perHalfDiffers).toBe(true);
  });
});
