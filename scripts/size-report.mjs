#!/usr/bin/env node
// Bytes per source file and per @stdlib package in a minified bundle of an import of exactdraw
// (esbuild metafile, bytesInOutput), with the gzip size of the whole, as test/build/size.test.ts
// measures it (esbuild, minified, ES2022, gzip level 9).
//   node scripts/size-report.mjs table|all|sub [src|dist] [rows]
// `dist` (default) bundles the build (npm run build first), as the size test does: the files are
// then dist/ chunks. `src` bundles src/index.ts with the build's @stdlib plugins, so that the bytes
// are attributed to source files (the total is within about 0.5% of the dist figure).
import { build } from 'esbuild';
import { gzipSync } from 'node:zlib';
import { resolve } from 'node:path';
import { stdlibEsm, stdlibGlue, stdlibLdexp, stdlibMainOnly, stdlibPure } from './esbuild-stdlib.mjs';
const cases = {
  table: "import { normalTarget, tableSampler } from 'exactdraw'; globalThis.r = tableSampler(normalTarget(0, 1), { seed: 1 }).sample();",
  all: "import * as all from 'exactdraw'; globalThis.r = all;",
  sub: "import { substream } from 'exactdraw'; globalThis.r = substream(1, 2)();",
};
const which = process.argv[2] ?? 'table';
const fromSrc = process.argv[3] === 'src';
const top = Number(process.argv[4] ?? 40);
const r = await build({
  stdin: { contents: cases[which], resolveDir: resolve('.'), loader: 'js' },
  bundle: true, minify: true, write: false, format: 'esm', platform: 'browser', target: 'es2022',
  legalComments: 'none', logLevel: 'silent', metafile: true, mainFields: ['main','module'],
  alias: { exactdraw: fromSrc ? resolve('src/index.ts') : resolve('dist/index.js') },
  plugins: fromSrc ? [stdlibLdexp, stdlibMainOnly, stdlibGlue, stdlibPure, stdlibEsm] : [],
});
const bytes = r.outputFiles[0].contents;
console.log(which, fromSrc ? 'src' : 'dist', 'min', bytes.length, 'gzip', gzipSync(bytes, { level: 9 }).length);
const out = Object.values(r.metafile.outputs)[0];
const rows = Object.entries(out.inputs).map(([f, i]) => [f.replace(/.*node_modules\//, ''), i.bytesInOutput]).filter(x=>x[1]>0).sort((a, b) => b[1] - a[1]);
const groups = {};
for (const [f, b] of rows) { const g = f.startsWith('@stdlib') ? '@stdlib/' + f.split('/')[1] : f.split('/').slice(0, 3).join('/'); groups[g] = (groups[g] ?? 0) + b; }
for (const [f, b] of rows.slice(0, top)) console.log(String(b).padStart(7), f);
console.log('--- groups');
for (const [g, b] of Object.entries(groups).sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(String(b).padStart(7), g);
