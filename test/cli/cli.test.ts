import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// These tests run the built command (npm test builds before running vitest).
const BIN = 'dist/cli/main.js';
const TINY = 'test/fixtures/tiny-suite.mjs';
const BIASED = 'test/fixtures/tiny-biased.mjs';

function run(...args: string[]): { code: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', timeout: 120_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('exactdraw command', () => {
  it('exactdraw check passes a correct module (exit 0) and states the overall false-positive rate', () => {
    const r = run('check', TINY, '--n', '5000');
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain('overall false-positive rate 0.001');
    expect(r.stdout).toContain('all checks passed');
    expect(r.stdout).toMatch(/ok\s+tiny normal/);
  });

  it('exactdraw check fails a biased module (exit 1) and prints the seed for replay', () => {
    const r = run('check', BIASED, '--n', '20000', '--seed', '77');
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('FAIL');
    expect(r.stdout).toContain("replay: exactdraw check test/fixtures/tiny-biased.mjs --only 'biased normal' --seed 77");
  });

  it('exactdraw bench --json follows the exactdraw-bench/1 schema', () => {
    const r = run('bench', TINY, '--json', '--draws', '20000', '--rounds', '3');
    expect(r.code, r.stderr).toBe(0);
    const rep = JSON.parse(r.stdout);
    expect(rep.schema).toBe('exactdraw-bench/1');
    expect(rep.draws).toBe(20000);
    expect(rep.rounds).toBe(3);
    const row = rep.rows.find((x: { name: string }) => x.name === 'tiny normal');
    expect(row).toBeDefined();
    for (const k of ['nsPerDraw', 'acceptanceRate', 'evaluationsPerDraw', 'setupEvaluations', 'setupMs', 'ratioToReference']) {
      expect(typeof row[k], k).toBe('number');
    }
    expect(row.roundsNs).toHaveLength(3);
    expect(row.reference).toBe('mt19937 uniform (raw)');
    // Acceptance of normal / Cauchy with the tight constant is 1/sqrt(2π/e) = 0.6577 (common practice; ratio of densities at x = ±1).
    expect(Math.abs(row.acceptanceRate - 0.6577)).toBeLessThan(0.02);
    const peer = rep.rows.find((x: { name: string }) => x.name === 'mt19937 uniform (raw)');
    expect(peer.peer).toBe(true);
    expect(peer.acceptanceRate).toBeNull();
  });

  it('exactdraw bench --baseline exits 1 on a regression and 0 without one', () => {
    const dir = mkdtempSync(join(tmpdir(), 'exactdraw-'));
    const outFile = join(dir, 'current.json');
    const r = run('bench', TINY, '--draws', '20000', '--rounds', '3', '--out', outFile);
    expect(r.code, r.stderr).toBe(0);
    const rep = JSON.parse(readFileSync(outFile, 'utf8'));
    // Counts are deterministic for a seed: a baseline that needed half the evaluations is a regression.
    const better = { ...rep, rows: rep.rows.map((x: { evaluationsPerDraw: number | null }) => ({ ...x, evaluationsPerDraw: x.evaluationsPerDraw === null ? null : x.evaluationsPerDraw / 2 })) };
    const betterFile = join(dir, 'better.json');
    writeFileSync(betterFile, JSON.stringify(better));
    const bad = run('bench', TINY, '--draws', '20000', '--rounds', '3', '--baseline', betterFile, '--tolerance', '100', '--count-tolerance', '0.2');
    expect(bad.code).toBe(1);
    expect(bad.stderr).toContain('REGRESSION tiny normal: evaluationsPerDraw');
    // The same report as baseline with a wide tolerance (timings are noisy; counts are not): no regression.
    const ok = run('bench', TINY, '--draws', '20000', '--rounds', '3', '--baseline', outFile, '--tolerance', '100');
    expect(ok.code, ok.stderr).toBe(0);
    expect(ok.stderr).toContain('no regression');
  });

  it('exactdraw exits 2 on usage errors and unloadable modules', () => {
    expect(run('frobnicate').code).toBe(2);
    expect(run('bench', TINY, '--draws').code).toBe(2);
    expect(run('bench', TINY, '--colour', 'red').code).toBe(2);
    expect(run('check', 'test/fixtures/does-not-exist.mjs').code).toBe(2);
    expect(run().code).toBe(2);
    expect(run('--help').code).toBe(0);
  });
});
