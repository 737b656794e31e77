import { extent } from '../../extent.js';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { nightCount, neededText } from '../plan-rows.js';
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
  { header: 'visits needed', align: 'right' },
  { header: 'visits requested', align: 'right' },
  { header: 'hours requested', align: 'right' },
  { header: 'P(goal) with weather', align: 'right' },
  { header: 'visits planned', align: 'right' },
  { header: 'K/σ_K planned, all clear', align: 'right' },
];

/** `600` when all equal, `300-900` otherwise, `-` when empty. */
function spread(values: number[], decimals: number, dash = '–'): string {
  if (!values.length) return '-';
  const { min: lo, max: hi } = extent(values);
  return lo.toFixed(decimals) === hi.toFixed(decimals) ? lo.toFixed(decimals) : `${lo.toFixed(decimals)}${dash}${hi.toFixed(decimals)}`;
}

/**
 * One row per target: what a time request needs (σ per visit is the visits' equivalent σ with
 * jitter). The request is the star's visits needed for the goal with the campaign's probability
 * under the weather (time from need), and P(goal) is for those visits alone; the planned visits
 * add the spare ones, and their K/σ_K assumes every night clear. Plans without a request show the planned visits.
 */
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
      neededText(s),
      String(s.request?.visits ?? s.visits),
      fmt(s.request?.hours ?? s.hours, 1),
      percent(s.request?.goalProbability ?? s.goalProbability),
      String(s.visits),
      s.completeness !== undefined ? fmt(s.completeness, 2) : fmt(s.kOverSigmaK, 1),
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
    ? ` For a planet whose period is already known, by the analytic limit, K/σ_K = ${fmt(plan.campaign.goals.significance, 0)} is reached ` +
      `(random orbital phases, circular orbits) down to a minimum mass m sin i of ${list(parts)}.`
    : '';
  const injected = simulated.length ? ` ${SIMULATED_LEAD} ${list(simulated)}.` : '';
  return completenessSentence(plan, summaries) + analytic + injected;
}

/** What the plan's own search objective promises: each search's expected completeness at its search mass (analytic, clear weather). */
function completenessSentence(plan: Plan, summaries: TargetSummary[]): string {
  const parts = summaries.flatMap((s) => {
    const search = targetOf(plan, s.targetId)?.search;
    if (!search || s.completeness === undefined) return [];
    return [
      `${percent(s.completeness)} of planets of ${fmt(search.msiniEarth, 0)} M⊕ with periods of ${fmt(search.periodMinDays, 0)}–` +
        `${fmt(search.periodMaxDays, 0)} d around ${s.targetId}`,
    ];
  });
  if (!parts.length) return '';
  return (
    ` The blind-search visits are placed for detection: a periodogram of them at 1% false-alarm probability is expected to find ${list(parts)} ` +
    '(periods log-uniform, circular orbits, random phases; analytic, every night clear).'
  );
}

/** Targets that fall short of the chosen probability, lowest priority first, with their probability. */
function shortTargets(plan: Plan): TargetSummary[] {
  return plan.targets.filter((s) => s.request && !s.request.reachable).sort((a, b) => a.priority - b.priority || a.targetId.localeCompare(b.targetId));
}

/** At most `most` items as words, the rest counted: `A, B, C and 4 more`. */
function listAtMost(items: string[], most: number): string {
  return items.length <= most ? list(items) : `${items.slice(0, most).join(', ')} and ${items.length - most} more`;
}

/** What the request needs: the goals at the chosen probability, and the targets that fall short of it. */
function needSentence(plan: Plan): string {
  const r = plan.totals.request!;
  const short = shortTargets(plan);
  const lead = ` These are the visits that reach each target's goal with ${percent(r.probability)} probability under the site's weather (time from need)`;
  if (!short.length) return `${lead}.`;
  const lowest = short.reduce((a, b) => (b.request!.goalProbability < a.request!.goalProbability ? b : a));
  const withGoal = plan.targets.filter((s) => s.request).length;
  return (
    `${lead}; for ${short.length} of the ${withGoal} targets even all planned visits fall short of that probability ` +
    `(lowest: ${lowest.targetId}, ${percent(lowest.request!.goalProbability)}), so all their visits are asked for.`
  );
}

/** The dark time of the nights asked for that the request leaves free, and the two honest uses of it; '' when it is small. */
function spareSentence(plan: Plan): string {
  const r = plan.totals.request!;
  const { darkHours } = plan.totals;
  if (darkHours === undefined || r.spareHours < 0.1 * darkHours) return '';
  const halves = r.halfNights.length
    ? `the requested visits fit in one half of the night on ${r.halfNights.length} of the ${r.nights} nights (${listAtMost(
        r.halfNights.map((h) => `${h.localDate}, ${h.half} half`),
        3,
      )})`
    : "no night's requested visits fit in one half of it";
  // A plan that already chose half nights has nothing more to gain from that advice.
  const planHalves =
    plan.campaign.time.mode === 'choose-nights' && !plan.campaign.time.halfNights
      ? '; crest plan --half-nights plans the same count as half nights on up to twice as many dates'
      : '';
  const short = shortTargets(plan);
  const use = short.length
    ? `, or be used for the targets that fall short, lowest priority first: ${listAtMost(
        short.map((t) => t.targetId),
        5,
      )}`
    : ', or go to other programmes';
  return (
    ` Of the ${fmt(darkHours, 1)} dark hours of these nights, ${fmt(r.spareHours, 1)} h (${percent(r.spareHours / darkHours)}) hold no requested visit. ` +
    `They could be given back by asking for fewer nights or for half nights (${halves}${planHalves})${use}.`
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
  const asked = askedFor(plan);
  const halves = plan.plannedHalves?.length ? ` (the plan's ${plan.plannedDates.length} dates, ${plan.plannedHalves.length} of them half nights)` : '';
  const nightsAsked =
    c.time.mode === 'choose-nights' ? `${nightCount(asked.nights)} nights${halves}` : `${fmt(asked.hours, 1)} hours on ${nightCount(asked.nights)} nights`;
  const sentences = [
    `We request ${nightsAsked} between ${c.window.start} and ${c.window.end} with ${c.instrument.name} at ${c.site.name}, ` +
      `for ${asked.visits} radial-velocity visits of ${observed.length} stars: ${fmt(asked.hours, 1)} h in total, ` +
      `of which ${fmt(asked.exposureHours, 1)} h are exposure and ${fmt(asked.hours - asked.exposureHours, 1)} h readout and acquisition.` +
      (t.request ? needSentence(plan) : ''),
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
  return text + (t.request ? spareSentence(plan) : '');
}

/** What the request asks for: the requested visits (time from need), or every planned visit in plans without a request. */
function askedFor(plan: Plan): { nights: number; visits: number; hours: number; exposureHours: number } {
  const r = plan.totals.request;
  const visits = plan.visits.filter((v) => !v.kept && !(r && v.spare));
  return {
    nights: r ? r.nights : plan.totals.nights,
    visits: visits.length,
    hours: visits.reduce((sum, v) => sum + v.durationSec, 0) / 3600,
    exposureHours: visits.reduce((sum, v) => sum + v.exposureSec, 0) / 3600,
  };
}
