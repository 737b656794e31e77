import path from 'node:path';
import { availableParallelism } from 'node:os';
import type { Command } from 'commander';
import { inputError } from '../errors.js';
import { extent } from '../extent.js';
import { readPlan } from '../io/plan-json.js';
import { slug } from '../io/slug.js';
import { checkOutFolder } from '../io/out-folder.js';
import { writeOutputSet } from '../io/output-set.js';
import { detectionMapFigure, type DetectionMapData } from '../report/html/chart-detection-map.js';
import { renderSvg } from '../report/html/vega-svg.js';
import { toCsv } from '../report/csv.js';
import { fmt, percent } from '../report/table.js';
import { DEFAULT_FAP_THRESHOLD, rowsOfCells } from '../rv/injection.js';
import { levelRows, type LevelRow } from '../rv/injection-map.js';
import { injectionRecoveryParallel } from '../rv/injection-worker-pool.js';
import { knownPhaseMapAnalytic, knownPhaseMapSimulated } from '../rv/known-phase-map.js';
import { mapShardFile, mapShardText } from '../io/map-shard-file.js';
import { checkMapBudget } from './map-budget.js';
import { computeShard, mergeShards, requestText, type ShardSpec, shardFlag, shardOf } from './map-shard.js';
import { mapDataFile, reportWithMaps } from './map-report.js';
import { mapJobs, type MapJob, type MapSettings } from './map-targets.js';
import { levelTableText, mapTableText } from './map-text.js';
import { stderrProgress, type Progress } from './progress.js';
import { numberFlag, printJson } from './options.js';

interface MapFlags {
  plan: string;
  target?: string;
  periods?: [number, number];
  masses?: [number, number];
  grid?: { periods: number; masses: number };
  trials: number;
  fap: number;
  eccMax?: number;
  threads?: number;
  seed?: number;
  out?: string;
  json?: boolean;
  csv?: boolean;
  shard?: ShardSpec;
  merge?: boolean;
  quiet?: boolean;
}

/** `A:B` with 0 < A < B ≤ max, as a flag parser. */
function rangeFlag(flag: string, unit: string, max: number) {
  const allowed = `two ${unit} A:B with 0 < A < B <= ${max}`;
  const one = numberFlag(flag, allowed, 0, max, { exclusiveMin: true });
  return (text: string): [number, number] => {
    const parts = text.split(':');
    if (parts.length !== 2) throw inputError({ file: 'command line', field: flag, value: text, allowed });
    const [a, b] = [one(parts[0]!), one(parts[1]!)];
    if (!(a < b)) throw inputError({ file: 'command line', field: flag, value: text, allowed });
    return [a, b];
  };
}

const MAX_AXIS = 200;
const DEFAULT_GRID = { periods: 12, masses: 10 };
function gridFlag(text: string): { periods: number; masses: number } {
  const allowed = `NxM: N periods by M masses, each a whole number from 2 to ${MAX_AXIS}`;
  const m = /^(\d+)x(\d+)$/i.exec(text.trim());
  const [n, k] = m ? [Number(m[1]), Number(m[2])] : [0, 0];
  if (!(n >= 2 && n <= MAX_AXIS && k >= 2 && k <= MAX_AXIS)) throw inputError({ file: 'command line', field: '--grid', value: text, allowed });
  return { periods: n, masses: k };
}

/** One computed map: the data of its chart, and the level rows of its first panel. */
interface MapResult {
  job: MapJob;
  chart: DetectionMapData;
  levels: LevelRow[];
  /** Ephemeris targets: the two maps at the ephemeris period itself, and the largest cell difference. */
  atEphemeris?: { periodDays: number; analytic: LevelRow; simulated: LevelRow; planet?: { analytic: number; simulated: number } };
  maxDifference?: number;
  svg: string;
}

/** Where a blind search's detection probabilities come from: computed here, or the merged parts' (flat, cell order). */
type SearchSource = { threads: number; progress: Progress } | { merged: number[] };

async function searchDetection(job: MapJob & { kind: 'search' }, source: SearchSource): Promise<number[][]> {
  if ('merged' in source) return rowsOfCells(source.merged, job.input.periodsDays.length, job.input.msinisEarth.length);
  const { threads, progress } = source;
  const map = await injectionRecoveryParallel(job.input, { threads, onProgress: (done, total) => progress.update(job.targetId, done, total) });
  progress.end();
  return map.detection;
}

async function runJob(job: MapJob, settings: MapSettings, source: SearchSource): Promise<Omit<MapResult, 'svg'>> {
  const { periodsDays, msinisEarth } = job.input;
  if (job.kind === 'search') {
    const detection = await searchDetection(job, source);
    const method =
      `Injection–recovery: ${settings.trialsPerCell} trials a cell at the ${job.visits} planned visits (σ_eff with jitter), random phase, ` +
      `${settings.eccMax ? `e uniform in [0, ${settings.eccMax}]` : 'circular orbits'}; ` +
      `detected when the highest GLS peak lies within 1/T of the injected frequency with Baluev FAP < ${settings.fapThreshold}.`;
    const chart: DetectionMapData = {
      targetId: job.targetId,
      method,
      periodsDays,
      msinisEarth,
      panels: [{ label: 'simulated', detection }],
      markMsiniEarth: job.searchMsiniEarth,
    };
    return { job, chart, levels: levelRows(periodsDays, msinisEarth, detection) };
  }
  const simulatedInput = { ...job.input, trialsPerCell: settings.trialsPerCell, seed: settings.seed };
  const analytic = knownPhaseMapAnalytic(job.input);
  const simulated = knownPhaseMapSimulated(simulatedInput);
  const at = { periodsDays: [job.ephemeris.periodDays] };
  const atAnalytic = knownPhaseMapAnalytic({ ...job.input, ...at });
  const atSimulated = knownPhaseMapSimulated({ ...simulatedInput, ...at });
  const planetMass = job.planetMsiniEarth === undefined ? undefined : { ...at, msinisEarth: [job.planetMsiniEarth] };
  const planet = planetMass && {
    analytic: knownPhaseMapAnalytic({ ...job.input, ...planetMass }).detection[0]![0]!,
    simulated: knownPhaseMapSimulated({ ...simulatedInput, ...planetMass }).detection[0]![0]!,
  };
  const maxDifference = extent(analytic.detection.flatMap((row, i) => row.map((p, j) => Math.abs(p - simulated.detection[i]![j]!)))).max;
  const method =
    `Known phase from the ephemeris (Tc fixed; rows other than P = ${fmt(job.ephemeris.periodDays, 4)} d ask "had the period been P"), ` +
    `${job.visits} planned visits, circular orbits; detected when K̂/σ_K > ${job.input.goalSignificance}. ` +
    `Left: Φ(K/σ_K − n) with the scheduler's expected information; right: ${settings.trialsPerCell} simulated least-squares fits a cell.`;
  const chart: DetectionMapData = {
    targetId: job.targetId,
    method,
    periodsDays,
    msinisEarth,
    panels: [
      { label: 'analytic', detection: analytic.detection },
      { label: 'simulated', detection: simulated.detection },
    ],
    markMsiniEarth: job.planetMsiniEarth,
  };
  return {
    job,
    chart,
    maxDifference,
    levels: levelRows(periodsDays, msinisEarth, analytic.detection),
    atEphemeris: {
      periodDays: job.ephemeris.periodDays,
      analytic: levelRows(at.periodsDays, msinisEarth, atAnalytic.detection)[0]!,
      simulated: levelRows(at.periodsDays, msinisEarth, atSimulated.detection)[0]!,
      planet,
    },
  };
}

function printText(results: MapResult[], skipped: string[], written: string[], full: boolean): void {
  for (const r of results) {
    const { job, chart } = r;
    const head = `${job.targetId}: ${job.visits} visits over ${fmt(job.baselineDays, 1)} d, star ${fmt(job.starMassSun, 2)} M☉`;
    if (job.kind === 'search') {
      console.log(`${head}; blind search, detection probability (%)`);
      console.log(mapTableText(chart.periodsDays, chart.msinisEarth, chart.panels[0]!.detection));
      console.log(`\nm sin i detected in 50% and 90% of trials (interpolated in log mass)`);
      console.log(levelTableText(chart.periodsDays, chart.msinisEarth, chart.panels));
    } else if (full) {
      console.log(`${head}; known phase, P = ${fmt(job.ephemeris.periodDays, 4)} d, detection probability (%)`);
      for (const panel of chart.panels) console.log(`\n${panel.label}\n${mapTableText(chart.periodsDays, chart.msinisEarth, panel.detection)}`);
      console.log(`\nm sin i detected in 50% and 90% of cases; largest analytic - simulated difference ${percent(r.maxDifference!)}`);
      console.log(levelTableText(chart.periodsDays, chart.msinisEarth, chart.panels));
    }
    if (job.kind === 'search' || full) console.log('');
  }
  const known = results.filter((r) => r.job.kind === 'ephemeris');
  if (known.length && !full) {
    console.log('Known-phase targets at their ephemeris period: m sin i detected in 50% / 90% of cases (analytic | simulated)');
    for (const r of known) {
      const a = r.atEphemeris!;
      const pair = (row: LevelRow) => row.levels.map((l) => (l.mass.where === 'inside' ? fmt(l.mass.msiniEarth, 1) : l.mass.where)).join(' / ');
      const planet =
        r.job.kind === 'ephemeris' && a.planet
          ? `; planet ${fmt(r.job.planetMsiniEarth, 1)} M⊕ detected ${percent(a.planet.analytic)} | ${percent(a.planet.simulated)}`
          : '';
      console.log(
        `  ${r.job.targetId.padEnd(9)} P = ${fmt(a.periodDays, 3).padStart(6)} d: ${pair(a.analytic)} | ${pair(a.simulated)} M⊕${planet}; ` +
          `map cells differ by ${percent(r.maxDifference!)} at most`,
      );
    }
    console.log('');
  }
  if (skipped.length) console.log(`Skipped (fewer than 4 planned visits): ${skipped.join(', ')}`);
  console.log(`Wrote ${written.join(', ')}`);
}

function csvText(results: MapResult[]): string {
  const rows = results.flatMap(({ job, chart }) =>
    chart.panels.flatMap((panel) =>
      chart.periodsDays.flatMap((p, i) => chart.msinisEarth.map((m, j) => [job.targetId, job.kind, panel.label, p, m, panel.detection[i]![j]!])),
    ),
  );
  return toCsv(['target', 'kind', 'method', 'periodDays', 'msiniEarth', 'detectionProbability'], rows);
}

const jsonLevels = (levels: LevelRow[]) =>
  levels.map((r) => ({ periodDays: r.periodDays, ...Object.fromEntries(r.levels.map((l) => [`mass${Math.round(l.level * 100)}`, l.mass])) }));

async function runMap(opts: MapFlags): Promise<void> {
  const plan = readPlan(opts.plan);
  const settings: MapSettings = {
    periods: opts.periods,
    masses: opts.masses,
    grid: opts.grid ?? DEFAULT_GRID,
    trialsPerCell: opts.trials,
    fapThreshold: opts.fap,
    seed: opts.seed ?? plan.campaign.seed,
    eccMax: opts.eccMax,
  };
  const { jobs, skipped } = mapJobs(plan, settings, opts.target);
  checkMapBudget(jobs, settings, opts.merge ? Number.POSITIVE_INFINITY : (opts.shard?.count ?? 1));
  const outDir = opts.out ?? path.dirname(opts.plan);
  const request = requestText(opts.target, settings);
  // The core count is read here, at the edge; the pool takes at most one thread per cell.
  const threads = opts.threads ?? availableParallelism();
  if (opts.shard) return runShard(opts, opts.shard, jobs, request, outDir, threads);
  const merged = opts.merge ? mergeShards(outDir, opts.plan, request, jobs) : undefined;
  const svgName = (targetId: string) => `map-${slug(targetId)}.svg`;
  const names = jobs.flatMap((j) => (j.kind === 'search' ? [svgName(j.targetId), mapDataFile(j.targetId)] : [svgName(j.targetId)]));
  checkOutFolder(outDir, [...names, 'report.html'], [opts.plan]);
  const progress = stderrProgress({ quiet: opts.quiet });
  const results: MapResult[] = [];
  for (const [k, job] of jobs.entries()) {
    const result = await runJob(job, settings, merged ? { merged: merged.get(k) ?? [] } : { threads, progress });
    results.push({ ...result, svg: svgName(job.targetId) });
  }
  const files: Record<string, string> = {};
  for (const r of results) {
    const figure = detectionMapFigure(r.chart);
    files[r.svg] = await renderSvg({ ...figure.spec, title: figure.title } as typeof figure.spec);
  }
  const searchMaps = results.filter((r) => r.job.kind === 'search').map((r) => r.chart);
  for (const map of searchMaps) files[mapDataFile(map.targetId)] = `${JSON.stringify(map)}\n`;
  const report = await reportWithMaps(plan, outDir, searchMaps);
  if (report !== undefined) files['report.html'] = report;
  const written = writeOutputSet(outDir, files, [opts.plan]);
  if (opts.csv) return void process.stdout.write(csvText(results));
  if (!opts.json) return printText(results, skipped, written, opts.target !== undefined);
  printJson({
    plan: opts.plan,
    seed: settings.seed,
    trialsPerCell: settings.trialsPerCell,
    fapThreshold: settings.fapThreshold,
    eccMax: settings.eccMax ?? 0,
    skipped,
    written,
    targets: results.map((r) => ({
      targetId: r.job.targetId,
      kind: r.job.kind,
      visits: r.job.visits,
      baselineDays: r.job.baselineDays,
      starMassSun: r.job.starMassSun,
      periodsDays: r.chart.periodsDays,
      msinisEarth: r.chart.msinisEarth,
      ...Object.fromEntries(r.chart.panels.map((p) => [p.label, p.detection])),
      levels: jsonLevels(r.levels),
      ...(r.job.kind === 'ephemeris'
        ? {
            ephemerisPeriodDays: r.job.ephemeris.periodDays,
            goalSignificance: r.job.input.goalSignificance,
            planetMsiniEarth: r.job.planetMsiniEarth,
            maxDifference: r.maxDifference,
            atEphemerisPeriod: {
              analytic: jsonLevels([r.atEphemeris!.analytic])[0],
              simulated: jsonLevels([r.atEphemeris!.simulated])[0],
              planetDetection: r.atEphemeris!.planet,
            },
          }
        : { searchMsiniEarth: r.job.searchMsiniEarth }),
      svg: path.join(outDir, r.svg),
    })),
  });
}

/** `--shard i/n`: computes this part's blind-search cells and writes them as one part file. */
async function runShard(opts: MapFlags, shard: ShardSpec, jobs: MapJob[], request: string, outDir: string, threads: number): Promise<void> {
  for (const flag of ['json', 'csv', 'merge'] as const) {
    if (opts[flag])
      throw inputError({ file: 'command line', field: `--${flag}`, value: true, allowed: 'not with --shard: a part prints no maps; give it to --merge' });
  }
  const name = mapShardFile(shard.index, shard.count);
  checkOutFolder(outDir, [name], [opts.plan]);
  const cells = await computeShard(jobs, shard, threads, stderrProgress({ quiet: opts.quiet }));
  const written = writeOutputSet(outDir, { [name]: mapShardText(shardOf(opts.plan, request, shard, cells)) }, [opts.plan]);
  const searches = jobs.filter((j) => j.kind === 'search').length;
  console.log(
    `Part ${shard.index} of ${shard.count} (counting from 0): ${cells.length} blind-search cells of ${searches} targets; known-phase maps are made by --merge.`,
  );
  console.log(`Wrote ${written.join(', ')}; when every part is written, run the same command with --merge instead of --shard.`);
}

export function registerMap(program: Command): Command {
  return program
    .command('map')
    .description(
      'detection probability per (period, m sin i) cell for the targets of a plan: ' +
        'injection-recovery for blind searches, known phase for ephemeris targets; tables and SVG heatmaps',
    )
    .requiredOption('--plan <file>', 'plan.json written by crest plan')
    .option('--target <id>', 'one target (default: every blind-search and ephemeris target with at least 4 visits)')
    .option('--periods <A:B>', "period range in days (default: the search's range; ephemeris targets P/2:2P)", rangeFlag('--periods', 'periods in days', 1e5))
    .option(
      '--masses <A:B>',
      "m sin i range in Earth masses (default: half to eight times the search mass; a quarter to four times an ephemeris planet's)",
      rangeFlag('--masses', 'masses in Earth masses', 1e5),
    )
    .option('--grid <NxM>', `N periods by M masses, log-spaced (default: ${DEFAULT_GRID.periods}x${DEFAULT_GRID.masses})`, gridFlag)
    .option('--trials <n>', 'simulated trials per cell', numberFlag('--trials', 'a whole number from 10 to 100000', 10, 100000, { integer: true }), 200)
    .option(
      '--fap <p>',
      'false-alarm probability a blind detection must beat',
      numberFlag('--fap', 'a probability above 0 and at most 0.5', 0, 0.5, { exclusiveMin: true }),
      DEFAULT_FAP_THRESHOLD,
    )
    .option(
      '--ecc-max <e>',
      'blind searches: inject eccentric orbits, e uniform in [0, e] with random ω (default: circular)',
      numberFlag('--ecc-max', 'an eccentricity from 0 to 0.9', 0, 0.9),
    )
    .option(
      '--threads <n>',
      'worker threads (default: available cores, at most one per cell)',
      numberFlag('--threads', 'a whole number from 1 to 256', 1, 256, { integer: true }),
    )
    .option(
      '--seed <n>',
      "random seed (default: the campaign's seed)",
      numberFlag('--seed', 'a whole number, 0 or more', 0, Number.MAX_SAFE_INTEGER, { integer: true }),
    )
    .option(
      '--out <dir>',
      "folder for the SVG maps and map-<target>.json (default: the plan's folder); a report.html there is re-rendered with the blind-search maps",
    )
    .option('--json', 'print one JSON document')
    .option('--csv', 'print CSV, one row per cell and method')
    .option('--shard <i/n>', 'compute part i (from 0) of n of the blind-search cells into map-shard-<i>-of-<n>.json in the --out folder', shardFlag)
    .option('--merge', 'join the parts in the --out folder and write what one run writes (same flags as the parts)')
    .option('--quiet', 'no progress bar on stderr (it is shown only on a terminal)')
    .action(runMap);
}
