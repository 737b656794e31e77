// Which targets of a plan `crest map` maps, and the inputs of each map: the planned visits'
// mid-exposure BJD_TDB and σ_eff (jitter included), the star's mass, and log-spaced axes.
import { inputError } from '../errors.js';
import { extent } from '../extent.js';
import type { Ephemeris, Target } from '../model.js';
import type { Plan, PlannedVisit } from '../plan/plan-schema.js';
import { planetMassFromKEarth } from '../orbit/minimum-mass.js';
import { visitsOf } from '../report/html/target-visits.js';
import type { InjectionInput } from '../rv/injection.js';
import { logSpaced } from '../rv/injection-map.js';
import type { KnownPhaseInput } from '../rv/known-phase-map.js';

/** Fewest visits a map is made from: the floating-offset periodogram and its FAP need N > 3. */
export const MIN_MAP_VISITS = 4;

/** Default mass range of a known-phase map: this factor below and above the planet's mass. */
const MASS_FACTOR = 4;
/** Default mass range of a blind search: half the search mass to this many times it. */
const SEARCH_MASS_FACTOR = 8;
/** Default period range of a known-phase map: this factor either side of the ephemeris period. */
const PERIOD_FACTOR = 2;

export interface MapSettings {
  periods?: [number, number];
  masses?: [number, number];
  grid: { periods: number; masses: number };
  trialsPerCell: number;
  fapThreshold: number;
  seed: number;
  /** Blind-search injections: e uniform in [0, eccMax] (and ω uniform); 0 or omitted: circular. */
  eccMax?: number;
}

interface JobBase {
  targetId: string;
  visits: number;
  baselineDays: number;
  starMassSun: number;
}

export type MapJob =
  | (JobBase & { kind: 'search'; searchMsiniEarth: number; input: InjectionInput })
  | (JobBase & { kind: 'ephemeris'; ephemeris: Ephemeris; planetMsiniEarth?: number; input: KnownPhaseInput });

function axes(settings: MapSettings, periods: [number, number], masses: [number, number]) {
  const [pMin, pMax] = settings.periods ?? periods;
  const [mMin, mMax] = settings.masses ?? masses;
  return { periodsDays: logSpaced(pMin, pMax, settings.grid.periods), msinisEarth: logSpaced(mMin, mMax, settings.grid.masses) };
}

function base(target: Target, visits: PlannedVisit[]): JobBase {
  const times = extent(visits.map((v) => v.midBjdTdb));
  return { targetId: target.id, visits: visits.length, baselineDays: times.max - times.min, starMassSun: target.massSun };
}

/** The planet's m sin i: given, or from its K at the ephemeris period (exact inverse of K). */
function planetMsiniEarth(plan: Plan, target: Target, eph: Ephemeris): number | undefined {
  if (target.planet?.msiniEarth !== undefined) return target.planet.msiniEarth;
  const kMps = plan.targets.find((s) => s.targetId === target.id)?.kMps;
  return kMps && kMps > 0 ? planetMassFromKEarth({ starMassSun: target.massSun, kMps, periodDays: eph.periodDays }) : undefined;
}

function jobOf(plan: Plan, target: Target, settings: MapSettings): MapJob | undefined {
  const visits = visitsOf(plan, target.starId);
  const timesBjdTdb = visits.map((v) => v.midBjdTdb);
  const rvErrorsMps = visits.map((v) => v.effectiveSigmaMps);
  if (target.search) {
    const { periodMinDays, periodMaxDays, msiniEarth } = target.search;
    const { periodsDays, msinisEarth } = axes(settings, [periodMinDays, periodMaxDays], [msiniEarth / 2, msiniEarth * SEARCH_MASS_FACTOR]);
    const input: InjectionInput = {
      timesBjdTdb,
      rvErrorsMps,
      periodsDays,
      msinisEarth,
      starMassSun: target.massSun,
      trialsPerCell: settings.trialsPerCell,
      seed: settings.seed,
      fapThreshold: settings.fapThreshold,
    };
    if (settings.eccMax) input.eccentricity = { distribution: 'uniform', max: settings.eccMax };
    return { ...base(target, visits), kind: 'search', searchMsiniEarth: msiniEarth, input };
  }
  const eph = target.ephemeris;
  if (!eph) return undefined;
  const mass = planetMsiniEarth(plan, target, eph);
  const centre = mass ?? 10;
  const { periodsDays, msinisEarth } = axes(
    settings,
    [eph.periodDays / PERIOD_FACTOR, eph.periodDays * PERIOD_FACTOR],
    [centre / MASS_FACTOR, centre * MASS_FACTOR],
  );
  const goalSignificance = plan.targets.find((s) => s.targetId === target.id)?.goalSignificance ?? plan.campaign.goals.significance;
  const input: KnownPhaseInput = { timesBjdTdb, rvErrorsMps, ephemeris: eph, periodsDays, msinisEarth, starMassSun: target.massSun, goalSignificance };
  return { ...base(target, visits), kind: 'ephemeris', ephemeris: eph, planetMsiniEarth: mass, input };
}

/**
 * The maps to make: the one target asked for, or every blind-search and ephemeris target with
 * at least MIN_MAP_VISITS planned visits (`skipped` names the others). Input errors: an unknown
 * target, or one with no search spec or ephemeris, or too few visits.
 */
export function mapJobs(plan: Plan, settings: MapSettings, targetId?: string): { jobs: MapJob[]; skipped: string[] } {
  const mappable = plan.campaign.targets.filter((t) => t.search || t.ephemeris);
  if (targetId !== undefined) {
    const target = mappable.find((t) => t.id === targetId);
    if (!target)
      throw inputError({
        file: 'command line',
        field: '--target',
        value: targetId,
        allowed: `a blind-search or ephemeris target of the plan: ${mappable.map((t) => t.id).join(', ')}`,
      });
    const visits = visitsOf(plan, target.starId).length;
    if (visits < MIN_MAP_VISITS)
      throw inputError({
        file: 'command line',
        field: '--target',
        value: targetId,
        allowed: `a target with at least ${MIN_MAP_VISITS} planned visits (it has ${visits})`,
      });
    return { jobs: [jobOf(plan, target, settings)!], skipped: [] };
  }
  const jobs: MapJob[] = [];
  const skipped: string[] = [];
  for (const target of mappable) {
    if (visitsOf(plan, target.starId).length < MIN_MAP_VISITS) skipped.push(target.id);
    else jobs.push(jobOf(plan, target, settings)!);
  }
  return { jobs, skipped };
}
