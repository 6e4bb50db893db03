// Builds dist/ (ESM + .d.ts, including the CLI and the exactdraw/node entry)
// and dist/cjs/ (CommonJS + .d.ts of the library core), then replaces the
// vendor modules (src/vendor/*.ts: the @stdlib functions the library uses)
// by self-contained bundles, so the published package has no runtime
// dependencies and its core loads a handful of files instead of ~900
// (see src/vendor/stdlib.ts). The bundles are built for a neutral platform:
// a Node built-in reached from the core fails the build.
import { execFileSync } from 'node:child_process';
import { chmodSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { build } from 'esbuild';

const require = createRequire(import.meta.url);
const tsc = require.resolve('typescript/bin/tsc');
rmSync('dist', { recursive: true, force: true });
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.node.json'], { stdio: 'inherit' });
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.cjs.json'], { stdio: 'inherit' });
writeFileSync('dist/cjs/package.json', JSON.stringify({ type: 'commonjs' }, null, 2) + '\n');
chmodSync('dist/cli/main.js', 0o755);

const bundles = [
  { entry: 'src/vendor/stdlib.ts', outfile: 'dist/vendor/stdlib.js', format: 'esm' },
  { entry: 'src/vendor/stdlib.ts', outfile: 'dist/cjs/vendor/stdlib.js', format: 'cjs' },
  { entry: 'src/vendor/peers.ts', outfile: 'dist/vendor/peers.js', format: 'esm' },
];
const inputs = new Set();
for (const b of bundles) {
  const r = await build({
    entryPoints: [b.entry],
    outfile: b.outfile,
    format: b.format,
    bundle: true,
    platform: 'neutral',
    mainFields: ['main', 'module'],
    target: 'es2022',
    legalComments: 'none',
    metafile: true,
    logLevel: 'warning',
    banner: { js: '// Bundled @stdlib packages (Apache-2.0 and others): see THIRD_PARTY_LICENSES.md next to the ESM bundle.' },
  });
  for (const k of Object.keys(r.metafile.inputs)) inputs.add(k);
}

// licenses of the bundled packages, one copy of each distinct license text
const packages = new Map();
for (const file of inputs) {
  const m = /node_modules\/(@[^/]+\/[^/]+|[^@/][^/]*)\//.exec(file);
  if (m === null) continue;
  const dir = file.slice(0, m.index + m[0].length - 1);
  if (packages.has(m[1])) continue;
  const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8'));
  const licFile = ['LICENSE', 'LICENSE.md', 'LICENSE.txt', 'NOTICE'].map((f) => join(dir, f)).find((f) => existsSync(f));
  packages.set(m[1], { name: m[1], version: pkg.version, license: pkg.license ?? 'see text', text: licFile ? readFileSync(licFile, 'utf8').trim() : null });
}
const texts = new Map();
const list = [...packages.values()].sort((a, b) => (a.name < b.name ? -1 : 1));
for (const p of list) {
  if (p.text === null) continue;
  if (!texts.has(p.text)) texts.set(p.text, []);
  texts.get(p.text).push(`${p.name}@${p.version}`);
}
let md = '# Third-party licenses\n\nThe files `dist/vendor/stdlib.js`, `dist/cjs/vendor/stdlib.js` and `dist/vendor/peers.js`\n';
md += 'bundle the following packages, unmodified, from the npm registry:\n\n';
for (const p of list) md += `- ${p.name}@${p.version} (${p.license})\n`;
md += '\nTheir license texts follow; each distinct text appears once, with the packages it covers.\n';
for (const [text, names] of texts) md += `\n## ${names.length} package(s): ${names.slice(0, 3).join(', ')}${names.length > 3 ? ', …' : ''}\n\n\`\`\`\n${text}\n\`\`\`\n`;
writeFileSync(join(dirname(bundles[0].outfile), 'THIRD_PARTY_LICENSES.md'), md);
console.log(`built dist/ (ESM, CLI, exactdraw/node) and dist/cjs/ (CommonJS); vendor bundles of ${packages.size} packages (licenses: dist/vendor/THIRD_PARTY_LICENSES.md)`);
