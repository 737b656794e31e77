// What the RVs taken so far change: each star's planets fitted jointly (src/rv/orbit-fit.ts) and
// the campaign's targets updated to the fitted ephemeris and K, which the rest is planned with; a
// blind-search star's periodogram peak is reported beside it (offered as a candidate, never adopted).
import type { Campaign } from './campaign.js';
import type { ObservedVisit, OrbitUpdate, TargetSummary } from './plan-schema.js';
import { blindPeak } from '../rv/blind-peak.js';
import { fitOrbits, type FitPlanetPrior, type FitPoint } from '../rv/orbit-fit.js';
import type { TargetSetup } from './candidates.js';
import { starsOf } from './star-model.js';

export interface RvUpdate {
  /** The campaign with fitted planets' ephemerides and K replaced. */
  campaign: Campaign;
  /** Per planet row: the fit beside the catalogue. */
  fits: Map<string, OrbitUpdate>;
  /** Per search row: the strongest periodogram peak. */
  peaks: Map<string, NonNullable<TargetSummary['peak']>>;
  /** Stars whose ephemeris prior now holds their RVs' information on phases and periods. */
  fittedStars: Set<string>;
  /** One line per star whose fit did not converge (its catalogue values are kept). */
  warnings: string[];
}

/** The RV-carrying observed visits of a star, as the fit takes them. */
function points(observed: ObservedVisit[], starId: string): FitPoint[] {
  return observed
    .filter((v) => v.starId === starId && v.rvMps !== undefined)
    .map((v) => ({ bjdTdb: v.midBjdTdb, rvMps: v.rvMps!, rvErrorMps: v.rvErrorMps!, instrument: v.instrument }));
}

/**
 * Fits every star with RVs: its planet rows with an ephemeris and a K (from the setups) jointly,
 * the jitter of its first row added to each point's error. A star needs more RVs than its
 * offsets and K's, or it keeps its catalogue values.
 */
export function updateFromRvs(campaign: Campaign, observed: ObservedVisit[], setups: TargetSetup[]): RvUpdate {
  const out: RvUpdate = { campaign, fits: new Map(), peaks: new Map(), fittedStars: new Set(), warnings: [] };
  const byId = new Map(setups.map((s) => [s.target.id, s]));
  const replaced = new Map<string, Campaign['targets'][number]>();
  for (const [starId, rows] of starsOf(campaign.targets)) {
    const data = points(observed, starId);
    if (data.length === 0) continue;
    const jitterMps = rows[0]!.jitterMps;
    for (const row of rows.filter((r) => byId.get(r.id)?.role === 'search')) {
      const peak = blindPeak(data, row.search!, jitterMps);
      if (peak) out.peaks.set(row.id, { periodDays: peak.periodDays, kMps: peak.kMps, fap: peak.fap, significant: peak.significant });
    }
    const planets = rows.filter((r) => byId.get(r.id)?.role === 'ephemeris');
    const offsets = new Set(data.map((p) => p.instrument)).size;
    if (planets.length === 0 || data.length <= offsets + planets.length) continue;
    const priors: FitPlanetPrior[] = planets.map((r) => ({
      id: r.id,
      ...r.ephemeris!,
      kMps: byId.get(r.id)!.kMps!,
      ecc: r.planet?.ecc ?? 0,
      omegaDeg: r.planet?.omegaDeg ?? 90,
      ...(r.planet?.eccPriorSigma !== undefined ? { eccSigma: r.planet.eccPriorSigma } : {}),
    }));
    const fit = fitOrbits(priors, data, jitterMps);
    if (!fit.converged || fit.planets.some((p) => !Number.isFinite(p.kErrMps))) {
      out.warnings.push(`${starId}: the fit of its ${data.length} RVs did not settle; planned with the catalogue ephemeris and K`);
      continue;
    }
    out.fittedStars.add(starId);
    fit.planets.forEach((p, i) => {
      const row = planets[i]!;
      const eph = row.ephemeris!;
      out.fits.set(row.id, {
        points: data.length,
        kMps: p.kMps,
        kErrMps: p.kErrMps,
        tcBjdTdb: p.tcBjdTdb,
        tcErrDays: p.tcErrDays,
        periodDays: p.periodDays,
        periodErrDays: p.periodErrDays,
        catalogue: {
          kMps: byId.get(row.id)!.kMps,
          tcBjdTdb: eph.tcBjdTdb,
          tcErrDays: eph.tcErrDays,
          periodDays: eph.periodDays,
          periodErrDays: eph.periodErrDays,
        },
      });
      replaced.set(row.id, {
        ...row,
        ephemeris: { ...eph, tcBjdTdb: p.tcBjdTdb, tcErrDays: p.tcErrDays, periodDays: p.periodDays, periodErrDays: p.periodErrDays },
        planet: { ...row.planet!, kMps: p.kMps, ecc: p.ecc, omegaDeg: p.omegaDeg },
      });
    });
  }
  // The planner has one zero point per star (instrument offsets are fitted, not planned for).
  const others = [...new Set(observed.map((v) => v.instrument))].filter((id) => id !== campaign.instrument.id);
  if (others.length > 0) {
    out.warnings.push(
      `observed visits from ${others.join(', ')} count in the plan as if on the zero point of ${campaign.instrument.id} ` +
        '(the RV fit gives each instrument its own offset)',
    );
  }
  if (replaced.size > 0) out.campaign = { ...campaign, targets: campaign.targets.map((t) => replaced.get(t.id) ?? t) };
  return out;
}
