/**
 * The published build (dist/, made by `npm run build` before the tests run):
 * self-contained (no runtime dependency), no Node built-in in the library
 * core, both module formats usable and equal, licenses of bundled code shipped.
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import vm from 'node:vm';
import { build } from 'esbuild';

const DIST = resolve('dist');
const NODE_BUILTINS = ['assert', 'buffer', 'child_process', 'crypto', 'fs', 'module', 'os', 'path', 'process', 'stream', 'url', 'util', 'worker_threads', 'zlib'];

/** A seeded fast-path sampler from the build in this checkout (the reference for the installed copy). */
function tableSamplerFromDist(): import('../../src/index.js').Sampler {
  const require = createRequire(import.meta.url);
  const m = require(join(DIST, 'cjs/index.js')) as typeof import('../../src/index.js');
  return m.tableSampler(m.normalTarget(0, 1), { seed: 1 });
}

function files(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...files(p));
    else if (p.endsWith('.js')) out.push(p);
  }
  return out;
}

/** Module specifiers of static imports, dynamic imports and requires in a file. */
function specifiers(src: string): string[] {
  const out: string[] = [];
  // comments out (TSDoc examples mention imports); a `//` after ':' or a quote is kept (URLs in strings)
  const code = src.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"\\])\/\/.*$/gm, '$1');
  // `import … from 'x'` / `export … from 'x'`, `import 'x'`, `import('x')`, `require('x')`
  const re = /(?:\b(?:import|export)\b[^;'"()]*?\bfrom\s*|\bimport\s*\(\s*|\brequire\s*\(\s*|^\s*import\s+)(['"])([^'"\s]+)\1/gm;
  for (let m = re.exec(code); m !== null; m = re.exec(code)) out.push(m[2]);
  return out;
}

describe('published build', () => {
  it('package.json declares no runtime dependencies; no file in dist/ imports a package by name', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { dependencies?: Record<string, string> };
    expect(pkg.dependencies ?? {}).toEqual({});
    const bare: string[] = [];
    for (const f of files(DIST)) {
      for (const s of specifiers(readFileSync(f, 'utf8'))) {
        if (!s.startsWith('.') && !s.startsWith('node:') && !NODE_BUILTINS.includes(s)) bare.push(`${f}: ${s}`);
      }
    }
    expect(bare).toEqual([]);
  });

  it('the library core (dist/index.js and every file it imports, transitively) imports no Node built-in', () => {
    const found: string[] = [];
    const seen = new Set<string>();
    const visit = (file: string): void => {
      if (seen.has(file)) return;
      seen.add(file);
      for (const s of specifiers(readFileSync(file, 'utf8'))) {
        if (s.startsWith('node:') || NODE_BUILTINS.includes(s)) found.push(`${file.slice(DIST.length + 1)}: ${s}`);
        else if (s.startsWith('.')) visit(resolve(dirname(file), s));
      }
    };
    visit(join(DIST, 'index.js'));
    visit(join(DIST, 'cjs/index.js'));
    expect(seen.size).toBeGreaterThan(2); // the graph was followed (index.js imports its chunks)
    expect(found).toEqual([]);
    // twin: the same walk from the Node entry finds its built-ins
    const node: string[] = [];
    for (const s of specifiers(readFileSync(join(DIST, 'node/index.js'), 'utf8'))) if (s.startsWith('node:')) node.push(s);
    expect(node).toContain('node:worker_threads');
  });

  it('the specifier scan itself finds imports, requires and Node built-ins (twin of the two checks above)', () => {
    const sample = `import a from '@stdlib/x';\nconst b = require("path");\nconst c = await import('node:fs');\nimport './side.js';\nexport { d } from "./d.js";\nsetProp(Array, "from", function from(src) { return "x"; });\n/** import { y } from 'in-a-comment'; */\n// import z from 'also-a-comment';`;
    expect(specifiers(sample)).toEqual(['@stdlib/x', 'path', 'node:fs', './side.js', './d.js']);
  });

  it('the CommonJS build loads with require() and draws what the ESM build draws', async () => {
    const require = createRequire(import.meta.url);
    const cjs = require(join(DIST, 'cjs/index.js')) as typeof import('../../src/index.js');
    const esm = (await import(join(DIST, 'index.js'))) as typeof import('../../src/index.js');
    const a = cjs.tableSampler(cjs.gammaTarget(2.5), { seed: 3 }).fill(new Float64Array(1000));
    const b = esm.tableSampler(esm.gammaTarget(2.5), { seed: 3 }).fill(new Float64Array(1000));
    expect(Array.from(a)).toEqual(Array.from(b));
    // the bundled @stdlib functions are wired: cdfs and the MT19937 check value
    // (10,000th output for seed 5489 is 4123659995, ISO/IEC 14882:2011 [rand.predef])
    for (const m of [cjs, esm]) {
      expect(m.normalTarget(0, 1).cdf?.(1.96)).toBeCloseTo(0.9750021048517795, 12); // Φ(1.96), from memory (standard normal tables)
      const u = m.mersenneTwister(5489);
      let v = 0;
      for (let i = 0; i < 10_000; i++) v = u.uint32();
      expect(v).toBe(4123659995);
    }
    expect(() => cjs.tableSampler(cjs.normalTarget(0, 1), { strips: 1 })).toThrow(cjs.InvalidOptionError);
  });

  it('the core runs in a bare ECMAScript context (no process, Buffer, require, timers): bundled dist/index.js in node:vm draws what Node draws', async () => {
    // a stand-in for a browser or another runtime: only the language's own globals exist
    const r = await build({ entryPoints: [join(DIST, 'index.js')], bundle: true, format: 'iife', globalName: 'exactdraw', platform: 'neutral', write: false, logLevel: 'silent' });
    const ctx = vm.createContext({});
    vm.runInContext(r.outputFiles[0].text, ctx);
    const got = JSON.parse(
      vm.runInContext(
        `(() => {
          const e = exactdraw;
          const fast = Array.from(e.tableSampler(e.normalTarget(0, 1), { seed: 1 }).fill(new Float64Array(200)));
          const auto = Array.from(e.exactSampler(e.gammaTarget(2.5), { seed: 2 }).fill(new Float64Array(200)));
          const ks = e.ksCheck(new Float64Array(auto), e.gammaTarget(2.5).cdf).pValue;
          let typed = '';
          try { e.tableSampler(e.normalTarget(0, 1), { strips: 1 }); } catch (err) { typed = err instanceof e.InvalidOptionError ? err.code : 'other'; }
          return JSON.stringify({ fast, auto, ks, typed, globals: [typeof process, typeof Buffer, typeof require, typeof setTimeout] });
        })()`,
        ctx,
      ) as string,
    ) as { fast: number[]; auto: number[]; ks: number; typed: string; globals: string[] };
    expect(got.globals).toEqual(['undefined', 'undefined', 'undefined', 'undefined']);
    const esm = (await import(join(DIST, 'index.js'))) as typeof import('../../src/index.js');
    expect(got.fast).toEqual(Array.from(esm.tableSampler(esm.normalTarget(0, 1), { seed: 1 }).fill(new Float64Array(200))));
    expect(got.auto).toEqual(Array.from(esm.exactSampler(esm.gammaTarget(2.5), { seed: 2 }).fill(new Float64Array(200))));
    expect(got.ks).toBe(esm.ksCheck(new Float64Array(got.auto), esm.gammaTarget(2.5).cdf as (x: number) => number).pValue);
    expect(got.typed).toBe('INVALID_OPTION');
  });

  it('the packed package installs alone (no dependency to fetch) and works from a fresh project: ESM, CommonJS, exactdraw/node, the command', () => {
    const dir = mkdtempSync(join(tmpdir(), 'exactdraw-consumer-'));
    try {
      const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
      const out = execFileSync(npm, ['pack', '--silent', '--pack-destination', dir], { encoding: 'utf8' }).trim().split('\n').pop() as string;
      writeFileSync(join(dir, 'package.json'), JSON.stringify({ name: 'consumer', version: '1.0.0', private: true }));
      execFileSync(npm, ['install', '--offline', '--no-audit', '--no-fund', join(dir, out)], { cwd: dir, encoding: 'utf8' });
      expect(readdirSync(join(dir, 'node_modules')).filter((n) => !n.startsWith('.'))).toEqual(['exactdraw']);
      writeFileSync(
        join(dir, 'use.mjs'),
        `import { tableSampler, normalTarget } from 'exactdraw';\nimport { createParallelFiller } from 'exactdraw/node';\nconsole.log(typeof createParallelFiller, JSON.stringify(Array.from(tableSampler(normalTarget(0, 1), { seed: 1 }).fill(new Float64Array(3)))));\n`,
      );
      const esm = execFileSync(process.execPath, ['use.mjs'], { cwd: dir, encoding: 'utf8' }).trim();
      const expected = JSON.stringify(Array.from(tableSamplerFromDist().fill(new Float64Array(3))));
      expect(esm).toBe(`function ${expected}`);
      // the first MT19937 output for seed 5489 is 3499211612 (reference seed of the generator; from memory, and it is
      // consistent with the 10,000th-output check value 4123659995 tested elsewhere)
      const cjs = execFileSync(process.execPath, ['-e', "console.log(require('exactdraw').mersenneTwister(5489).uint32())"], { cwd: dir, encoding: 'utf8' }).trim();
      expect(cjs).toBe('3499211612');
      // one implementation behind import and require: the same classes, so instanceof holds both ways,
      // also for an error thrown by exactdraw/node
      writeFileSync(
        join(dir, 'same.mjs'),
        [
          "import { createRequire } from 'node:module';",
          "import { ExactDrawError, InvalidTargetError, mersenneTwister } from 'exactdraw';",
          "import { createParallelFiller } from 'exactdraw/node';",
          "const cjs = createRequire(import.meta.url)('exactdraw');",
          'const caught = (f) => { try { f(); } catch (e) { return e; } return null; };',
          'const a = caught(() => cjs.mersenneTwister(-1));',
          'const b = caught(() => mersenneTwister(-1));',
          'const c = await createParallelFiller(null).catch((e) => e);',
          'console.log(JSON.stringify([cjs.ExactDrawError === ExactDrawError, a instanceof InvalidTargetError, b instanceof cjs.InvalidTargetError, c instanceof cjs.ExactDrawError, c instanceof ExactDrawError, c?.code]));',
        ].join('\n'),
      );
      expect(execFileSync(process.execPath, ['same.mjs'], { cwd: dir, encoding: 'utf8' }).trim()).toBe('[true,true,true,true,true,"INVALID_TARGET"]');
      // exactdraw/node is ESM only: require() fails at run time, and the types say so (TypeScript, nodenext)
      expect(() => execFileSync(process.execPath, ['-e', "require('exactdraw/node')"], { cwd: dir, encoding: 'utf8', stdio: 'pipe' })).toThrow(/ERR_PACKAGE_PATH_NOT_EXPORTED/);
      writeFileSync(join(dir, 'tsconfig.json'), JSON.stringify({ compilerOptions: { module: 'nodenext', moduleResolution: 'nodenext', strict: true, noEmit: true, skipLibCheck: true, types: [] }, files: ['a.cts', 'b.mts'] }));
      writeFileSync(join(dir, 'a.cts'), "import node = require('exactdraw/node');\nimport core = require('exactdraw');\nexport const x = [typeof node, core.DEFAULT_SEED];\n");
      writeFileSync(join(dir, 'b.mts'), "import { fillParallel } from 'exactdraw/node';\nimport { DEFAULT_SEED } from 'exactdraw';\nexport const y = [typeof fillParallel, DEFAULT_SEED];\n");
      const tsc = createRequire(import.meta.url).resolve('typescript/bin/tsc');
      let tscOut = '';
      try {
        execFileSync(process.execPath, [tsc, '-p', dir], { cwd: dir, encoding: 'utf8', stdio: 'pipe' });
      } catch (e) {
        tscOut = String((e as { stdout?: string }).stdout);
      }
      // exactly one error: the require of exactdraw/node in the CommonJS file (not the ESM file, not the core)
      expect(tscOut.trim().split('\n').filter((l) => /error TS/.test(l))).toEqual([expect.stringMatching(/^a\.cts\(1,.*exactdraw\/node/)]);
      const cli = execFileSync(process.execPath, [join(dir, 'node_modules/exactdraw/dist/cli/main.js'), 'check', '--only', 'fast hull normal (own stream)', '--n', '2000'], { cwd: dir, encoding: 'utf8' });
      expect(cli).toContain('all checks passed');
      // the shipped example suite imports 'exactdraw' and runs from the installed package
      const ex = execFileSync(process.execPath, [join(dir, 'node_modules/exactdraw/dist/cli/main.js'), 'check', 'node_modules/exactdraw/examples/ci-suite.mjs', '--draws', '2000'], { cwd: dir, encoding: 'utf8' });
      expect(ex).toMatch(/all checks passed \(3 checked\)/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);

  it('dist/THIRD_PARTY_LICENSES.md lists the bundled packages with their license texts', () => {
    const md = readFileSync(join(DIST, 'THIRD_PARTY_LICENSES.md'), 'utf8');
    for (const name of ['@stdlib/stats-kstest', '@stdlib/stats-base-dists-gamma-cdf', '@stdlib/random-base-improved-ziggurat']) {
      expect(md).toContain(`- ${name}@`);
    }
    // the core's MT19937 is its own (the package is the test oracle; the command's peer generators still bundle it)
    expect(readFileSync(join(DIST, 'cjs/index.js'), 'utf8')).not.toContain('random-base-mt19937');
    expect(readFileSync(join(DIST, 'cli/main.js'), 'utf8')).toContain('random-base-mt19937'); // twin: the scan sees a bundled package
    expect(md).toContain('Apache License');
    // the NOTICE text of the @stdlib packages (Apache-2.0 section 4(d)), as shipped in node_modules/@stdlib/*/NOTICE
    expect(md).toContain('## NOTICE files');
    expect(md).toContain(readFileSync('node_modules/@stdlib/math-base-special-exp/NOTICE', 'utf8').trim());
  });
});
