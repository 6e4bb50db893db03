// Builds the published files:
//   dist/        ESM bundles of the entries (exactdraw, exactdraw/node, the worker of
//                fillParallel, the exactdraw command) with shared chunks in dist/chunks/,
//                and the .d.ts of every module (tsc);
//   dist/cjs/    a CommonJS bundle of the library core (dist/cjs/index.js) and its .d.ts.
// The @stdlib functions the library uses are bundled in (src/vendor/), so the package
// has no runtime dependencies; their licenses go to dist/THIRD_PARTY_LICENSES.md.
// Why bundles: importing the core as separate modules loaded ~900 files (170-220 ms);
// bundled it is a few files (about 35 ms measured; see DEVELOPERS.md).
// The CommonJS core is built for a neutral platform, so a Node built-in reached from
// the core (directly or through a dependency) fails the build.
import { execFileSync } from 'node:child_process';
import { chmodSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { build } from 'esbuild';

const require = createRequire(import.meta.url);
const tsc = require.resolve('typescript/bin/tsc');
rmSync('dist', { recursive: true, force: true });
// declarations (and the typecheck of everything, Node parts included)
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.node.json', '--emitDeclarationOnly'], { stdio: 'inherit' });
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.cjs.json', '--emitDeclarationOnly'], { stdio: 'inherit' });

const common = { bundle: true, target: 'es2022', mainFields: ['main', 'module'], legalComments: 'none', metafile: true, logLevel: 'warning' };
const esm = await build({
  ...common,
  entryPoints: {
    index: 'src/index.ts',
    'node/index': 'src/node/index.ts',
    'node/fill-worker': 'src/node/fill-worker.ts',
    'cli/main': 'src/cli/main.ts',
  },
  outdir: 'dist',
  format: 'esm',
  platform: 'node',
  splitting: true,
  chunkNames: 'chunks/[name]-[hash]',
});
const cjs = await build({ ...common, entryPoints: ['src/index.ts'], outfile: 'dist/cjs/index.js', format: 'cjs', platform: 'neutral' });
writeFileSync('dist/cjs/package.json', JSON.stringify({ type: 'commonjs' }, null, 2) + '\n');
chmodSync('dist/cli/main.js', 0o755);

// licenses of the bundled packages, one copy of each distinct license text
const inputs = new Set([...Object.keys(esm.metafile.inputs), ...Object.keys(cjs.metafile.inputs)]);
const packages = new Map();
for (const file of inputs) {
  const m = /node_modules\/(@[^/]+\/[^/]+|[^@/][^/]*)\//.exec(file);
  if (m === null || packages.has(m[1])) continue;
  const dir = file.slice(0, m.index + m[0].length - 1);
  const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8'));
  const licFile = ['LICENSE', 'LICENSE.md', 'LICENSE.txt', 'NOTICE'].map((f) => join(dir, f)).find((f) => existsSync(f));
  packages.set(m[1], { name: m[1], version: pkg.version, license: pkg.license ?? 'see text', text: licFile ? readFileSync(licFile, 'utf8').trim() : null });
}
const list = [...packages.values()].sort((a, b) => (a.name < b.name ? -1 : 1));
const texts = new Map();
for (const p of list) {
  if (p.text === null) continue;
  if (!texts.has(p.text)) texts.set(p.text, []);
  texts.get(p.text).push(`${p.name}@${p.version}`);
}
let md = '# Third-party licenses\n\nThe bundles in `dist/` (`dist/*.js`, `dist/chunks/`, `dist/node/`, `dist/cli/`, `dist/cjs/index.js`)\n';
md += 'contain the following packages, unmodified, from the npm registry:\n\n';
for (const p of list) md += `- ${p.name}@${p.version} (${p.license})\n`;
md += '\nTheir license texts follow; each distinct text appears once, with the packages it covers.\n';
for (const [text, names] of texts) md += `\n## ${names.length} package(s): ${names.slice(0, 3).join(', ')}${names.length > 3 ? ', …' : ''}\n\n\`\`\`\n${text}\n\`\`\`\n`;
writeFileSync('dist/THIRD_PARTY_LICENSES.md', md);
console.log(`built dist/ (ESM bundles: exactdraw, exactdraw/node, CLI) and dist/cjs/ (CommonJS core); ${packages.size} bundled packages (licenses: dist/THIRD_PARTY_LICENSES.md)`);
