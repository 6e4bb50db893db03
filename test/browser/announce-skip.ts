/**
 * vitest global setup: prints one line when the browser test will be
 * skipped, so that a run without Chromium says so instead of skipping silently.
 */
import { chromiumPath } from './chromium-path.js';

export default function announceSkip(): void {
  if (chromiumPath() === null) {
    process.stdout.write(
      'browser test SKIPPED (test/browser/chromium.test.ts): no Chromium (none at /usr/bin/chromium, or EXACTDRAW_CHROMIUM=off); enable it with `apt-get install -y chromium` (Debian) or EXACTDRAW_CHROMIUM=/path/to/chromium\n',
    );
  }
}
