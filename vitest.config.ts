import { defineConfig } from 'vitest/config';

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
    // The demo plan is built once per run and shared (test/support/demo-plan.ts).
    globalSetup: ['test/support/demo-plan-setup.ts'],
    // The JSON report feeds the closing `N passed, N failed` line of .ci/run.
    reporters: ['default', ['json', { outputFile: 'test-output/vitest.json' }]],
  },
});
