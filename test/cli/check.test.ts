/**
 * `exactdraw check` as a CI user runs it: verdicts, no vacuous passes, the
 * replay line, exact --only.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { run, suiteModule, tempDir } from './run.js';

const TINY = 'test/fixtures/tiny-suite.mjs';

describe('exactdraw check', () => {
  it('passes a correct module (exit 0) and states the overall false-positive rate', () => {
    const r = run(['check', TINY, '--draws', '5000']);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain('overall false-positive rate 0.001');
    expect(r.stdout).toContain('all checks passed (3 checked)');
    expect(r.stdout).toMatch(/ok\s+tiny normal/);
  });

  it('fails a biased module (exit 1); the replay line carries the suite-wide threshold and reproduces the verdict and p-values', () => {
    const dir = tempDir();
    // two good samplers and one biased by +0.05 (invented), so the suite-wide threshold (alpha / 6) differs from alpha / 2
    const mod = suiteModule(
      dir,
      'mixed.mjs',
      `const n = ed.normalTarget(0, 1);
export const samplers = [
  { name: 'good a', create: (u) => ed.tableSampler(n, { uniform: u }), cdf: (x) => n.cdf(x) },
  { name: "shifted 'b'", create: (u) => ed.tableSampler(ed.normalTarget(0.05, 1), { uniform: u }), cdf: (x) => n.cdf(x) },
  { name: 'good c', create: (u) => ed.rejectionSampler(n, { proposal: ed.cauchyProposal(0, 1), uniform: u }), cdf: (x) => n.cdf(x) },
];`,
    );
    const r = run(['check', mod, '--draws', '40000', '--seed', '77']);
    expect(r.code, r.stdout + r.stderr).toBe(1);
    const fail = r.stdout.split('\n').find((l) => l.startsWith('FAIL'));
    expect(fail).toMatch(/shifted 'b'/);
    const replay = r.stdout.split('\n').find((l) => l.includes('replay:'));
    expect(replay).toBeDefined();
    // per-test threshold 0.001 / 6 = 1.6666…e-4, written in full
    expect(replay).toContain(`--per-test-alpha ${0.001 / 6}`);
    expect(replay).toContain("--only 'shifted '\\''b'\\''' --seed 77 --draws 40000");
    // run the replay line as a shell would split it
    const words = (replay as string).replace(/^\s*replay: exactdraw /, '').replace(/\s+\(stream:.*$/, '');
    const split = shellSplit(words);
    const again = run(split);
    expect(again.code).toBe(1);
    const p = (s: string): string | undefined => /KS p=(\S+) AD p=(\S+)/.exec(s.split('\n').find((l) => l.includes("shifted 'b'")) ?? '')?.slice(1).join(' ');
    expect(p(again.stdout)).toBe(p(r.stdout));
    expect(again.stdout).toContain('Bonferroni: 1.67e-4 per test');
  });

  it('zero samplers checked is exit 1: an empty suite, and a suite whose samplers have no cdf (listed as not checked, text and JSON)', () => {
    const dir = tempDir();
    const empty = suiteModule(dir, 'empty.mjs', 'export const samplers = [];');
    const r0 = run(['check', empty]);
    expect(r0.code).toBe(1);
    expect(r0.stdout).toContain('CHECK FAILED: nothing was checked: no sampler selected');
    expect(r0.stdout).not.toContain('all checks passed');
    const nocdf = suiteModule(dir, 'nocdf.mjs', "export const samplers = [{ name: 'no cdf here', create: (u) => ed.tableSampler(ed.normalTarget(0, 1), { uniform: u }) }];");
    const r1 = run(['check', nocdf]);
    expect(r1.code).toBe(1);
    expect(r1.stdout).toMatch(/no cdf here\s+not checked \(no cdf\)/);
    expect(r1.stdout).toContain('none of the 1 selected samplers has a cdf');
    const j = JSON.parse(run(['check', nocdf, '--json']).stdout);
    expect(j.schema).toBe('exactdraw-check/2');
    expect(j.passed).toBe(false);
    expect(j.checked).toBe(0);
    expect(j.notChecked).toEqual(['no cdf here']);
    expect(j.rows[0]).toMatchObject({ name: 'no cdf here', status: 'not-checked', reason: 'no cdf' });
  });

  it('samplers without a cdf are listed next to checked ones; --require-all makes them a failure', () => {
    const dir = tempDir();
    const mod = suiteModule(
      dir,
      'some.mjs',
      `const n = ed.normalTarget(0, 1);
export const samplers = [
  { name: 'with cdf', create: (u) => ed.tableSampler(n, { uniform: u }), cdf: (x) => n.cdf(x) },
  { name: 'without cdf', create: (u) => ed.tableSampler(n, { uniform: u }) },
];`,
    );
    const ok = run(['check', mod, '--draws', '3000']);
    expect(ok.code).toBe(0);
    expect(ok.stdout).toMatch(/--\s+without cdf\s+not checked \(no cdf\)/);
    expect(ok.stdout).toContain('all checks passed (1 checked, 1 not checked (no cdf))');
    const strict = run(['check', mod, '--draws', '3000', '--require-all']);
    expect(strict.code).toBe(1);
    expect(strict.stdout).toMatch(/FAIL\s+without cdf\s+not checked \(no cdf\)/);
    expect(strict.stdout).toContain('CHECK FAILED: --require-all: 1 sampler(s) have no cdf');
    const j = JSON.parse(run(['check', mod, '--draws', '3000', '--require-all', '--json']).stdout);
    expect(j.passed).toBe(false);
    expect(j.requireAll).toBe(true);
  });

  it('--only matches exact names (repeatable); a name that matches nothing is a usage error listing the names', () => {
    const one = run(['check', TINY, '--only', 'tiny normal', '--draws', '2000', '--json']);
    expect(one.code, one.stderr).toBe(0);
    expect(JSON.parse(one.stdout).rows.map((r: { name: string }) => r.name)).toEqual(['tiny normal']);
    const two = JSON.parse(run(['check', TINY, '--only', 'tiny normal', '--only=tiny fast normal', '--n=2000', '--json']).stdout);
    expect(two.rows.map((r: { name: string }) => r.name)).toEqual(['tiny normal', 'tiny fast normal']);
    expect(two.rows[0].n).toBe(2000);
    const sub = run(['check', TINY, '--only', 'tiny']);
    expect(sub.code).toBe(2);
    expect(sub.stderr).toContain("exactdraw check: --only 'tiny' names no sampler (exact names: 'tiny normal', 'tiny truncated normal', 'tiny fast normal')");
    expect(sub.stdout).toBe('');
  });

  it('suite entries with a typo in a key are refused with InvalidOptionError listing the known keys (exit 2, one prefix)', () => {
    const dir = tempDir();
    const mod = suiteModule(dir, 'typo.mjs', "export const samplers = [{ name: 'x', create: (u) => ed.tableSampler(ed.normalTarget(0, 1), { uniform: u }), cfd: (x) => x }];");
    const r = run(['check', mod]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`exactdraw check: ${mod} samplers[0] has an unknown key 'cfd' (known: 'name', 'create', 'cdf', 'reference')`);
    expect(r.stderr).not.toContain('exactdraw: exactdraw');
    expect(run(['check', join(dir, 'does-not-exist.mjs')]).code).toBe(2);
  });
});

/** Splits a POSIX shell line with single quotes (and '\'' escapes) into words. */
function shellSplit(line: string): string[] {
  const out: string[] = [];
  let cur = '';
  let inWord = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (ch === "'") {
      const end = line.indexOf("'", i + 1);
      cur += line.slice(i + 1, end);
      i = end;
      inWord = true;
    } else if (ch === '\\') {
      cur += line[++i];
      inWord = true;
    } else if (ch === ' ') {
      if (inWord) out.push(cur);
      cur = '';
      inWord = false;
    } else {
      cur += ch;
      inWord = true;
    }
  }
  if (inWord) out.push(cur);
  return out;
}
