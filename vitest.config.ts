import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 20000,
    hookTimeout: 60000,
    // the JSON report lets .ci/run print a plain "N passed, N failed" closing line
    reporters: ['default', 'json'],
    outputFile: { json: 'test-results/vitest.json' },
  },
});
