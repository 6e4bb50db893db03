/**
 * `exactdraw check` on discrete suite entries (`discrete: true`): chi-square
 * against the entry's pmf (or differences of its cdf), biased twins that
 * fail, no vacuous passes, malformed entries refused with typed errors.
 *
 * Reference pmfs/cdfs are @stdlib's (named in the fixtures); the invented
 * dock weights are normalised by plain division in the fixture.
 * Overall false-positive rate 1e-4 (`--alpha 1e-4`), fixed seeds.
 */
import { describe, expect, it } from 'vitest';
import { InvalidOptionError, InvalidTargetError } from '../../src/core/errors.js';
import { validateSuite } from '../../src/node/suite.js';
import { run, suiteModule, tempDir } from './run.js';

const GOOD = 'test/fixtures/tiny-discrete.mjs';
const BIASED = 'test/fixtures/tiny-discrete-biased.mjs';
const ALPHA = ['--alpha', '1e-4'];

interface Row {
  name: string;
  kind: string;
  status: string;
  chiSquarePValue: number | null;
  df: number | null;
  cells: number | null;
  outside: number | null;
  against: string | null;
  ksPValue: number | null;
  reason?: string;
  error?: string;
}

describe('exactdraw check: discrete entries', () => {
  it('passes Poisson(30) (rejection and table), binomial(20, 0.3) by its cdf and invented dock weights (exit 0; JSON schema 3 with p-value and df)', () => {
    const r = run(['check', GOOD, ...ALPHA, '--json']);
    expect(r.code, r.stdout + r.stderr).toBe(0);
    const j = JSON.parse(r.stdout) as { schema: string; tests: number; checked: number; checkedDiscrete: number; perTestAlpha: number; passed: boolean; rows: Row[] };
    expect(j.schema).toBe('exactdraw-check/3');
    expect(j.passed).toBe(true);
    expect(j.checked).toBe(4);
    expect(j.checkedDiscrete).toBe(4);
    expect(j.tests).toBe(4); // one chi-square test per discrete entry
    expect(j.perTestAlpha).toBe(1e-4 / 4);
    for (const row of j.rows) {
      expect(row.kind).toBe('discrete');
      expect(row.status).toBe('ok');
      expect(row.chiSquarePValue).toBeGreaterThan(j.perTestAlpha);
      expect(row.ksPValue).toBeNull();
      expect(row.outside).toBe(0);
      expect(row.df).toBe((row.cells as number) - 1);
    }
    const by = (name: string): Row => j.rows.find((x) => x.name === name) as Row;
    expect(by('tiny binomial(20, 0.3) by its cdf').against).toBe('cdf');
    expect(by('tiny poisson(30)').against).toBe('pmf');
    // 7 invented docks, one closed (weight 0, pooled with a neighbour): 6 cells, df 5 (every expected count >> 5 at 20,000 draws)
    expect(by('tiny dock choice (invented weights)').df).toBe(5);
    // Poisson(30) at 20,000 draws has far more than 10 pooled cells
    expect(by('tiny poisson(30)').df).toBeGreaterThan(20);
    const text = run(['check', GOOD, ...ALPHA]);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('(Bonferroni: 2.50e-5 per test, 4 discrete x 1 chi-square test)');
    expect(text.stdout).toMatch(/ok\s+tiny poisson\(30\)\s+n=20000 chi2 p=\S+ df=\d+ \(pmf\)/);
    expect(text.stdout).toContain('all checks passed (4 checked)');
  });

  it('biased twins fail (exit 1): Poisson(31) draws against the Poisson(30) pmf, binomial(20, 0.33) against the (20, 0.3) cdf, one dock weight off; the replay line reproduces the verdict', () => {
    const r = run(['check', BIASED, ...ALPHA, '--seed', '11']);
    expect(r.code, r.stdout + r.stderr).toBe(1);
    const fails = r.stdout.split('\n').filter((l) => l.startsWith('FAIL'));
    expect(fails).toHaveLength(3);
    expect(r.stdout).toContain('CHECK FAILED');
    const replay = r.stdout.split('\n').find((l) => l.includes('replay:') && l.includes('poisson(31)')) as string;
    expect(replay).toContain(`--per-test-alpha ${1e-4 / 3}`);
    const again = run(['check', BIASED, '--only', 'poisson(31) claimed poisson(30)', '--seed', '11', '--draws', '20000', '--per-test-alpha', String(1e-4 / 3), '--json']);
    expect(again.code).toBe(1);
    const row = (JSON.parse(again.stdout) as { rows: Row[] }).rows[0];
    expect(row.status).toBe('fail');
    const p = /poisson\(31\)[^\n]*chi2 p=(\S+)/.exec(r.stdout)?.[1];
    expect((row.chiSquarePValue as number).toPrecision(3)).toBe(p);
  });

  it('continuous and discrete entries share one Bonferroni threshold (2 tests + 1 test); a discrete entry with neither pmf nor cdf is not checked, and alone is exit 1', () => {
    const dir = tempDir();
    const mod = suiteModule(
      dir,
      'mixed.mjs',
      `import logpmf from '${new URL('../../node_modules/@stdlib/stats-base-dists-poisson-logpmf/lib/index.js', import.meta.url).href}';
const n = ed.normalTarget(0, 1);
export const samplers = [
  { name: 'normal', create: (u) => ed.tableSampler(n, { uniform: u }), cdf: (x) => n.cdf(x) },
  { name: 'counts', discrete: true, create: (u) => ed.discreteSampler(ed.poissonTarget(4), { uniform: u }), pmf: (k) => Math.exp(logpmf(k, 4)) },
  { name: 'counts, nothing to check against', discrete: true, create: (u) => ed.discreteSampler(ed.poissonTarget(4), { uniform: u }) },
];`,
    );
    const r = run(['check', mod, ...ALPHA, '--draws', '5000']);
    expect(r.code, r.stdout + r.stderr).toBe(0);
    expect(r.stdout).toContain('1 samplers x 2 tests + 1 discrete x 1 chi-square test = 3 tests');
    expect(r.stdout).toContain(`Bonferroni: ${(1e-4 / 3).toExponential(2)} per test`);
    expect(r.stdout).toMatch(/--\s+counts, nothing to check against\s+not checked \(no pmf or cdf\)/);
    expect(r.stdout).toContain('all checks passed (2 checked, 1 not checked (no pmf or cdf))');
    const strict = run(['check', mod, ...ALPHA, '--draws', '5000', '--require-all', '--json']);
    expect(strict.code).toBe(1);
    const j = JSON.parse(strict.stdout) as { failure: string; rows: Row[] };
    expect(j.failure).toContain('--require-all: 1 sampler(s) have no cdf (discrete: no pmf or cdf)');
    expect(j.rows[2]).toMatchObject({ kind: 'discrete', status: 'not-checked', reason: 'no pmf or cdf', against: null, chiSquarePValue: null });
    const alone = run(['check', mod, '--only', 'counts, nothing to check against']);
    expect(alone.code).toBe(1);
    expect(alone.stdout).toContain('CHECK FAILED: nothing was checked: none of the 1 selected samplers has a cdf (discrete: a pmf or cdf)');
  });

  it('draws that are not integers in the support fail the check (p = 0), and a cdf that decreases is an error row, not a pass', () => {
    const dir = tempDir();
    const mod = suiteModule(
      dir,
      'wrong.mjs',
      `export const samplers = [
  // a continuous sampler declared discrete: its draws are not integers
  { name: 'not integers', discrete: true, create: (u) => ed.tableSampler(ed.normalTarget(5, 1), { uniform: u }), pmf: (k) => (k >= 0 && k <= 9 ? 0.1 : 0), support: [0, 9] },
  // integers 0..9 uniformly (twin: correct pmf), but a "cdf" that is not monotone
  { name: 'bad cdf', discrete: true, create: (u) => ed.weightedIndexSampler(new Float64Array(10).fill(1), { uniform: u }), cdf: (k) => (k === 4 ? 0.2 : (k + 1) / 10), support: [0, 9] },
  // indices 0..10 drawn, support declared [0, 9]: index 10 (1 in 11) is outside
  { name: 'one index outside', discrete: true, create: (u) => ed.weightedIndexSampler(new Float64Array(11).fill(1), { uniform: u }), pmf: (k) => 0.1, support: [0, 9] },
  { name: 'uniform digits', discrete: true, create: (u) => ed.weightedIndexSampler(new Float64Array(10).fill(1), { uniform: u }), cdf: (k) => (k + 1) / 10, support: [0, 9] },
];`,
    );
    const r = run(['check', mod, ...ALPHA, '--draws', '2000', '--json']);
    expect(r.code).toBe(1);
    const rows = (JSON.parse(r.stdout) as { rows: Row[] }).rows;
    expect(rows[0]).toMatchObject({ status: 'fail', chiSquarePValue: 0 });
    expect(rows[0].outside).toBeGreaterThan(1900); // a continuous draw is an integer with probability 0
    expect(rows[1].status).toBe('error');
    expect(rows[1].error).toContain("the cdf of 'bad cdf' is not a discrete cdf: cdf(4) - cdf(3) = 0.2 - 0.4 = -0.2");
    expect(rows[2]).toMatchObject({ status: 'fail', chiSquarePValue: 0 });
    expect(rows[2].outside).toBeGreaterThan(100); // about 2000 / 11 = 182
    expect(rows[2].df).toBe(9);
    expect(rows[3].status).toBe('ok'); // twin: the digits against the right cdf pass
    const text = run(['check', mod, ...ALPHA, '--draws', '2000', '--only', 'not integers']);
    expect(text.stdout).toMatch(/FAIL\s+not integers\s+n=2000 chi2 p=0\.00 df=- \(pmf\) 2000 draws not integers in the support/);
  });
});

describe('validateSuite: discrete entries', () => {
  const create = (): never => {
    throw new Error('not called');
  };
  const refused = (entry: object, cls: typeof InvalidTargetError | typeof InvalidOptionError, message: string): void => {
    let err: unknown;
    try {
      validateSuite('m.mjs', [entry], 'exactdraw check');
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(cls);
    expect((err as Error).message).toBe(message);
  };

  it('accepts well-formed discrete entries (twin of the refusals below)', () => {
    const ok = validateSuite('m.mjs', [
      { name: 'a', create, discrete: true, pmf: () => 0 },
      { name: 'b', create, discrete: true, cdf: () => 0, support: [-Infinity, 3] },
      { name: 'c', create, discrete: true, support: [2, Infinity] },
      { name: 'd', create, discrete: false, cdf: () => 0 },
    ]);
    expect(ok).toHaveLength(4);
  });

  it('refuses malformed discrete entries with typed errors naming the API, the entry and the field', () => {
    refused({ name: 'a', create, discrete: true, pfm: () => 0 }, InvalidOptionError, "exactdraw check: m.mjs samplers[0] has an unknown key 'pfm' (known: 'name', 'create', 'cdf', 'reference', 'discrete', 'pmf', 'support')");
    refused({ name: 'a', create, discrete: 'yes' }, InvalidTargetError, "exactdraw check: m.mjs samplers[0].discrete ('a') must be true or false when given, got 'yes'");
    refused({ name: 'a', create, discrete: 1 }, InvalidTargetError, "exactdraw check: m.mjs samplers[0].discrete ('a') must be true or false when given, got 1");
    refused({ name: 'a', create, discrete: true, pmf: 0.5 }, InvalidTargetError, "exactdraw check: m.mjs samplers[0].pmf ('a') must be a function k => P(X = k) when given, got 0.5");
    const support = "exactdraw check: m.mjs samplers[0].support ('a') must be a pair [lower, upper] of integers (lower may be -Infinity, upper Infinity) with lower <= upper, got ";
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: [0.5, 10] }, InvalidTargetError, `${support}[0.5, 10]`);
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: [5, 1] }, InvalidTargetError, `${support}[5, 1]`);
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: [0] }, InvalidTargetError, `${support}[0]`);
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: ['0', 3] }, InvalidTargetError, `${support}['0', 3]`);
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: [Infinity, Infinity] }, InvalidTargetError, `${support}[Infinity, Infinity]`);
    refused({ name: 'a', create, discrete: true, pmf: () => 0, support: '0..9' }, InvalidTargetError, `${support}'0..9'`);
    // pmf / support on an entry that is not discrete: never silently ignored
    refused({ name: 'a', create, pmf: () => 0 }, InvalidTargetError, "exactdraw check: m.mjs samplers[0].pmf ('a') is read only for discrete entries: add discrete: true (a continuous entry is checked against its cdf)");
    refused({ name: 'a', create, discrete: false, cdf: () => 0, support: [0, 9] }, InvalidTargetError, "exactdraw check: m.mjs samplers[0].support ('a') is read only for discrete entries: add discrete: true");
  });

  it('the command refuses a malformed discrete entry before running (exit 2, one prefix)', () => {
    const dir = tempDir();
    const mod = suiteModule(dir, 'bad.mjs', "export const samplers = [{ name: 'x', discrete: true, create: (u) => ed.weightedIndexSampler([1, 2], { uniform: u }), pmf: (k) => [1 / 3, 2 / 3][k], support: [0, 1.5] }];");
    const r = run(['check', mod]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`exactdraw check: ${mod} samplers[0].support ('x') must be a pair [lower, upper] of integers`);
    expect(r.stderr).not.toContain('exactdraw: exactdraw');
    expect(r.stdout).toBe('');
  });
});
