import type { Target } from '../../model.js';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { phaseAt } from '../../orbit/ephemeris.js';
import { planetSignalShape } from '../../orbit/signal-shape.js';
import { starsOf } from '../../plan/star-model.js';

/** One measured RV of a planet's star, folded on the planet's ephemeris with the rest of the model removed. */
export interface FoldedRv {
  date: string;
  instrument: string;
  bjdTdb: number;
  phase: number;
  /** RV − γ(instrument) − the star's other planets (m/s), and its ±1σ ends. */
  rv: number;
  rvLo: number;
  rvHi: number;
  /** √(rvErr² + jitter²), the error the orbit fit weighs the point with. */
  errMps: number;
  gammaMps: number;
}

/** The star's planets with an ephemeris and a K (the plan's values: fitted where a fit exists), each as a signal v(t). */
function planetSignals(plan: Plan, rows: Target[]): { id: string; at: (bjd: number) => number }[] {
  return rows.flatMap((row) => {
    const k = plan.targets.find((s) => s.targetId === row.id)?.kMps;
    const eph = row.ephemeris;
    if (!eph || k === undefined || !(k > 0)) return [];
    const shape = planetSignalShape(row.planet);
    // v = K s(φ), φ = (t − Tc)/P mod 1 (src/orbit/signal-shape.ts, src/orbit/ephemeris.ts).
    return [{ id: row.id, at: (bjd: number) => k * shape.at(phaseAt(eph, bjd)) }];
  });
}

/**
 * The star's measured RVs for one planet, folded on its ephemeris (and the other planets removed): each RV minus the other planets'
 * signals and minus its instrument's offset γ. The plan keeps no offsets, so γ is found here as the
 * weighted mean of RV − model over the instrument's points, weights 1/(rvErr² + jitter²): the
 * least-squares offset with the orbits held fixed (common practice). The jitter is the star's
 * first row's, as the orbit fit (src/plan/orbit-update.ts) takes it.
 */
export function foldedRvs(plan: Plan, summary: TargetSummary): { points: FoldedRv[]; othersRemoved: string[] } {
  const rows = starsOf(plan.campaign.targets).get(summary.starId) ?? [];
  const self = rows.find((r) => r.id === summary.targetId);
  if (!self?.ephemeris) return { points: [], othersRemoved: [] };
  const jitter = rows[0]!.jitterMps;
  const signals = planetSignals(plan, rows);
  const model = (bjd: number) => signals.reduce((sum, p) => sum + p.at(bjd), 0);
  const others = (bjd: number) => signals.reduce((sum, p) => sum + (p.id === summary.targetId ? 0 : p.at(bjd)), 0);
  const points = (plan.observed ?? []).flatMap((v) =>
    v.starId === summary.starId && v.rvMps !== undefined ? [{ v, rv: v.rvMps, err: Math.hypot(v.rvErrorMps ?? 0, jitter) }] : [],
  );
  const gamma = new Map<string, number>();
  for (const instrument of new Set(points.map((p) => p.v.instrument))) {
    const mine = points.filter((p) => p.v.instrument === instrument);
    const w = mine.map((p) => 1 / (p.err * p.err));
    gamma.set(instrument, mine.reduce((sum, p, i) => sum + w[i]! * (p.rv - model(p.v.midBjdTdb)), 0) / w.reduce((a, b) => a + b, 0));
  }
  const folded = points.map(({ v, rv, err }) => {
    const g = gamma.get(v.instrument)!;
    const y = rv - g - others(v.midBjdTdb);
    return {
      date: v.localDate,
      instrument: v.instrument,
      bjdTdb: v.midBjdTdb,
      phase: phaseAt(self.ephemeris!, v.midBjdTdb),
      rv: y,
      rvLo: y - err,
      rvHi: y + err,
      errMps: err,
      gammaMps: g,
    };
  });
  return { points: folded, othersRemoved: signals.map((p) => p.id).filter((id) => id !== summary.targetId) };
}
