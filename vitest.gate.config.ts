import { defineConfig } from 'vitest/config';

// The bench gate's stability test alone: timing-sensitive, so no other test file runs beside it.
// `npm test` runs it after the main suite (`npm run test:gate`).
export default defineConfig({
  test: {
    include: ['test/cli/bench-gate.test.ts'],
    testTimeout: 900_000,
    pool: 'forks',
    fileParallelism: false,
  },
});
