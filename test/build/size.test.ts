/**
 * Size budget of the published ESM build (dist/, made by `npm run build`
 * before the tests run), as a user's bundler sees it: esbuild bundles an
 * import of a few names from dist/index.js, minified, and the result is
 * gzipped. The goals of the project: `{ substream }` ≤ 8 KB,
 * `{ normalTarget, tableSampler }` ≤ 25 KB, everything ≤ 60 KB (KB = 1,000 bytes, gzip level 9).
 * The first was asserted, and the second until issue 17 (below). Everything measured 66.6 KB when this test was written and
 * 100.9 KB after the certified envelopes, formula targets, nine families, pole transforms and
 * discrete targets landed (the library's own code is 75.7 KB of it, the vendored @stdlib
 * numerics most of the rest; no @stdlib package is bundled twice), so that case asserts a
 * regression cap of 105 KB and prints how far it is from the goal.
 * Issue 17 (the standardised coordinate, `src/methods/transform/standardise.ts`, with the
 * maximiser it uses, and the gap search) added about 4 KB to the table path: 27.7 KB (was
 * 23.5 KB) and everything 105.7 KB, so the table case too asserts a regression cap (28 KB)
 * below which it prints how far it is from its 25 KB goal; everything is capped at 107 KB.
 * Issue 14 (size budget, measured 2026-12-03 with `npm run build && npx vitest run test/build/size.test.ts`;
 * per-file figures: `node scripts/size-report.mjs table|all|sub dist 40`): powers of two without the general pow
 * on the table path, the piecewise-table steps of the strip kernel in a module of their own, one MT19937 twist,
 * a DataView port of @stdlib ldexp given to @stdlib exp/pow/trig by the build, @stdlib functions without their
 * unused `factory`, pure top-level constants in the formula and discrete code: `{ substream }` 1.25 KB,
 * the table case 24.99 KB (was 28.1 KB: its goal is met and asserted), everything 107.9 KB (was 109.6 KB;
 * capped at 109 KB, still far from its 60 KB goal).
 * 2026-12-04 (second session): the two-uniform candidate and the one-pass MT19937 block generator
 * (twist and tempering in one loop, 20 % faster per uniform) brought the table case to 24,999 B (the goal
 * holds, with 1 B to spare, after trimming the block reader and two piece builders) and everything to
 * 109,028 B; the everything cap moved to 109.1 KB. The formula rewrite of logs of sums of exponentials
 * (src/formula/_internals/rewrite.ts, 1.3 KB minified) brought everything to 109,461 B: cap 109.5 KB.
 * One reader constructor for the five samplers that read blocks (`UniformBlock.of`) took the table case to
 * 24,986 B and everything to 109,400 B.
 */
import { describe, expect, it } from 'vitest';
import { resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'esbuild';

const ENTRY = resolve('dist/index.js');

/** Minified and gzipped bytes of a bundle that imports `code` (with `ENTRY` as the module 'exactdraw'). */
async function bundledSize(code: string): Promise<{ min: number; gzip: number }> {
  const r = await build({
    stdin: { contents: code, resolveDir: resolve('.'), loader: 'js' },
    bundle: true,
    minify: true,
    write: false,
    format: 'esm',
    platform: 'browser',
    target: 'es2022',
    legalComments: 'none',
    logLevel: 'silent',
    alias: { exactdraw: ENTRY },
  });
  const bytes = r.outputFiles[0].contents;
  return { min: bytes.length, gzip: gzipSync(bytes, { level: 9 }).length };
}

/** The minified text of a bundle that imports `code`. */
async function bundledText(code: string): Promise<string> {
  const r = await build({
    stdin: { contents: code, resolveDir: resolve('.'), loader: 'js' },
    bundle: true,
    minify: true,
    write: false,
    format: 'esm',
    platform: 'browser',
    target: 'es2022',
    logLevel: 'silent',
    alias: { exactdraw: ENTRY },
  });
  return r.outputFiles[0].text;
}

/** A constant of @stdlib/math-base-special-pow (CP = 2/(3·ln 2) in its log2 kernel, as the minifier prints it): present exactly when the general power function is bundled. */
const POW_MARK = '.9617966939259756';

/** [imported names, code, asserted budget, goal] */
const CASES: [string, string, number, number][] = [
  ['{ substream }', "import { substream } from 'exactdraw'; globalThis.r = substream(1, 2)();", 8_000, 8_000],
  ['{ normalTarget, tableSampler }', "import { normalTarget, tableSampler } from 'exactdraw'; globalThis.r = tableSampler(normalTarget(0, 1), { seed: 1 }).sample();", 25_000, 25_000], // the goal (24,986 B measured 2026-12-03, issue 14)
  ['everything', "import * as all from 'exactdraw'; globalThis.r = all;", 109_500, 60_000], // cap: regression guard (107,943 B measured 2026-12-03, issue 14; 109,028 B on 2026-12-04 with the one-pass block generator, 109,461 B with the formula rewrite of logs of sums)
];

describe('size budget of the ESM build (esbuild, minified, gzip)', () => {
  for (const [name, code, budget, goal] of CASES) {
    it(`import ${name} from 'exactdraw' bundles to at most ${budget / 1000} KB gzip${goal < budget ? ` (goal ${goal / 1000} KB)` : ''}`, async () => {
      const s = await bundledSize(code);
      const status = s.gzip <= goal ? 'goal met' : `goal ${goal} B NOT met by ${s.gzip - goal} B`;
      console.log(`size: import ${name}: ${s.min} B minified, ${s.gzip} B gzip (asserted <= ${budget} B; ${status})`);
      expect(s.gzip).toBeLessThanOrEqual(budget);
    });
  }

  it('regression guard: import { substream } stays under 1.4 KB gzip (1,252 B measured 2026-12-03; an impure top-level statement of the formula code once made it 4.4 KB)', async () => {
    const s = await bundledSize(CASES[0][1]);
    expect(s.gzip).toBeLessThanOrEqual(1_400);
  });

  it('twin: importing a name that reaches more code bundles larger (the measure sees what an import pulls in)', async () => {
    const small = await bundledSize(CASES[0][1]);
    const large = await bundledSize("import { substream, exactSampler, studentTTarget } from 'exactdraw'; globalThis.r = [substream, exactSampler, studentTTarget];");
    expect(large.gzip).toBeGreaterThan(small.gzip + 5_000);
  });

  it('regression guard: the table path bundles no general power function (its powers of two are the exact twoTo), with the twin that an import using pow does', async () => {
    expect((await bundledText(CASES[1][1])).includes(POW_MARK)).toBe(false);
    expect((await bundledText("import { betaTarget } from 'exactdraw'; globalThis.r = betaTarget(2, 3).cdf(0.5);")).includes(POW_MARK)).toBe(true);
  });
});
