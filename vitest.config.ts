import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // The JSON report feeds the closing `N passed, N failed` line of .ci/run.
    reporters: ['default', ['json', { outputFile: 'test-output/vitest.json' }]],
  },
});
