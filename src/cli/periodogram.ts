import type { Command } from 'commander';
import { inputError } from '../errors.js';
import { extent } from '../extent.js';
import { readRvSeries, type RvSeries } from '../io/rv-series.js';
import { fmt, renderTable } from '../report/table.js';
import { baselineDays, DEFAULT_MAX_PERIOD_PER_BASELINE, DEFAULT_MIN_PERIOD_DAYS, DEFAULT_OVERSAMPLE } from '../rv/frequency-grid.js';
import { searchPeriodogram, type PeriodogramSearch } from '../rv/periodogram-search.js';
import { numberFlag, printJson } from './options.js';

/** Largest grid the command computes (frequencies); beyond it the search would take minutes. */
const MAX_FREQUENCIES = 1_000_000;

interface PeriodogramOptions {
  minPeriod?: number;
  maxPeriod?: number;
  oversample: number;
  top: number;
  json?: boolean;
}

/** Weighted rms about the weighted mean (weights 1/σ²), m/s. */
function weightedRmsMps(series: RvSeries): number {
  const w = series.rvErrorsMps.map((s) => 1 / (s * s));
  const sw = w.reduce((a, b) => a + b, 0);
  const mean = series.rvMps.reduce((a, v, i) => a + w[i]! * v, 0) / sw;
  return Math.sqrt(series.rvMps.reduce((a, v, i) => a + w[i]! * (v - mean) ** 2, 0) / sw);
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid]! : 0.5 * (s[mid - 1]! + s[mid]!);
}

/** A probability as a fraction, in exponent form below 0.001. */
function probabilityText(p: number): string {
  return p >= 0.001 ? p.toFixed(3) : p.toExponential(1);
}

function checkedRange(series: RvSeries, opts: PeriodogramOptions) {
  const baseline = baselineDays(series.timesBjdTdb);
  const minPeriodDays = opts.minPeriod ?? DEFAULT_MIN_PERIOD_DAYS;
  const maxPeriodDays = opts.maxPeriod ?? DEFAULT_MAX_PERIOD_PER_BASELINE * baseline;
  if (minPeriodDays >= maxPeriodDays) {
    if (opts.maxPeriod !== undefined) {
      throw inputError({
        file: 'command line',
        field: '--max-period',
        value: opts.maxPeriod,
        allowed: `longer than the shortest period searched, ${minPeriodDays} d`,
      });
    }
    throw inputError({
      file: 'command line',
      field: '--min-period',
      value: minPeriodDays,
      allowed: `shorter than the longest period searched, ${fmt(maxPeriodDays, 1)} d (twice the baseline; set --max-period to go further)`,
    });
  }
  const frequencies = (1 / minPeriodDays - 1 / maxPeriodDays) * baseline * opts.oversample;
  if (frequencies > MAX_FREQUENCIES) {
    throw inputError({
      file: 'command line',
      field: '--min-period',
      value: minPeriodDays,
      allowed: `a range of at most ${MAX_FREQUENCIES} frequencies (this asks for ${Math.round(frequencies)}); raise --min-period or lower --oversample`,
    });
  }
  return { minPeriodDays, maxPeriodDays };
}

function printText(series: RvSeries, search: PeriodogramSearch): void {
  const { grid } = search;
  const first = extent(series.timesBjdTdb).min;
  console.log(`RV series: ${series.file}`);
  console.log(
    `  ${series.timesBjdTdb.length} visits over ${fmt(grid.baselineDays, 1)} days (BJD_TDB ${fmt(first, 3)} to ${fmt(first + grid.baselineDays, 3)})`,
  );
  console.log(`  median sigma ${fmt(median(series.rvErrorsMps), 2)} m/s; weighted rms about the mean ${fmt(weightedRmsMps(series), 2)} m/s`);
  console.log(
    `Search: periods ${fmt(grid.minPeriodDays, 2)} to ${fmt(grid.maxPeriodDays, 1)} days, ${grid.count} frequencies, ` +
      `step 1/(T x ${grid.oversample}) = ${grid.stepPerDay.toPrecision(3)} per day`,
  );
  console.log(
    'Power with a false-alarm probability over the band (Baluev 2008): ' +
      search.levels.map((l) => `${probabilityText(l.fap)} at p = ${fmt(l.power, 3)}`).join(', '),
  );
  console.log('');
  const rows = search.peaks.map((p) => [
    String(p.rank),
    fmt(p.periodDays, 3),
    fmt(p.freqPerDay, 5),
    fmt(p.power, 3),
    fmt(p.amplitudeMps, 2),
    probabilityText(p.fapBaluev),
    probabilityText(p.fapIndependent),
  ]);
  console.log(
    renderTable(
      [
        { header: 'rank', align: 'right' },
        { header: 'period (d)', align: 'right' },
        { header: 'freq (1/d)', align: 'right' },
        { header: 'power', align: 'right' },
        { header: 'K fit (m/s)', align: 'right' },
        { header: 'FAP Baluev', align: 'right' },
        { header: 'FAP indep.', align: 'right' },
      ],
      rows,
    ),
  );
  console.log('\npower: generalised Lomb-Scargle, floating offset, weights 1/sigma^2, normalised to [0, 1].');
  console.log(`FAP indep.: 1 - (1 - (1 - p)^((N-3)/2))^M with M = band x baseline = ${Math.round(search.fap.bandPerDay * search.fap.baselineDays)}.`);
}

export function registerPeriodogram(program: Command): Command {
  return program
    .command('periodogram')
    .description('generalised Lomb-Scargle periodogram of an RV series (CSV: bjdTdb,rvMps,rvErrorMps) with false-alarm probabilities')
    .argument('<file>', 'CSV file with the header bjdTdb,rvMps,rvErrorMps (BJD_TDB days, m/s, m/s)')
    .option(
      '--min-period <days>',
      `shortest period searched (default ${DEFAULT_MIN_PERIOD_DAYS} d)`,
      numberFlag('--min-period', 'a period in days, more than 0.01 and at most 1e6', 0.01, 1e6, { exclusiveMin: true }),
    )
    .option(
      '--max-period <days>',
      `longest period searched (default ${DEFAULT_MAX_PERIOD_PER_BASELINE} x the baseline)`,
      numberFlag('--max-period', 'a period in days, more than 0.01 and at most 1e6', 0.01, 1e6, { exclusiveMin: true }),
    )
    .option('--oversample <k>', 'grid points per resolution element 1/T', numberFlag('--oversample', 'a number from 1 to 100', 1, 100), DEFAULT_OVERSAMPLE)
    .option('--top <n>', 'how many peaks to list', numberFlag('--top', 'a whole number from 1 to 100', 1, 100, { integer: true }), 5)
    .option('--json', 'print one JSON document')
    .action((file: string, opts: PeriodogramOptions) => {
      const series = readRvSeries(file);
      const range = checkedRange(series, opts);
      const search = searchPeriodogram(series.timesBjdTdb, series.rvMps, series.rvErrorsMps, { ...range, oversample: opts.oversample, top: opts.top });
      if (!opts.json) return printText(series, search);
      const { grid } = search;
      printJson({
        file,
        visits: series.timesBjdTdb.length,
        baselineDays: grid.baselineDays,
        firstBjdTdb: extent(series.timesBjdTdb).min,
        medianRvErrorMps: median(series.rvErrorsMps),
        weightedRmsMps: weightedRmsMps(series),
        grid: {
          minPeriodDays: grid.minPeriodDays,
          maxPeriodDays: grid.maxPeriodDays,
          oversample: grid.oversample,
          frequencies: grid.count,
          stepPerDay: grid.stepPerDay,
        },
        fapLevels: search.levels,
        peaks: search.peaks,
      });
    });
}
