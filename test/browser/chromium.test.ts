/**
 * Two engines agree: the golden scenarios (test/browser/golden.ts: every
 * method, the targets, streams, checks and typed errors) run in headless
 * Chromium on the bundled ESM build (dist/index.js, bundled by esbuild) and
 * in Node on the source tree, and must give the same float64 words and the
 * same error names, codes and messages. Also runs the Web Worker example
 * (examples/browser-worker/) and checks its parallel fill against
 * partitionedFill, in the browser and in Node.
 *
 * Needs Debian's chromium (`apt-get install -y chromium`; .ci/run installs
 * it) or EXACTDRAW_CHROMIUM=/path/to/chromium; without it the test is skipped
 * and test/browser/announce-skip.ts prints one line saying so.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createServer } from 'node:http';
import type { Server } from 'node:http';
import { mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { extname, join, resolve, sep } from 'node:path';
import type { AddressInfo } from 'node:net';
import { build } from 'esbuild';
import type { BrowserContext, Page } from 'playwright-core';
import * as lib from '../../src/index.js';
import { goldenRun } from './golden.js';
import type { GoldenResult } from './golden.js';
import { chromiumPath, CHROMIUM_FLAGS } from './chromium-path.js';

const ROOT = resolve('.');
const CHROMIUM = chromiumPath();

/** Scenario names whose output differs between two golden results, with the number of differing words or the two strings. */
function differences(a: GoldenResult, b: GoldenResult): string[] {
  const out: string[] = [];
  for (const k of new Set([...Object.keys(a.values), ...Object.keys(b.values)])) {
    const x = a.values[k];
    const y = b.values[k];
    if (x === undefined || y === undefined) out.push(`${k}: only in ${x === undefined ? 'second' : 'first'}`);
    else if (x.length !== y.length) out.push(`${k}: ${x.length / 2} vs ${y.length / 2} values`);
    else {
      let n = 0;
      for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) n++;
      if (n > 0) out.push(`${k}: ${n} of ${x.length} words differ`);
    }
  }
  for (const k of new Set([...Object.keys(a.strings), ...Object.keys(b.strings)])) {
    if (a.strings[k] !== b.strings[k]) out.push(`${k}: ${String(a.strings[k]).slice(0, 200)} vs ${String(b.strings[k]).slice(0, 200)}`);
  }
  return out;
}

const MIME: Record<string, string> = { '.js': 'text/javascript', '.html': 'text/html', '.json': 'application/json' };

/** A static server for dist/ and examples/ of this checkout on 127.0.0.1 (and an empty page at /). */
function serve(): Promise<Server> {
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    if (path === '/') {
      res.writeHead(200, { 'content-type': 'text/html' }).end('<!doctype html><title>exactdraw golden</title>');
      return;
    }
    const file = resolve(ROOT, '.' + path);
    const allowed = [join(ROOT, 'dist') + sep, join(ROOT, 'examples') + sep].some((p) => file.startsWith(p));
    try {
      if (!allowed || !statSync(file).isFile()) throw new Error('not found');
      res.writeHead(200, { 'content-type': MIME[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
    } catch {
      res.writeHead(404).end('not found');
    }
  });
  return new Promise((ok) => server.listen(0, '127.0.0.1', () => ok(server)));
}

describe.skipIf(CHROMIUM === null)('Chromium and Node agree', () => {
  let server: Server;
  let base: string;
  let context: BrowserContext;
  let page: Page;
  let profile: string;

  beforeAll(async () => {
    server = await serve();
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    profile = mkdtempSync(join(tmpdir(), 'exactdraw-chromium-'));
    const { chromium } = await import('playwright-core');
    // a fresh profile directory (the --user-data-dir of the flags) for every run
    context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM as string, headless: true, args: CHROMIUM_FLAGS });
    page = await context.newPage();
    await page.goto(`${base}/`);
  });

  afterAll(async () => {
    await context?.close();
    await new Promise((ok) => (server ? server.close(ok) : ok(undefined)));
    if (profile) rmSync(profile, { recursive: true, force: true });
  });

  it('goldenRun gives the same float64 words and the same errors in Chromium (bundled dist/index.js) as in Node (source)', async () => {
    const bundle = await build({
      stdin: {
        contents: `import * as lib from ${JSON.stringify(join(ROOT, 'dist/index.js'))};\nimport { goldenRun } from ${JSON.stringify(join(ROOT, 'test/browser/golden.ts'))};\nglobalThis.__golden = goldenRun(lib);\n`,
        resolveDir: ROOT,
        loader: 'ts',
      },
      bundle: true,
      write: false,
      format: 'iife',
      platform: 'browser',
      target: 'es2022',
      logLevel: 'silent',
    });
    await page.addScriptTag({ content: bundle.outputFiles[0].text });
    const inBrowser = (await page.evaluate('globalThis.__golden')) as GoldenResult;
    const inNode = goldenRun(lib);
    const engine = await page.evaluate('navigator.userAgent');
    console.log(`browser test: ${String(engine)}; ${Object.keys(inNode.values).length} value scenarios, ${Object.keys(inNode.strings).length} string scenarios`);
    expect(Object.keys(inNode.values).length).toBeGreaterThan(50);
    expect(differences(inBrowser, inNode)).toEqual([]);
  });

  it('the Web Worker example fills in four workers what partitionedFill gives in one thread, and what Node gives', async () => {
    await page.goto(`${base}/examples/browser-worker/index.html`);
    const r = (await page.evaluate(
      'globalThis.exampleResult.then((r) => ({ differ: r.differ, words: Array.from(new Uint32Array(r.parallel.buffer)) }))',
    )) as { differ: number; words: number[] };
    expect(r.differ).toBe(0);
    const sampler = (await import(join(ROOT, 'examples/browser-worker/sampler.js'))) as { createSampler: (own: lib.OwnedStream) => lib.Sampler };
    const node = lib.partitionedFill((u, own) => sampler.createSampler(own), new Float64Array(100_000), 4, 2026);
    const nodeWords = new Uint32Array(node.buffer);
    let differ = 0;
    for (let i = 0; i < nodeWords.length; i++) if (nodeWords[i] !== r.words[i]) differ++;
    expect(r.words.length).toBe(200_000);
    expect(differ).toBe(0);
    expect(await page.textContent('#status')).toContain('0 differ from partitionedFill');
  });
});

describe('engine comparison', () => {
  it('twin: the comparison reports a one-ulp change in one draw and a changed error message', () => {
    const a = goldenRun(lib);
    const b: GoldenResult = { values: { ...a.values }, strings: { ...a.strings } };
    const k = 'table normal';
    b.values[k] = [...a.values[k]];
    b.values[k][10] ^= 1; // the low word of value 5: one ulp
    b.strings['error: seed -1'] = a.strings['error: seed -1'].replace('got -1', 'got -2');
    expect(differences(a, b)).toEqual([`${k}: 1 of ${a.values[k].length} words differ`, expect.stringContaining('error: seed -1')]);
  });
});
