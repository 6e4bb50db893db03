import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // timing-sensitive and opt-in: run alone by `npm run test:gate` (vitest.gate.config.ts)
    exclude: ['test/cli/bench-gate.test.ts', '**/node_modules/**'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // prints one line when the browser test is skipped (no Chromium)
    globalSetup: ['test/browser/announce-skip.ts'],
  },
});
