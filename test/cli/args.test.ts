/**
 * Argument parsing of the `exactdraw` command (node:util parseArgs): version,
 * help on every subcommand, --flag=value, unknown flags, progress output,
 * module paths.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { basename, dirname } from 'node:path';
import { run, suiteModule, tempDir } from './run.js';

const TINY = 'test/fixtures/tiny-suite.mjs';
const VERSION = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;

describe('exactdraw arguments', () => {
  it('--version prints the package version, also after a subcommand', () => {
    for (const args of [['--version'], ['bench', '--version'], ['check', '--version']]) {
      const r = run(args);
      expect(r.code, args.join(' ')).toBe(0);
      expect(r.stdout.trim()).toBe(VERSION);
    }
  });

  it('-h and --help work on every subcommand and print that subcommand\'s options', () => {
    for (const flag of ['-h', '--help']) {
      expect(run([flag]).stdout).toContain('usage: exactdraw <command>');
      for (const [cmd, option] of [
        ['bench', '--gate-reference'],
        ['check', '--require-all'],
        ['demo', '--out DIR'],
      ]) {
        const r = run([cmd, flag]);
        expect(r.code, `${cmd} ${flag}`).toBe(0);
        expect(r.stdout).toContain(`usage: exactdraw ${cmd}`);
        expect(r.stdout).toContain(option);
      }
    }
    expect(run(['help', 'check']).stdout).toContain('usage: exactdraw check');
    const none = run([]);
    expect(none.code).toBe(2);
    expect(none.stderr).toContain('usage: exactdraw <command>');
  });

  it('unknown flags and commands are usage errors (exit 2) listing the known ones; a missing value is named', () => {
    const r = run(['bench', TINY, '--colour', 'red']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^exactdraw bench: unknown option --colour \(known: --draws, --n, --rounds, --seed, --only, --json, --out, --baseline, --tolerance, --count-tolerance, --gate-reference, --gate-times, --skip-self-check, --fail-on-noise, --quiet, --help\/-h, --version\)/);
    const c = run(['check', '--n', '100', '--rounds', '3']);
    expect(c.code).toBe(2);
    expect(c.stderr).toContain('exactdraw check: unknown option --rounds (known: --draws, --n, --seed, --alpha, --per-test-alpha, --only, --require-all');
    const v = run(['bench', TINY, '--draws']);
    expect(v.code).toBe(2);
    expect(v.stderr).toContain("exactdraw bench: Option '--draws <value>' argument missing");
    const bad = run(['check', TINY, '--draws', 'many']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain("exactdraw check: --draws must be an integer >= 10, got 'many'");
    const f = run(['frobnicate']);
    expect(f.code).toBe(2);
    expect(f.stderr).toContain("exactdraw: unknown command 'frobnicate' (commands: demo, bench, check, help)");
    expect(run(['check', TINY, '--n', '100', '--draws', '200']).stderr).toContain('--draws 200 and --n 100 disagree');
    for (const x of [r, c, v, bad, f]) expect(x.stderr).not.toContain('exactdraw: exactdraw');
  });

  it('--flag=value and --flag value are the same; check and bench take --draws (and --n) alike', () => {
    const a = JSON.parse(run(['check', TINY, '--only=tiny normal', '--draws=2000', '--seed=5', '--json']).stdout);
    const b = JSON.parse(run(['check', TINY, '--only', 'tiny normal', '--n', '2000', '--seed', '5', '--json']).stdout);
    expect(a.rows[0].n).toBe(2000);
    expect(a.rows).toEqual(b.rows);
    const bench = JSON.parse(run(['bench', TINY, '--only=tiny truncated normal', '--n=20000', '--rounds=3', '--json', '--skip-self-check']).stdout);
    expect(bench.draws).toBe(20000);
  });

  it('progress goes to stderr only on a terminal: a piped run (and --quiet) writes none', () => {
    const r = run(['bench', TINY, '--only', 'tiny truncated normal', '--draws', '20000', '--rounds', '3', '--skip-self-check']);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).toContain('tiny truncated normal');
    const q = run(['bench', TINY, '--only', 'tiny truncated normal', '--draws', '20000', '--rounds', '3', '--quiet', '--skip-self-check']);
    expect(q.stderr).toBe('');
  });

  it('a relative module path resolves against the working directory, as documented', () => {
    const dir = tempDir();
    const mod = suiteModule(dir, 'here.mjs', "const n = ed.normalTarget(0, 1);\nexport const samplers = [{ name: 'here', create: (u) => ed.tableSampler(n, { uniform: u }), cdf: (x) => n.cdf(x) }];");
    const ok = run(['check', basename(mod), '--draws', '2000'], { cwd: dirname(mod) });
    expect(ok.code, ok.stderr).toBe(0);
    expect(ok.stdout).toMatch(/ok\s+here/);
    // twin: the same relative path from another directory is not found
    const elsewhere = run(['check', basename(mod), '--draws', '2000']);
    expect(elsewhere.code).toBe(2);
    expect(elsewhere.stderr).toMatch(/Cannot find module|ERR_MODULE_NOT_FOUND/);
  });
});
