// The plan properties checked on every campaign (demo-plan.test.ts, random-plans-*.test.ts): visits
// inside the slow reference sampler's windows and the dark span, no overlaps, spacing and budgets;
// K/sigma_K recomputed from plan.csv; plan.ics read back with ical.js.
import { describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { phaseAt } from '../../src/orbit/ephemeris.js';
import { PLAN_CSV_HEADER, renderPlanCsv } from '../../src/report/plan-csv.js';
import { renderPlanIcs } from '../../src/report/plan-ics.js';
import { checkVisits, REFERENCE_TOLERANCE_MIN } from './check-visits.js';
import { icsMismatches } from './check-ics.js';
import { placeOffsetMas } from './place-offset.js';
import { CSV_ROUNDING, csvVisits, kOverSigmaKFromCsv, parsePlanCsv } from './recompute-k.js';

/** Few weather trials: the weather is not what these tests check. */
export const WEATHER_TRIALS = 20;

/** Registers the property tests for the named plans; planOf is called inside the tests (after beforeAll). */
export function describePlanProperties(names: string[], planOf: (name: string) => Plan, minVisits: number): void {
  describe('visits against the one-minute reference sampler', () => {
    const stats = { visits: 0, maxOutsideMin: 0, maxEdgeMin: 0 };
    it.each(names)('%s: inside reference windows and the dark span, no overlap, spacing, budget', (name) => {
      const check = checkVisits(planOf(name));
      expect(check.violations).toEqual([]);
      stats.visits += check.visits;
      stats.maxOutsideMin = Math.max(stats.maxOutsideMin, check.maxOutsideReferenceMin);
      stats.maxEdgeMin = Math.max(stats.maxEdgeMin, check.maxWindowEdgeErrorMin);
    });
    it('no visit reaches outside a reference window by more than the tolerance', () => {
      // Reported for the record: visits checked, worst reach outside a reference window, worst window edge.
      console.info(
        `plan vs reference: ${stats.visits} visits, ${stats.maxOutsideMin.toFixed(2)} min outside at most, ` +
          `window edges within ${stats.maxEdgeMin.toFixed(2)} min`,
      );
      expect(stats.visits).toBeGreaterThanOrEqual(minVisits);
      expect(stats.maxOutsideMin).toBeLessThanOrEqual(REFERENCE_TOLERANCE_MIN);
    });
  });

  describe('K/sigma_K recomputed from plan.csv', () => {
    it.each(names)('%s', (name) => {
      const plan = planOf(name);
      const { header, rows } = parsePlanCsv(renderPlanCsv(plan));
      expect(header).toEqual(PLAN_CSV_HEADER);
      expect(rows.map((r) => `${r.starId} ${r.startUtc}`).sort()).toEqual(plan.visits.map((v) => `${v.starId} ${v.startUtc}`).sort());
      const visits = csvVisits(rows);
      // One visit observes one star: never two of one star closer than the spacing, even with several
      // planets (the same-night spacing on one evening when visits go by nights).
      const { minSpacingHours, sameNightSpacingHours } = plan.campaign.constraints;
      for (const starId of new Set(plan.visits.map((v) => v.starId))) {
        const mine = plan.visits.filter((v) => v.starId === starId).sort((a, b) => Date.parse(a.startUtc) - Date.parse(b.startUtc));
        for (let i = 1; i < mine.length; i++) {
          const hours = minSpacingHours >= 12 && mine[i]!.localDate === mine[i - 1]!.localDate ? sameNightSpacingHours : minSpacingHours;
          expect(Date.parse(mine[i]!.startUtc) - Date.parse(mine[i - 1]!.startUtc)).toBeGreaterThanOrEqual(hours * 3_600_000);
        }
      }
      for (const summary of plan.targets.filter((t) => t.kind === 'ephemeris')) {
        const target = plan.campaign.targets.find((t) => t.id === summary.targetId)!;
        const mine = visits.filter((v) => v.starId === summary.starId);
        // The summary counts the visits ahead; visits kept from an earlier plan (--now) are listed too.
        expect(mine.length).toBe(summary.visits + plan.visits.filter((v) => v.kept && v.starId === summary.starId).length);
        // The phase columns follow from the written mid-exposure BJD: phi = (t - Tc)/P mod 1 and
        // sigma_phi = sqrt(sigma_Tc^2 + x^2 sigma_P^2)/P (linear error propagation, common practice),
        // within the CSV's rounding (BJD to 1e-6 d).
        for (const v of mine) {
          const { phase, phaseErr } = v.phases.get(summary.targetId)!;
          const phaseGap = Math.abs(phase - phaseAt(target.ephemeris!, v.midBjdTdb));
          expect(Math.min(phaseGap, 1 - phaseGap)).toBeLessThan(1e-5 + 1e-6 / target.ephemeris!.periodDays);
          const x = (v.midBjdTdb - target.ephemeris!.tcBjdTdb) / target.ephemeris!.periodDays;
          expect(phaseErr).toBeCloseTo(Math.hypot(target.ephemeris!.tcErrDays, x * target.ephemeris!.periodErrDays) / target.ephemeris!.periodDays, 4);
        }
        const value = kOverSigmaKFromCsv(plan, summary, visits);
        const tolerance = CSV_ROUNDING * value + 1e-9;
        expect(Math.abs(summary.kOverSigmaK! - value)).toBeLessThanOrEqual(tolerance);
        if (value > 0) expect(Math.abs(summary.sigmaKMps! - summary.kMps! / value)).toBeLessThanOrEqual((summary.kMps! / value) * CSV_ROUNDING * 1.01);
      }
    });
  });

  describe('plan.csv night, end, priority and place', () => {
    it.each(names)('%s: each row against its visit and its star', (name) => {
      const plan = planOf(name);
      const { rows } = parsePlanCsv(renderPlanCsv(plan));
      for (const r of rows) {
        const visit = plan.visits.find((v) => v.starId === r.starId && v.startUtc === r.startUtc)!;
        // The night column spans the evening's date to the next (ISO 8601 interval, end abbreviated):
        // a visit before noon local time lies on the morning's date.
        const [evening, morning] = expandInterval(r.night!);
        expect(evening).toBe(visit.localDate);
        expect(Date.parse(`${morning}T00:00:00Z`) - Date.parse(`${evening}T00:00:00Z`)).toBe(86_400_000);
        const localHour = Number(r.startLocal!.slice(11, 13));
        expect(r.startLocal!.slice(0, 10)).toBe(localHour >= 12 ? evening : morning);
        // The block ends durationSec after it starts, in UTC and in local time alike.
        expect(Date.parse(r.endUtc!) - Date.parse(r.startUtc!)).toBe(Number(r.durationSec) * 1000);
        expect(Date.parse(r.endLocal!)).toBe(Date.parse(r.endUtc!));
        const rows = plan.campaign.targets.filter((t) => t.starId === r.starId);
        expect(Number(r.priority)).toBe(Math.max(...rows.map((t) => t.priority)));
        // The written place is the catalogue place moved by the proper motion over the years since
        // its epoch (a small-angle property, independent of the module's vectors), within the
        // text's rounding (1 ms of RA, 10 mas of Dec) plus 1 mas.
        const star = rows[0]!;
        const { eastMas, northMas, cosDec } = placeOffsetMas(star, r.raIcrs!, r.decIcrs!, r.startUtc!);
        expect(Math.abs(eastMas)).toBeLessThanOrEqual(7.5 * cosDec + 1);
        expect(Math.abs(northMas)).toBeLessThanOrEqual(5 + 1);
      }
    });
  });

  describe('plan.ics read back with ical.js', () => {
    it.each(names)('%s: one VEVENT per visit, DTSTART in the site zone at the visit start', (name) => {
      const plan = planOf(name);
      expect(icsMismatches(plan, renderPlanIcs(plan))).toEqual([]);
    });
  });
}

/** `2027-03-31/04-01` → both dates in full: the end takes the start's leading parts it leaves out (ISO 8601:2004, 4.4.5). */
function expandInterval(text: string): [string, string] {
  const [start, end] = text.split('/') as [string, string];
  return [start, start.slice(0, start.length - end.length) + end];
}
