/**
 * `exactdraw check`: KS and Anderson–Darling for every suite entry with a cdf,
 * with fixed seeds and a stated overall false-positive rate.
 *
 * @packageDocumentation
 */
import { andersonDarlingCheck } from '../checks/anderson-darling.js';
import { ksCheck } from '../checks/ks.js';
import { substream } from '../random/substream.js';
import type { SuiteEntry } from '../node/suite.js';

/** Options of {@link runCheck}. */
export interface CheckOptions {
  /** Draws per entry. */
  n: number;
  /** Seed; entry i draws from substream(seed, i). */
  seed: number;
  /** Overall false-positive rate for the whole run (Bonferroni over 2 tests per entry). */
  alpha: number;
  /** Substring filter on names. */
  only?: string;
}

/** Result for one entry. */
export interface CheckRow {
  name: string;
  n: number;
  seed: number;
  index: number;
  ksPValue: number;
  adPValue: number;
  passed: boolean;
  error?: string;
}

/** Result of a check run. */
export interface CheckReport {
  schema: 'exactdraw-check/1';
  alpha: number;
  perTestAlpha: number;
  rows: CheckRow[];
  passed: boolean;
}

/** Runs the checks. */
export function runCheck(entries: SuiteEntry[], opts: CheckOptions): CheckReport {
  const selected = entries.filter((e) => e.cdf !== undefined && (!opts.only || e.name.includes(opts.only)));
  const tests = Math.max(1, 2 * selected.length);
  const perTestAlpha = opts.alpha / tests;
  const rows: CheckRow[] = [];
  for (const e of selected) {
    const index = entries.indexOf(e);
    const cdf = e.cdf!.bind(e);
    try {
      const s = e.create(substream(opts.seed, index), { seed: opts.seed, stream: index });
      const x = s.fill(new Float64Array(opts.n));
      const ks = ksCheck(x, cdf);
      const ad = andersonDarlingCheck(x, cdf);
      rows.push({ name: e.name, n: opts.n, seed: opts.seed, index, ksPValue: ks.pValue, adPValue: ad.pValue, passed: ks.pValue > perTestAlpha && ad.pValue > perTestAlpha });
    } catch (err) {
      rows.push({ name: e.name, n: opts.n, seed: opts.seed, index, ksPValue: NaN, adPValue: NaN, passed: false, error: String(err) });
    }
  }
  return { schema: 'exactdraw-check/1', alpha: opts.alpha, perTestAlpha, rows, passed: rows.every((r) => r.passed) };
}

/** Formats a check report. */
export function formatCheck(report: CheckReport, moduleName: string): string {
  const lines = [
    `exactdraw check: overall false-positive rate ${report.alpha} (Bonferroni: ${report.perTestAlpha.toExponential(2)} per test, ${report.rows.length} samplers x 2 tests)`,
  ];
  for (const r of report.rows) {
    const status = r.passed ? 'ok  ' : 'FAIL';
    lines.push(`${status} ${r.name.padEnd(46)} n=${r.n} KS p=${r.ksPValue.toPrecision(3)} AD p=${r.adPValue.toPrecision(3)}${r.error ? ` error: ${r.error}` : ''}`);
    if (!r.passed) {
      lines.push(`     replay: exactdraw check ${moduleName} --only '${r.name}' --seed ${r.seed} --n ${r.n}   (stream: substream(${r.seed}, ${r.index}))`);
    }
  }
  lines.push(report.passed ? 'all checks passed' : 'CHECK FAILED');
  return lines.join('\n');
}
