import type { TopLevelSpec } from 'vega-lite';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { planetSignalShape } from '../../orbit/signal-shape.js';
import { fmt } from '../table.js';
import type { ChartFigure } from './figure.js';
import { foldedRvs } from './observed-rvs.js';
import { OKABE_ITO, INK } from './palette.js';
import { visitsOf } from './target-visits.js';

const CURVE_POINTS = 200;

/** The names the chart's key gives its point layers (shape and colour both differ). */
const KEY = { planned: 'planned visit (on the curve)', measured: 'measured RV' } as const;

/**
 * The RV curve folded on phase for one target with an ephemeris: the model curve, each planned
 * visit at its predicted phase on the curve, with ±σ_eff (vertical) and ±σ_φ (horizontal) bars.
 * Once RVs exist, also each measured RV (src/report/html/observed-rvs.ts) with its error bar, and
 * with a fit the band the curve spans for K ± σ_K.
 */
export function rvPhaseFigure(plan: Plan, summary: TargetSummary & { kMps: number }): ChartFigure {
  const k = summary.kMps;
  // v − γ = K s(φ): −K sin 2πφ for a circular orbit, the Keplerian curve for an eccentric one
  // (docs/references.md [Kepler-RV]; src/orbit/signal-shape.ts).
  const shape = planetSignalShape(plan.campaign.targets.find((t) => t.id === summary.targetId)?.planet);
  const rvAt = (phase: number) => k * shape.at(phase);
  const curve = Array.from({ length: CURVE_POINTS + 1 }, (_, i) => ({ phase: i / CURVE_POINTS, rv: rvAt(i / CURVE_POINTS) }));
  const fit = summary.fit;
  // The curve for K ± σ_K: v = (K ± σ_K) s(φ), the same shape scaled (K enters v linearly).
  const band =
    fit &&
    curve.map((c) => {
      const ends = [(k - fit.kErrMps) * shape.at(c.phase), (k + fit.kErrMps) * shape.at(c.phase)];
      return { phase: c.phase, lo: Math.min(...ends), hi: Math.max(...ends) };
    });
  const { points: measured, othersRemoved } = foldedRvs(plan, summary);
  const keyed = measured.length > 0;
  // A layer's entry in the key, shown only beside measured RVs (the chart without them is unchanged).
  const domain = Object.values(KEY);
  const key = (name: string) =>
    keyed
      ? {
          shape: { datum: name, type: 'nominal', title: null, scale: { domain, range: ['circle', 'diamond'] } },
          color: { datum: name, type: 'nominal', scale: { domain, range: [OKABE_ITO.vermillion, OKABE_ITO.blue] } },
        }
      : {};
  const visits = visitsOf(plan, summary.starId).map((v, i) => {
    const { phase, phaseErr } = v.phases.find((p) => p.targetId === summary.targetId) ?? { phase: 0, phaseErr: 0 };
    const rv = rvAt(phase);
    return {
      n: i + 1,
      date: v.kept ? `${v.localDate} (kept)` : v.localDate,
      phase,
      rv,
      rvLo: rv - v.effectiveSigmaMps,
      rvHi: rv + v.effectiveSigmaMps,
      phaseLo: phase - phaseErr,
      phaseHi: phase + phaseErr,
    };
  });
  const ends = [...visits, ...measured].flatMap((v) => [Math.abs(v.rvHi), Math.abs(v.rvLo)]);
  const yMax = Math.max(k + (fit?.kErrMps ?? 0), ...ends) * 1.1;
  const x = { field: 'phase', type: 'quantitative' as const, title: 'Orbital phase (0 = mid-transit)', scale: { domain: [0, 1], nice: false } };
  const y = { field: 'rv', type: 'quantitative' as const, title: 'RV − γ (m/s)', scale: { domain: [-yMax, yMax] } };
  const spec = {
    width: 380,
    height: 220,
    layer: [
      ...(band
        ? [
            {
              data: { values: band },
              name: 'fit_band',
              mark: { type: 'area', color: OKABE_ITO.skyBlue, opacity: 0.3, clip: true },
              encoding: { x, y: { ...y, field: 'lo' }, y2: { field: 'hi' } },
            },
          ]
        : []),
      { data: { values: curve }, name: 'model_curve', mark: { type: 'line', color: INK, strokeWidth: 1.5 }, encoding: { x, y } },
      {
        data: { values: visits },
        layer: [
          {
            name: 'rv_error_bars',
            mark: { type: 'rule', color: OKABE_ITO.vermillion, strokeWidth: 1.5, clip: true },
            encoding: { x, y: { ...y, field: 'rvLo' }, y2: { field: 'rvHi' } },
          },
          {
            name: 'phase_error_bars',
            mark: { type: 'rule', color: OKABE_ITO.vermillion, strokeWidth: 1.5, clip: true },
            encoding: { x: { ...x, field: 'phaseLo' }, x2: { field: 'phaseHi' }, y },
          },
          {
            name: 'visit_points',
            mark: { type: 'point', shape: 'circle', filled: true, size: 55, color: OKABE_ITO.vermillion, opacity: 1 },
            encoding: { x, y, ...key(KEY.planned) },
          },
        ],
      },
      ...(keyed
        ? [
            {
              data: { values: measured },
              layer: [
                {
                  name: 'measured_error_bars',
                  mark: { type: 'rule', color: OKABE_ITO.blue, strokeWidth: 1.2, clip: true },
                  encoding: { x, y: { ...y, field: 'rvLo' }, y2: { field: 'rvHi' } },
                },
                {
                  name: 'measured_points',
                  mark: { type: 'point', filled: true, size: 70, opacity: 1 },
                  encoding: { x, y, ...key(KEY.measured) },
                },
              ],
            },
          ]
        : []),
    ],
    ...(keyed ? { config: { legend: { orient: 'bottom', direction: 'horizontal', labelLimit: 300 } } } : {}),
  } as unknown as TopLevelSpec;
  const orbitText = shape.ecc > 0 ? `an orbit with e = ${fmt(shape.ecc, 2)}, ω = ${fmt(shape.omegaDeg, 0)}°` : 'a circular orbit';
  return {
    id: `rv-${summary.targetId}`,
    kind: 'rv-phase',
    title: `${summary.targetId}: expected RV curve and planned phases`,
    caption:
      `Model curve for K = ${fmt(k, 2)} m/s on ${orbitText} (line). Each of the ${visits.length} dots is a planned visit at its ` +
      'predicted phase; vertical bars are the per-visit RV uncertainty (±σ with jitter), horizontal bars the 1σ phase uncertainty of the ephemeris.' +
      (fit
        ? ` The curve is the orbit fitted to ${fit.points} RVs so far; ` +
          `the shaded band spans the curves for K ± σ_K = ${fmt(k, 2)} ± ${fmt(fit.kErrMps, 2)} m/s.`
        : '') +
      (keyed
        ? ` Each of the ${measured.length} diamonds is an RV already measured, folded on the ${fit ? 'fitted ' : ''}ephemeris, less its instrument's offset ` +
          `(the weighted mean of RV − model for that instrument)${othersRemoved.length ? ` and the signal of ${othersRemoved.join(', ')}` : ''}; ` +
          'its bar is ±√(σ_RV² + jitter²).'
        : ''),
    spec,
    columns: [
      { header: 'visit', align: 'right' },
      { header: 'night' },
      { header: 'phase', align: 'right' },
      { header: 'phase error', align: 'right' },
      { header: keyed ? 'RV: model if planned, measured if done (m/s)' : 'model RV (m/s)', align: 'right' },
      { header: 'σ (m/s)', align: 'right' },
    ],
    rows: [
      ...visits.map((v) => [String(v.n), v.date, fmt(v.phase, 3), fmt(v.phaseHi - v.phase, 3), fmt(v.rv, 2), fmt(v.rvHi - v.rv, 2)]),
      ...measured.map((m, i) => [`measured ${i + 1}`, m.date, fmt(m.phase, 3), '-', fmt(m.rv, 2), fmt(m.errMps, 2)]),
    ],
  };
}
