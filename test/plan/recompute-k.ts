// K/sigma_K recomputed from plan.csv: each planet's Var(K) by the tests' dense Cramér–Rao
// reference (test/support/dense-information.ts: numerical derivatives of the RV curve, the dense
// noise covariance, Gaussian elimination), from the CSV's mid-exposure times, white σ and nights
// alone. Only the star's linearisation point (reference epoch and sample ephemerides) comes from
// the plan's own model builder, src/plan/star-model.ts.
import { parse } from 'csv-parse/sync';
import type { Plan, TargetSummary } from '../../src/plan/plan-schema.js';
import { starModel, starsOf } from '../../src/plan/star-model.js';
import { nightMiddleJd } from '../../src/plan/visit-information.js';
import { denseKVariances } from '../support/dense-information.js';

export interface CsvVisit {
  starId: string;
  localDate: string;
  startUtc: string;
  midBjdTdb: number;
  /** Per planet: phase and its error, from the `phases` column. */
  phases: Map<string, { phase: number; phaseErr: number }>;
  whiteSigmaMps: number;
}

/**
 * Relative effect of the CSV's rounding on K/sigma_K: σ written to 1e-4 m/s (at least 1 m/s
 * here, so 5e-5 relative per visit, at most that on the total) and BJD to 1e-6 d (a phase
 * change of 1e-6/P cycles); 2e-4 bounds both with room.
 */
export const CSV_ROUNDING = 2e-4;

export function parsePlanCsv(text: string): { header: string[]; rows: Record<string, string>[] } {
  const records = parse(text, { skip_empty_lines: true }) as string[][];
  const [header, ...body] = records;
  return { header: header!, rows: body.map((cells) => Object.fromEntries(header!.map((h, i) => [h, cells[i] ?? '']))) };
}

/** `b=0.25012±0.00120; c=0.71000±0.02000` → a map by planet id. */
function parsePhases(text: string): Map<string, { phase: number; phaseErr: number }> {
  const out = new Map<string, { phase: number; phaseErr: number }>();
  for (const part of text.split('; ').filter((p) => p !== '')) {
    const [id, value] = part.split('=') as [string, string];
    const [phase, phaseErr] = value.split('±').map(Number) as [number, number];
    out.set(id, { phase, phaseErr });
  }
  return out;
}

export function csvVisits(rows: Record<string, string>[]): CsvVisit[] {
  return rows.map((r) => ({
    starId: r.starId!,
    // The night column names the evening's date first (2027-03-03/04).
    localDate: r.night!.slice(0, 10),
    startUtc: r.startUtc!,
    midBjdTdb: Number(r.midBjdTdb),
    phases: parsePhases(r.phases!),
    whiteSigmaMps: Number(r.whiteSigmaMps),
  }));
}

/** K/sigma_K of a planet summary from its star's CSV visits (0 when they carry no information). */
export function kOverSigmaKFromCsv(plan: Plan, summary: TargetSummary, visits: CsvVisit[]): number {
  const rows = starsOf(plan.campaign.targets).get(summary.starId)!;
  const model = starModel(rows, plan.campaign)!;
  const nightPos = new Map(plan.nights.map((n, i) => [n.localDate, i]));
  const mine = visits.filter((v) => v.starId === summary.starId);
  if (mine.length === 0) return 0;
  const variance = denseKVariances(
    model,
    mine.map((v) => ({
      bjdTdb: v.midBjdTdb,
      whiteSigmaMps: v.whiteSigmaMps,
      night: nightPos.get(v.localDate)!,
      nightBjdTdb: nightMiddleJd(plan.nights[nightPos.get(v.localDate)!]),
    })),
  )[model.planets.findIndex((p) => p.input.id === summary.targetId)]!;
  return variance === Infinity ? 0 : summary.kMps! / Math.sqrt(variance);
}
