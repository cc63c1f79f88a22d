import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // The JSON report feeds the plain summary line that .ci/run prints.
    reporters: ['default', 'json'],
    outputFile: { json: 'test-output/vitest.json' },
  },
});
