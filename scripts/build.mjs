// Builds dist/ (ESM + .d.ts, including the CLI and the exactdraw/node entry)
// and dist/cjs/ (CommonJS + .d.ts of the library core).
import { execFileSync } from 'node:child_process';
import { chmodSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const tsc = require.resolve('typescript/bin/tsc');
rmSync('dist', { recursive: true, force: true });
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.node.json'], { stdio: 'inherit' });
execFileSync(process.execPath, [tsc, '-p', 'tsconfig.cjs.json'], { stdio: 'inherit' });
writeFileSync('dist/cjs/package.json', JSON.stringify({ type: 'commonjs' }, null, 2) + '\n');
chmodSync('dist/cli/main.js', 0o755);
console.log('built dist/ (ESM, CLI, exactdraw/node) and dist/cjs/ (CommonJS)');
