import { defineConfig } from 'vitest/config';
import LongestFirst from './test/support/longest-first.js';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // Two workers for the two cores (vitest's default leaves one core idle).
    maxWorkers: 2,
    // Test files share their worker's module cache instead of importing src/ and dist/ afresh
    // each (the default forks pool stays: runCliInProcess changes the working folder, which
    // worker threads cannot). No test file may leave global state changed (process.env, cwd,
    // console, stdout) or mock modules.
    isolate: false,
    // The demo plan is built once per run and shared (test/support/demo-plan.ts), and so are the
    // plans that several test files build (test/support/plan-cache.ts).
    globalSetup: ['test/support/demo-plan-setup.ts', 'test/support/plan-cache-setup.ts'],
    // Long files first (test/support/longest-first.ts).
    sequence: { sequencer: LongestFirst },
    // The JSON report feeds the closing `N passed, N failed` line of .ci/run.
    reporters: ['default', ['json', { outputFile: 'test-output/vitest.json' }]],
  },
});
