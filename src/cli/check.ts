/**
 * `exactdraw check`: KS and Anderson–Darling for every continuous suite entry
 * with a cdf, a pooled chi-square test for every discrete entry
 * (`discrete: true`) with a pmf or cdf, with fixed seeds and a stated overall
 * false-positive rate. Entries with nothing to check against are listed as
 * not checked; a run that checks nothing fails.
 *
 * @packageDocumentation
 */
import { andersonDarlingCheck } from '../checks/anderson-darling.js';
import { discreteChiSquareCheck } from '../checks/discrete-chi-square.js';
import { InvalidTargetError } from '../core/errors.js';
import { ksCheck } from '../checks/ks.js';
import { substream } from '../random/substream.js';
import { DEFAULT_DISCRETE_SUPPORT } from '../node/suite.js';
import type { SuiteEntry } from '../node/suite.js';

/**
 * JSON schema tag of check reports. Version 3 adds the discrete rows:
 * `kind`, `chiSquarePValue`, `df`, `cells`, `outside`, `against` on every
 * row, and `checkedDiscrete` on the report.
 */
export const CHECK_SCHEMA = 'exactdraw-check/3';

/** Options of {@link runCheck}. */
export interface CheckOptions {
  /** Draws per entry. */
  draws: number;
  /** Seed; entry i of the suite draws from substream(seed, i). */
  seed: number;
  /** Overall false-positive rate for the whole run (Bonferroni over the tests: 2 per checked continuous entry, 1 per checked discrete entry). */
  alpha: number;
  /** Per-test threshold to use instead of alpha / tests (the replay line passes the suite-wide one). */
  perTestAlpha?: number;
  /** Exact entry names to run (null: all). */
  only: string[] | null;
  /** Entries with nothing to check against (no cdf; discrete: no pmf or cdf) make the run fail. */
  requireAll: boolean;
}

/** Result for one entry. */
export interface CheckRow {
  name: string;
  /** `'discrete'` for entries with `discrete: true` (chi-square), else `'continuous'` (KS and AD). */
  kind: 'continuous' | 'discrete';
  /** `'ok'`, `'fail'` (a p-value at or below the per-test threshold), `'error'` (the sampler or the check threw), `'not-checked'` (no cdf; discrete: no pmf or cdf). */
  status: 'ok' | 'fail' | 'error' | 'not-checked';
  n: number;
  seed: number;
  /** Stream index: substream(seed, index). */
  index: number;
  /** Continuous rows: KS p-value (null otherwise). */
  ksPValue: number | null;
  /** Continuous rows: Anderson–Darling p-value (null otherwise). */
  adPValue: number | null;
  /** Discrete rows: chi-square p-value over the pooled cells (null otherwise). */
  chiSquarePValue: number | null;
  /** Discrete rows: degrees of freedom of the chi-square test, pooled cells minus 1 (null otherwise). */
  df: number | null;
  /** Discrete rows: pooled cells, each with expected count >= 5 (null otherwise). */
  cells: number | null;
  /** Discrete rows: draws that are not integers inside the support (any makes the p-value 0; null otherwise). */
  outside: number | null;
  /** What the draws were checked against: `'cdf'`, or for discrete rows `'pmf'` or `'cdf'` (differences at the integers); null when not checked. */
  against: 'cdf' | 'pmf' | null;
  passed: boolean;
  error?: string;
  /** Why the entry was not checked. */
  reason?: string;
}

/** Result of a check run. */
export interface CheckReport {
  schema: typeof CHECK_SCHEMA;
  alpha: number;
  perTestAlpha: number;
  /** Number of tests the threshold is shared by (2 per checked continuous entry, 1 per checked discrete entry). */
  tests: number;
  /** Entries checked (continuous and discrete). */
  checked: number;
  /** Discrete entries checked (included in `checked`). */
  checkedDiscrete: number;
  notChecked: string[];
  requireAll: boolean;
  rows: CheckRow[];
  passed: boolean;
  /** Why the run failed without a failing test (nothing checked; --require-all). */
  failure: string | null;
}

/** What a discrete entry's draws are checked against: its pmf, or differences of its cdf at the integers. */
function discretePmf(e: SuiteEntry, lower: number): { pmf: (k: number) => number; against: 'pmf' | 'cdf' } | null {
  if (e.pmf !== undefined) return { pmf: e.pmf.bind(e), against: 'pmf' };
  if (e.cdf === undefined) return null;
  const cdf = e.cdf.bind(e);
  const pmf = (k: number): number => {
    const hi = cdf(k);
    const lo = k === lower ? 0 : cdf(k - 1);
    const d = hi - lo;
    // a cdf computed in floating point may step down by rounding; more than that is an error
    if (!(d >= -1e-12)) throw new InvalidTargetError(`exactdraw check: the cdf of '${e.name}' is not a discrete cdf: cdf(${k}) - cdf(${k - 1}) = ${hi} - ${lo} = ${d}`);
    return d > 0 ? d : 0;
  };
  return { pmf, against: 'cdf' };
}

/** Draws that are not integers inside `support`. */
function countOutside(x: Float64Array, support: readonly [number, number]): number {
  let outside = 0;
  for (let i = 0; i < x.length; i++) {
    const k = x[i];
    if (!Number.isInteger(k) || k < support[0] || k > support[1]) outside++;
  }
  return outside;
}

const checkable = (e: SuiteEntry): boolean => (e.discrete === true ? e.pmf !== undefined || e.cdf !== undefined : e.cdf !== undefined);

/** Runs the checks. */
export function runCheck(entries: SuiteEntry[], opts: CheckOptions): CheckReport {
  const selected = entries.filter((e) => opts.only === null || opts.only.includes(e.name));
  const checked = selected.filter(checkable);
  const checkedDiscrete = checked.filter((e) => e.discrete === true).length;
  const tests = 2 * (checked.length - checkedDiscrete) + checkedDiscrete;
  const perTestAlpha = opts.perTestAlpha ?? (tests > 0 ? opts.alpha / tests : opts.alpha);
  const rows: CheckRow[] = [];
  const none = { ksPValue: null, adPValue: null, chiSquarePValue: null, df: null, cells: null, outside: null };
  for (const e of selected) {
    const index = entries.indexOf(e);
    const kind = e.discrete === true ? 'discrete' : 'continuous';
    const base = { name: e.name, kind, n: opts.draws, seed: opts.seed, index } as const;
    if (!checkable(e)) {
      rows.push({ ...base, status: 'not-checked', ...none, against: null, passed: !opts.requireAll, reason: kind === 'discrete' ? 'no pmf or cdf' : 'no cdf' });
      continue;
    }
    const against = kind === 'discrete' ? (e.pmf !== undefined ? 'pmf' : 'cdf') : 'cdf';
    try {
      const s = e.create(substream(opts.seed, index), { seed: opts.seed, stream: index });
      const x = s.fill(new Float64Array(opts.draws));
      if (kind === 'discrete') {
        const support = e.support ?? DEFAULT_DISCRETE_SUPPORT;
        const ref = discretePmf(e, support[0]);
        if (ref === null) throw new Error('unreachable: a checkable discrete entry has a pmf or cdf');
        if (countOutside(x, support) === x.length) {
          // no draw is an integer in the support: X² is infinite, and there is nothing to pool
          rows.push({ ...base, status: 'fail', ...none, chiSquarePValue: 0, outside: x.length, against, passed: false });
          continue;
        }
        const r = discreteChiSquareCheck(x, ref.pmf, support);
        const passed = r.pValue > perTestAlpha;
        rows.push({ ...base, status: passed ? 'ok' : 'fail', ...none, chiSquarePValue: r.pValue, df: r.df, cells: r.cells, outside: r.outside, against, passed });
      } else {
        const cdf = (e.cdf as (x: number) => number).bind(e);
        const ks = ksCheck(x, cdf);
        const ad = andersonDarlingCheck(x, cdf);
        const passed = ks.pValue > perTestAlpha && ad.pValue > perTestAlpha;
        rows.push({ ...base, status: passed ? 'ok' : 'fail', ...none, ksPValue: ks.pValue, adPValue: ad.pValue, against, passed });
      }
    } catch (err) {
      rows.push({ ...base, status: 'error', ...none, against, passed: false, error: err instanceof Error ? err.message : String(err) });
    }
  }
  const notChecked = rows.filter((r) => r.status === 'not-checked').map((r) => r.name);
  const what = (anyDiscrete: boolean): string => (anyDiscrete ? 'a cdf (discrete: a pmf or cdf)' : 'a cdf');
  let failure: string | null = null;
  if (checked.length === 0) {
    failure = `nothing was checked: ${selected.length === 0 ? 'no sampler selected' : `none of the ${selected.length} selected samplers has ${what(selected.some((e) => e.discrete === true))}`}; a check of nothing is not a pass`;
  } else if (opts.requireAll && notChecked.length > 0) {
    const discreteLeft = rows.some((r) => r.status === 'not-checked' && r.kind === 'discrete');
    failure = `--require-all: ${notChecked.length} sampler(s) have no ${discreteLeft ? 'cdf (discrete: no pmf or cdf)' : 'cdf'} and were not checked`;
  }
  const passed = failure === null && rows.every((r) => r.passed);
  return { schema: CHECK_SCHEMA, alpha: opts.alpha, perTestAlpha, tests, checked: checked.length, checkedDiscrete, notChecked, requireAll: opts.requireAll, rows, passed, failure };
}

/** Quotes a word for a POSIX shell. */
export function shellQuote(s: string): string {
  return /^[\w./:@%+=,-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

/** Formats a check report; `moduleName` is the suite module as given on the command line ('' for the built-in suite). */
export function formatCheck(report: CheckReport, moduleName: string): string {
  const p = (v: number | null): string => (v === null ? '-' : v.toPrecision(3));
  const continuous = report.checked - report.checkedDiscrete;
  const parts: string[] = [];
  if (continuous > 0 || report.checkedDiscrete === 0) parts.push(`${continuous} samplers x 2 tests`);
  if (report.checkedDiscrete > 0) parts.push(`${report.checkedDiscrete} discrete x 1 chi-square test`);
  const lines = [
    `exactdraw check: overall false-positive rate ${report.alpha} (Bonferroni: ${report.perTestAlpha.toExponential(2)} per test, ${parts.join(' + ')}${parts.length > 1 ? ` = ${report.tests} tests` : ''})`,
  ];
  for (const r of report.rows) {
    if (r.status === 'not-checked') {
      lines.push(`${report.requireAll ? 'FAIL' : '--  '} ${r.name.padEnd(46)} not checked (${r.reason ?? 'no cdf'})`);
      continue;
    }
    const status = r.passed ? 'ok  ' : 'FAIL';
    const stats =
      r.kind === 'discrete'
        ? `chi2 p=${p(r.chiSquarePValue)} df=${r.df ?? '-'} (${r.against ?? '-'})${r.outside !== null && r.outside > 0 ? ` ${r.outside} draws not integers in the support` : ''}`
        : `KS p=${p(r.ksPValue)} AD p=${p(r.adPValue)}`;
    lines.push(`${status} ${r.name.padEnd(46)} n=${r.n} ${stats}${r.error !== undefined ? ` error: ${r.error}` : ''}`);
    if (!r.passed) {
      const mod = moduleName === '' ? '' : ` ${shellQuote(moduleName)}`;
      lines.push(
        `     replay: exactdraw check${mod} --only ${shellQuote(r.name)} --seed ${r.seed} --draws ${r.n} --per-test-alpha ${report.perTestAlpha}   (stream: substream(${r.seed}, ${r.index}))`,
      );
    }
  }
  const reasons = [...new Set(report.rows.filter((r) => r.status === 'not-checked').map((r) => r.reason ?? 'no cdf'))].join('; ');
  if (report.failure !== null) lines.push(`CHECK FAILED: ${report.failure}`);
  else lines.push(report.passed ? `all checks passed (${report.checked} checked${report.notChecked.length > 0 ? `, ${report.notChecked.length} not checked (${reasons})` : ''})` : 'CHECK FAILED');
  return lines.join('\n');
}
