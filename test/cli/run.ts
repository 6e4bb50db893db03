/** Helpers of the command tests: run the built command, write small suite modules. */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

// These tests run the built command (npm test builds before running vitest).
export const BIN = resolve('dist/cli/main.js');
/** URL of the built library, for suite modules written by the tests. */
export const DIST_URL = pathToFileURL(resolve('dist/index.js')).href;

export interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function run(args: string[], opts: { cwd?: string; env?: Record<string, string> } = {}): Run {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', timeout: 300_000, cwd: opts.cwd, env: { ...process.env, ...opts.env } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A fresh directory for modules and reports of one test. */
export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'exactdraw-cli-'));
}

/** Writes a suite module whose body may use `ed` (the built library); returns its path. */
export function suiteModule(dir: string, name: string, body: string): string {
  const file = join(dir, name);
  writeFileSync(file, `import * as ed from '${DIST_URL}';\n${body}\n`);
  return file;
}
