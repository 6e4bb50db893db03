/** Where the browser test finds Chromium, and how it starts it. */
import { existsSync } from 'node:fs';

/** Flags for headless Chromium in the tests: no GPU, no sandbox (root in CI), no network of its own. */
export const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** EXACTDRAW_CHROMIUM if set (`off` skips the test), else Debian's /usr/bin/chromium if present, else null (the test is skipped). */
export function chromiumPath(): string | null {
  const env = process.env.EXACTDRAW_CHROMIUM;
  if (env === 'off') return null;
  if (env !== undefined && env !== '') return env;
  return existsSync('/usr/bin/chromium') ? '/usr/bin/chromium' : null;
}
