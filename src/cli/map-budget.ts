// How much work a `crest map` run may ask for: checked before any map is computed, so a range
// such as --periods 0.001:100000 is one clear line instead of a run without end.
import { inputError } from '../errors.js';
import { injectionGrid } from '../rv/injection.js';
import type { MapJob, MapSettings } from './map-targets.js';

/** Periodogram frequencies × trials a blind-search map may take (the default demo map takes about 3e7). */
export const MAX_SEARCH_WORK = 1e9;
/** Simulated trials a known-phase map may take (cells × trials per cell). */
export const MAX_KNOWN_PHASE_TRIALS = 2e7;

/**
 * Refuses (input error) a map whose work would exceed the bounds above. The blind-search bound
 * holds for each machine's share: the work over `searchParts` (the n of --shard i/n; a merge
 * computes no blind-search cell and passes Infinity).
 */
export function checkMapBudget(jobs: MapJob[], settings: MapSettings, searchParts = 1): void {
  const cells = settings.grid.periods * settings.grid.masses;
  for (const job of jobs) {
    if (job.kind === 'search') {
      const frequencies = injectionGrid(job.input).count;
      const work = frequencies * cells * settings.trialsPerCell;
      if (work / searchParts > MAX_SEARCH_WORK) {
        const periods = job.input.periodsDays;
        const value = settings.periods?.join(':') ?? `${periods[0]}:${periods[periods.length - 1]} (the plan's search range)`;
        throw inputError({
          file: 'command line',
          field: '--periods',
          value,
          allowed:
            `a map of at most ${MAX_SEARCH_WORK.toExponential(0)} frequency-trials (${job.targetId} needs ${frequencies} frequencies x ${cells} cells ` +
            `x ${settings.trialsPerCell} trials = ${work.toExponential(1)}); shorten --periods or lower --trials or --grid`,
        });
      }
    } else if (cells * settings.trialsPerCell > MAX_KNOWN_PHASE_TRIALS) {
      throw inputError({
        file: 'command line',
        field: '--trials',
        value: String(settings.trialsPerCell),
        allowed: `at most ${MAX_KNOWN_PHASE_TRIALS.toExponential(0)} trials in all (${cells} cells x ${settings.trialsPerCell}); lower --trials or --grid`,
      });
    }
  }
}
