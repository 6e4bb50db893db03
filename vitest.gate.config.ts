import { defineConfig } from 'vitest/config';

// The bench gate's stability test alone: timing-sensitive, so no other test file runs beside it.
// Opt-in (`npm run test:gate`): the gate's stability and sensitivity need a quiet machine (measured
// figures in the file's header).
export default defineConfig({
  test: {
    include: ['test/cli/bench-gate.test.ts'],
    testTimeout: 900_000,
    pool: 'forks',
    fileParallelism: false,
  },
});
