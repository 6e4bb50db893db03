import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // prints one line when the browser test is skipped (no Chromium)
    globalSetup: ['test/browser/announce-skip.ts'],
  },
});
