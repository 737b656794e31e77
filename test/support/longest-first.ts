// Test file order (vitest.config.ts `sequence.sequencer`): the files that take longest start first,
// so that the two workers finish together instead of one running a long file alone at the end.
// Vitest's own order sorts by the durations of the last run on this machine, and by file size
// where it has none (a fresh clone, as in CI): the five random-plans files are four lines each
// and would start last, though each builds ten plans. The seconds below are a whole run on the
// test machine's two cores (test-output/vitest.json, time before the first test included);
// files not listed keep vitest's order after them.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BaseSequencer, type TestSpecification } from 'vitest/node';

const EXPECTED_SEC: Record<string, number> = {
  'plan/need.test.ts': 30,
  'plan/random-plans-10.test.ts': 25,
  'schedule/optimise.test.ts': 23,
  'plan/replan.test.ts': 18,
  'schedule/planned-vs-random.test.ts': 17,
  'plan/random-plans-20.test.ts': 17,
  'plan/search-vs-random-campaigns.test.ts': 16,
  'plan/random-plans-40.test.ts': 14,
  'plan/random-plans-0.test.ts': 13,
  'fuzz/fuzz-flags.test.ts': 13,
  'library.test.ts': 10,
  'plan/random-plans-30.test.ts': 10,
  'rv/monte-carlo-k-eccentric.test.ts': 10,
  'fuzz/fuzz-targets.test.ts': 9,
  'fuzz/size.test.ts': 9,
  'schedule/exhaustive.test.ts': 9,
  'plan/ics-cli.test.ts': 8,
  'plan/nights-sweep.test.ts': 8,
  'readme/walkthrough.test.ts': 8,
  'cli/map-shard.test.ts': 7,
  'plan/caps-plan.test.ts': 7,
  'plan/search-vs-random-demo.test.ts': 7,
  'plan/warnings.test.ts': 7,
  'plan/ics-zone.test.ts': 6,
  'rv/monte-carlo-k-two-planets.test.ts': 6,
  'cli/map.test.ts': 6,
  'plan/rv-replan.test.ts': 5,
  'plan/several-a-night.test.ts': 5,
  'rv/monte-carlo-k-stale-phase.test.ts': 5,
  'report/night-chart.test.ts': 5,
  'plan/plan-cli.test.ts': 5,
  'sky/visibility-reference.test.ts': 5,
  'fuzz/fuzz-plan-json.test.ts': 5,
  'fuzz/fuzz-site.test.ts': 5,
};

const TEST_DIR = fileURLToPath(new URL('..', import.meta.url));
const expectedSec = (spec: TestSpecification) => EXPECTED_SEC[path.relative(TEST_DIR, spec.moduleId).split(path.sep).join('/')] ?? 0;

export default class LongestFirst extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    // Array.prototype.sort is stable: equal estimates keep vitest's order.
    return (await super.sort(files)).sort((a, b) => expectedSec(b) - expectedSec(a));
  }
}
