import { extent } from '../../extent.js';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { fmt, percent, type Column } from '../table.js';
import { type LevelMass, type LevelRow, levelRows } from '../../rv/injection-map.js';
import type { DetectionMapData } from './chart-detection-map.js';
import { searchMassLimit } from './chart-mass-limit.js';
import { equivalentSigmaMps, targetOf, visitsOf } from './target-visits.js';

export const PROPOSAL_COLUMNS: Column[] = [
  { header: 'target' },
  { header: 'V', align: 'right' },
  { header: 'K (m/s)', align: 'right' },
  { header: 'σ per visit (m/s)', align: 'right' },
  { header: 'exposure (s)', align: 'right' },
  { header: 'visits', align: 'right' },
  { header: 'hours', align: 'right' },
  { header: 'expected K/σ_K (search: completeness)', align: 'right' },
  { header: 'P(goal) with weather', align: 'right' },
];

/** `600` when all equal, `300-900` otherwise, `-` when empty. */
function spread(values: number[], decimals: number, dash = '–'): string {
  if (!values.length) return '-';
  const { min: lo, max: hi } = extent(values);
  return lo.toFixed(decimals) === hi.toFixed(decimals) ? lo.toFixed(decimals) : `${lo.toFixed(decimals)}${dash}${hi.toFixed(decimals)}`;
}

/** One row per target: what a time request needs (σ per visit is the visits' equivalent σ with jitter). */
export function proposalRows(plan: Plan): string[][] {
  return plan.targets.map((s) => {
    const visits = visitsOf(plan, s.starId);
    return [
      s.targetId,
      fmt(targetOf(plan, s.targetId)?.vmag, 1),
      fmt(s.kMps, 2),
      fmt(equivalentSigmaMps(visits), 2),
      spread(
        visits.map((v) => v.exposureSec),
        0,
        '-',
      ),
      String(s.visits),
      fmt(s.hours, 1),
      s.completeness !== undefined ? fmt(s.completeness, 2) : fmt(s.kOverSigmaK, 1),
      percent(s.goalProbability),
    ];
  });
}

function list(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function clearText(clear: number | number[]): string {
  return typeof clear === 'number'
    ? percent(clear)
    : `${spread(
        clear.map((c) => c * 100),
        0,
      )}% by month`;
}

function ephemerisSentence(plan: Plan, summaries: TargetSummary[]): string {
  const ratios = summaries.map((s) => s.kOverSigmaK ?? 0);
  const met = summaries.filter((s) => (s.kOverSigmaK ?? 0) >= (s.goalSignificance ?? plan.campaign.goals.significance)).length;
  return (
    `For the ${summaries.length === 1 ? 'planet' : `${summaries.length} planets`} with a transit ephemeris (${list(summaries.map((s) => s.targetId))}), ` +
    'the visits are placed at the predicted orbital phases that constrain the semi-amplitude K best, allowing for the growing ' +
    `uncertainty of the ephemeris; the expected significance K/σ_K is ${spread(ratios, 1)}, ` +
    `and ${met} of ${summaries.length} reach the goal of ${fmt(plan.campaign.goals.significance, 0)}σ if every planned night is clear.`
  );
}

/** A level's mass as words: the value, or the side of the grid it lies beyond. */
function levelText(mass: LevelMass, masses: number[]): string {
  if (mass.where === 'inside') return fmt(mass.msiniEarth, 1);
  return mass.where === 'below grid' ? `below ${fmt(masses[0], 1)}` : `above ${fmt(masses.at(-1), 1)}`;
}

/** The simulated limits of a saved injection–recovery map: 50% and 90% detection at its shortest and longest period. */
function simulatedSentence(s: TargetSummary, map: DetectionMapData): string {
  const rows = levelRows(map.periodsDays, map.msinisEarth, map.panels[0]!.detection);
  const at = (row: LevelRow) => `${row.levels.map((l) => levelText(l.mass, map.msinisEarth)).join(' and ')} M⊕ at ${fmt(row.periodDays, 0)} d`;
  return `${at(rows[0]!)} and ${at(rows.at(-1)!)} around ${s.targetId} (${s.visits} planned visits)`;
}

const SIMULATED_LEAD = 'Simulated blind searches of the planned visits (injection–recovery, `crest map`) detect 50% and 90% of planets at m sin i of';

function searchSentence(plan: Plan, summaries: TargetSummary[], maps: ReadonlyMap<string, DetectionMapData>): string {
  const simulated = summaries.flatMap((s) => {
    const map = maps.get(s.targetId);
    return map ? [simulatedSentence(s, map)] : [];
  });
  const parts = summaries.flatMap((s) => {
    const target = targetOf(plan, s.targetId);
    if (!target?.search || maps.has(s.targetId)) return [];
    const { periodMinDays, periodMaxDays } = target.search;
    const limit = searchMassLimit(plan, s, target, [periodMinDays, periodMaxDays]);
    if (!limit) return [];
    const [short, long] = limit.rows;
    return [
      `${fmt(short!.massMinRandomEarth, 1)} M⊕ at ${fmt(periodMinDays, 0)} d and ${fmt(long!.massMinRandomEarth, 1)} M⊕ at ` +
        `${fmt(periodMaxDays, 0)} d around ${s.targetId} (${limit.visits} visits)`,
    ];
  });
  const analytic = parts.length
    ? ` In the blind search, by the analytic limit, planets are detectable at K/σ_K = ${fmt(plan.campaign.goals.significance, 0)} ` +
      `(random orbital phases, circular orbits) down to a minimum mass m sin i of ${list(parts)}.`
    : '';
  const injected = simulated.length ? ` ${SIMULATED_LEAD} ${list(simulated)}.` : '';
  return analytic + injected;
}

/** The dark time of the nights asked for that no visit uses, and what can be done with it; '' when it is small. */
function idleSentence(plan: Plan): string {
  const { darkHours, idleHours } = plan.totals;
  if (plan.campaign.time.mode !== 'choose-nights' || darkHours === undefined || idleHours === undefined || idleHours < 0.1 * darkHours) return '';
  return (
    ` Of the ${fmt(darkHours, 1)} dark hours of these nights, ${fmt(idleHours, 1)} h (${percent(idleHours / darkHours)}) hold no visit: ` +
    'fewer or shorter nights would do for these targets, or that time can go to other programmes.'
  );
}

/**
 * A short justification paragraph with the plan's numbers filled in, in plain scientific
 * English, for a proposer to adapt.
 */
export function proposalParagraph(plan: Plan, maps: ReadonlyMap<string, DetectionMapData> = new Map()): string {
  const c = plan.campaign;
  const t = plan.totals;
  const observed = plan.targets.filter((s) => s.visits > 0);
  const sigmas = plan.visits.map((v) => v.effectiveSigmaMps);
  const exposures = plan.visits.map((v) => v.exposureSec);
  const ephemeris = observed.filter((s) => s.kind === 'ephemeris');
  const search = observed.filter((s) => s.kind === 'search');
  const probabilities = observed.flatMap((s) => (s.goalProbability === undefined ? [] : [s.goalProbability * 100]));
  const nightsAsked = c.time.mode === 'choose-nights' ? `${t.nights} nights` : `${fmt(t.totalHours, 1)} hours on ${t.nights} nights`;
  const sentences = [
    `We request ${nightsAsked} between ${c.window.start} and ${c.window.end} with ${c.instrument.name} at ${c.site.name}, ` +
      `for ${t.visits} radial-velocity visits of ${observed.length} stars: ${fmt(t.totalHours, 1)} h in total, ` +
      `of which ${fmt(t.exposureHours, 1)} h are exposure and ${fmt(t.overheadHours, 1)} h readout and acquisition.`,
    `Exposures of ${spread(exposures, 0)} s give an expected precision of ${spread(sigmas, 1)} m/s per visit, ` +
      'including the instrumental floor and stellar jitter.',
  ];
  if (ephemeris.length) sentences.push(ephemerisSentence(plan, ephemeris));
  let text = sentences.join(' ') + searchSentence(plan, search, maps);
  if (probabilities.length) {
    text +=
      ` With the site's fraction of clear nights (${clearText(c.site.clearFraction)}), simulated weather gives each target a ` +
      `probability of ${spread(probabilities, 0)}% of reaching its goal`;
    text += plan.backups.length ? `; ${plan.backups.length} backup nights are ranked in case planned nights are lost.` : '.';
  }
  return text + idleSentence(plan);
}
