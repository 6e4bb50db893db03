/**
 * `exactdraw bench`: ns per draw (median of rounds after warm-up), acceptance,
 * evaluations per draw and ratios to a reference, as a table or JSON, with an
 * optional regression gate against a baseline file.
 *
 * @packageDocumentation
 */
import { readFileSync } from 'node:fs';
import { substream } from '../random/substream.js';
import type { BuiltinEntry } from './builtin.js';

/** Options of {@link runBench}. */
export interface BenchOptions {
  /** Draws per round. */
  draws: number;
  /** Timed rounds after warm-up. */
  rounds: number;
  /** Seed of the uniform streams (entry i uses substream(seed, i)). */
  seed: number;
  /** Substring filter on entry names. */
  only?: string;
  /** Called with a progress line on long runs. */
  progress?: (line: string) => void;
}

/** One row of the benchmark report (the `rows` of the JSON schema `exactdraw-bench/1`). */
export interface BenchRow {
  name: string;
  peer: boolean;
  nsPerDraw: number;
  roundsNs: number[];
  acceptanceRate: number | null;
  evaluationsPerDraw: number | null;
  setupEvaluations: number | null;
  setupMs: number;
  reference: string | null;
  ratioToReference: number | null;
}

/** The benchmark report (JSON schema `exactdraw-bench/1`). */
export interface BenchReport {
  schema: 'exactdraw-bench/1';
  node: string;
  draws: number;
  rounds: number;
  seed: number;
  rows: BenchRow[];
}

/** Runs the suite and returns the report. */
export function runBench(entries: BuiltinEntry[], opts: BenchOptions): BenchReport {
  const rows: BenchRow[] = [];
  const selected = entries.filter((e) => !opts.only || e.name.includes(opts.only));
  const out = new Float64Array(opts.draws);
  selected.forEach((e, k) => {
    const index = entries.indexOf(e);
    const t0 = performance.now();
    const s = e.create(substream(opts.seed, index), { seed: opts.seed, stream: index });
    const setupMs = performance.now() - t0;
    s.fill(out); // warm-up (also adapts adaptive samplers)
    s.fill(out);
    const roundsNs: number[] = [];
    for (let r = 0; r < opts.rounds; r++) {
      opts.progress?.(`[${k + 1}/${selected.length}] ${e.name}: round ${r + 1}/${opts.rounds}`);
      const a = performance.now();
      s.fill(out);
      const b = performance.now();
      let sum = 0;
      for (let i = 0; i < out.length; i += 97) sum += out[i];
      if (!Number.isFinite(sum)) throw new Error(`exactdraw bench: '${e.name}' produced a non-finite draw`);
      roundsNs.push(((b - a) * 1e6) / opts.draws);
    }
    const sorted = [...roundsNs].sort((x, y) => x - y);
    const st = s.stats;
    const peer = e.peer === true;
    rows.push({
      name: e.name,
      peer,
      nsPerDraw: sorted[Math.floor(sorted.length / 2)],
      roundsNs,
      acceptanceRate: peer ? null : st.acceptanceRate,
      evaluationsPerDraw: peer ? null : st.densityEvaluations / st.samples,
      setupEvaluations: peer ? null : st.setupEvaluations,
      setupMs,
      reference: e.reference ?? null,
      ratioToReference: null,
    });
  });
  const byName = new Map(rows.map((r) => [r.name, r]));
  for (const r of rows) {
    const ref = r.reference === null ? undefined : byName.get(r.reference);
    if (ref !== undefined) r.ratioToReference = r.nsPerDraw / ref.nsPerDraw;
  }
  return { schema: 'exactdraw-bench/1', node: process.version, draws: opts.draws, rounds: opts.rounds, seed: opts.seed, rows };
}

/** Formats the report as a text table. */
export function formatBench(report: BenchReport): string {
  const pad = (s: string, n: number): string => s.padEnd(n);
  const num = (x: number | null, d: number): string => (x === null ? '-' : x.toFixed(d));
  const lines = [
    `exactdraw bench: ${report.draws} draws x ${report.rounds} rounds (median ns/draw), node ${report.node}, seed ${report.seed}`,
    pad('case', 46) + pad('ns/draw', 10) + pad('accept', 9) + pad('evals/draw', 12) + pad('setup ms', 10) + pad('x ref', 8) + 'reference',
  ];
  for (const r of report.rows) {
    lines.push(
      pad(r.name, 46) + pad(num(r.nsPerDraw, 1), 10) + pad(num(r.acceptanceRate, 4), 9) + pad(num(r.evaluationsPerDraw, 4), 12) +
        pad(num(r.setupMs, 2), 10) + pad(num(r.ratioToReference, 2), 8) + (r.reference ?? ''),
    );
  }
  return lines.join('\n');
}

/** A regression found by {@link compareBaseline}. */
export interface Regression {
  name: string;
  metric: 'ratioToReference' | 'nsPerDraw' | 'evaluationsPerDraw';
  baseline: number;
  current: number;
}

/**
 * Compares a report with a baseline report. A row regresses when its time
 * ratio to its reference (or, without a reference, its ns per draw) or its
 * evaluations per draw exceed the baseline by more than `tolerance`
 * (relative; `countTolerance` for the counts). Ratios are compared in preference to raw times because they
 * transfer between machines better.
 */
export function compareBaseline(report: BenchReport, baseline: BenchReport, tolerance: number, countTolerance: number = tolerance): Regression[] {
  const out: Regression[] = [];
  const base = new Map(baseline.rows.map((r) => [r.name, r]));
  for (const r of report.rows) {
    const b = base.get(r.name);
    if (b === undefined) continue;
    if (r.ratioToReference !== null && b.ratioToReference !== null) {
      if (r.ratioToReference > b.ratioToReference * (1 + tolerance)) out.push({ name: r.name, metric: 'ratioToReference', baseline: b.ratioToReference, current: r.ratioToReference });
    } else if (r.nsPerDraw > b.nsPerDraw * (1 + tolerance)) {
      out.push({ name: r.name, metric: 'nsPerDraw', baseline: b.nsPerDraw, current: r.nsPerDraw });
    }
    if (r.evaluationsPerDraw !== null && b.evaluationsPerDraw !== null && r.evaluationsPerDraw > b.evaluationsPerDraw * (1 + countTolerance) + 1e-9) {
      out.push({ name: r.name, metric: 'evaluationsPerDraw', baseline: b.evaluationsPerDraw, current: r.evaluationsPerDraw });
    }
  }
  return out;
}

/** Reads and validates a baseline file. */
export function readBaseline(path: string): BenchReport {
  const v = JSON.parse(readFileSync(path, 'utf8')) as Partial<BenchReport>;
  if (v.schema !== 'exactdraw-bench/1' || !Array.isArray(v.rows)) {
    throw new Error(`exactdraw bench: ${path} is not an exactdraw-bench/1 report`);
  }
  return v as BenchReport;
}
