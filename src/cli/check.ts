/**
 * `exactdraw check`: KS and Anderson–Darling for every suite entry with a cdf,
 * with fixed seeds and a stated overall false-positive rate. Entries without
 * a cdf are listed as not checked; a run that checks nothing fails.
 *
 * @packageDocumentation
 */
import { andersonDarlingCheck } from '../checks/anderson-darling.js';
import { ksCheck } from '../checks/ks.js';
import { substream } from '../random/substream.js';
import type { SuiteEntry } from '../node/suite.js';

/** JSON schema tag of check reports. */
export const CHECK_SCHEMA = 'exactdraw-check/2';

/** Options of {@link runCheck}. */
export interface CheckOptions {
  /** Draws per entry. */
  draws: number;
  /** Seed; entry i of the suite draws from substream(seed, i). */
  seed: number;
  /** Overall false-positive rate for the whole run (Bonferroni over 2 tests per checked entry). */
  alpha: number;
  /** Per-test threshold to use instead of alpha / tests (the replay line passes the suite-wide one). */
  perTestAlpha?: number;
  /** Exact entry names to run (null: all). */
  only: string[] | null;
  /** Entries without a cdf make the run fail. */
  requireAll: boolean;
}

/** Result for one entry. */
export interface CheckRow {
  name: string;
  /** `'ok'`, `'fail'` (a p-value at or below the per-test threshold), `'error'` (the sampler threw), `'not-checked'` (no cdf). */
  status: 'ok' | 'fail' | 'error' | 'not-checked';
  n: number;
  seed: number;
  /** Stream index: substream(seed, index). */
  index: number;
  ksPValue: number | null;
  adPValue: number | null;
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
  /** Number of tests the threshold is shared by (2 per checked entry). */
  tests: number;
  checked: number;
  notChecked: string[];
  requireAll: boolean;
  rows: CheckRow[];
  passed: boolean;
  /** Why the run failed without a failing test (nothing checked; --require-all). */
  failure: string | null;
}

/** Runs the checks. */
export function runCheck(entries: SuiteEntry[], opts: CheckOptions): CheckReport {
  const selected = entries.filter((e) => opts.only === null || opts.only.includes(e.name));
  const checked = selected.filter((e) => e.cdf !== undefined);
  const tests = 2 * checked.length;
  const perTestAlpha = opts.perTestAlpha ?? (tests > 0 ? opts.alpha / tests : opts.alpha);
  const rows: CheckRow[] = [];
  for (const e of selected) {
    const index = entries.indexOf(e);
    const base = { name: e.name, n: opts.draws, seed: opts.seed, index };
    if (e.cdf === undefined) {
      rows.push({ ...base, status: 'not-checked', ksPValue: null, adPValue: null, passed: !opts.requireAll, reason: 'no cdf' });
      continue;
    }
    const cdf = e.cdf.bind(e);
    try {
      const s = e.create(substream(opts.seed, index), { seed: opts.seed, stream: index });
      const x = s.fill(new Float64Array(opts.draws));
      const ks = ksCheck(x, cdf);
      const ad = andersonDarlingCheck(x, cdf);
      const passed = ks.pValue > perTestAlpha && ad.pValue > perTestAlpha;
      rows.push({ ...base, status: passed ? 'ok' : 'fail', ksPValue: ks.pValue, adPValue: ad.pValue, passed });
    } catch (err) {
      rows.push({ ...base, status: 'error', ksPValue: null, adPValue: null, passed: false, error: err instanceof Error ? err.message : String(err) });
    }
  }
  const notChecked = rows.filter((r) => r.status === 'not-checked').map((r) => r.name);
  let failure: string | null = null;
  if (checked.length === 0) {
    failure = `nothing was checked: ${selected.length === 0 ? 'no sampler selected' : `none of the ${selected.length} selected samplers has a cdf`}; a check of nothing is not a pass`;
  } else if (opts.requireAll && notChecked.length > 0) {
    failure = `--require-all: ${notChecked.length} sampler(s) have no cdf and were not checked`;
  }
  const passed = failure === null && rows.every((r) => r.passed);
  return { schema: CHECK_SCHEMA, alpha: opts.alpha, perTestAlpha, tests, checked: checked.length, notChecked, requireAll: opts.requireAll, rows, passed, failure };
}

/** Quotes a word for a POSIX shell. */
export function shellQuote(s: string): string {
  return /^[\w./:@%+=,-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

/** Formats a check report; `moduleName` is the suite module as given on the command line ('' for the built-in suite). */
export function formatCheck(report: CheckReport, moduleName: string): string {
  const p = (v: number | null): string => (v === null ? '-' : v.toPrecision(3));
  const lines = [
    `exactdraw check: overall false-positive rate ${report.alpha} (Bonferroni: ${report.perTestAlpha.toExponential(2)} per test, ${report.checked} samplers x 2 tests)`,
  ];
  for (const r of report.rows) {
    if (r.status === 'not-checked') {
      lines.push(`${report.requireAll ? 'FAIL' : '--  '} ${r.name.padEnd(46)} not checked (no cdf)`);
      continue;
    }
    const status = r.passed ? 'ok  ' : 'FAIL';
    lines.push(`${status} ${r.name.padEnd(46)} n=${r.n} KS p=${p(r.ksPValue)} AD p=${p(r.adPValue)}${r.error !== undefined ? ` error: ${r.error}` : ''}`);
    if (!r.passed) {
      const mod = moduleName === '' ? '' : ` ${shellQuote(moduleName)}`;
      lines.push(
        `     replay: exactdraw check${mod} --only ${shellQuote(r.name)} --seed ${r.seed} --draws ${r.n} --per-test-alpha ${report.perTestAlpha}   (stream: substream(${r.seed}, ${r.index}))`,
      );
    }
  }
  if (report.failure !== null) lines.push(`CHECK FAILED: ${report.failure}`);
  else lines.push(report.passed ? `all checks passed (${report.checked} checked${report.notChecked.length > 0 ? `, ${report.notChecked.length} not checked (no cdf)` : ''})` : 'CHECK FAILED');
  return lines.join('\n');
}
