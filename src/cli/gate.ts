/**
 * The statistics of `exactdraw bench` (pure functions, no clock, no I/O, so
 * that they are tested on made-up timings): per-round ratios to a reference
 * timed in the same rounds, their noise, the regression gate against a
 * baseline, and the harness self-check.
 *
 * @packageDocumentation
 */

/** Median of a non-empty list. */
export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/** A ratio measured round by round. */
export interface RatioSummary {
  /** Median of the per-round ratios. */
  ratio: number;
  /**
   * Robust standard error of log(ratio): 1.2533 · 1.4826 · MAD(log ratios) / √rounds
   * (the standard error of a median of normal data, with the MAD as the spread;
   * common practice).
   */
  logNoise: number;
}

/**
 * Summarises the per-round ratios `caseNs[k] / refNs[k]` of a case to a
 * reference timed in the same rounds (adjacent in time, so that the load of
 * the machine mostly cancels).
 *
 * @remarks
 * With `processes` = P > 1, round k was timed in process k mod P of the case
 * (and of the reference): the level of a process can differ from another's
 * by tens of per cent (JIT decisions, placement on the cores), more than the
 * rounds within one process show, so the rounds are not independent. The
 * ratio is then the median of the P process levels (each the median of its
 * own rounds' log ratios), and the noise is the larger of the rounds' robust
 * standard error and the standard error of that median from the spread of
 * the levels (1.2533 · sd(levels) / √P; common practice for a median of
 * normal data): a row whose processes disagree is reported as noisy instead
 * of passing or failing by the luck of which processes it got.
 */
export function roundRatios(caseNs: readonly number[], refNs: readonly number[], processes = 1): RatioSummary {
  if (caseNs.length !== refNs.length || caseNs.length === 0) throw new Error(`roundRatios: ${caseNs.length} case rounds vs ${refNs.length} reference rounds`);
  const logs = caseNs.map((c, k) => Math.log(c / refNs[k]));
  const m = median(logs);
  const mad = median(logs.map((l) => Math.abs(l - m)));
  const withinNoise = (1.2533 * 1.4826 * mad) / Math.sqrt(logs.length);
  const P = Math.min(Math.max(1, Math.floor(processes)), logs.length);
  if (P < 2) return { ratio: Math.exp(m), logNoise: withinNoise };
  const levels: number[] = [];
  for (let p = 0; p < P; p++) levels.push(median(logs.filter((_, k) => k % P === p)));
  const lm = median(levels);
  const mean = levels.reduce((a, b) => a + b, 0) / P;
  const sd = Math.sqrt(levels.reduce((a, b) => a + (b - mean) * (b - mean), 0) / (P - 1));
  return { ratio: Math.exp(lm), logNoise: Math.max(withinNoise, (1.2533 * sd) / Math.sqrt(P)) };
}

/** How many standard errors of the combined noise a regression must exceed to be told apart from noise. */
export const GATE_Z = 3;

/** The minimal row of a report that the gate reads. */
export interface GateRow {
  name: string;
  ratioToGate: number | null;
  gateLogNoise: number | null;
  nsPerDraw: number;
  evaluationsPerDraw: number | null;
  uniformsPerDraw: number | null;
}

/** Options of {@link gate}. */
export interface GateOptions {
  /** Relative slack on time ratios (0.2: a ratio may grow by 20 %). */
  tolerance: number;
  /** Relative slack on evaluations and uniforms per draw. */
  countTolerance: number;
  /** Also gate raw ns per draw (off by default: raw times drift with the machine's load). */
  gateTimes: boolean;
  /** Name of the gate reference (its own ratio is 1 and is not gated). */
  gateReference: string;
  /** Names deliberately not run (`--only`): absent from the run without being "missing". */
  skipped: ReadonlySet<string>;
}

/** One finding of the gate. */
export interface GateFinding {
  name: string;
  kind: 'regression' | 'missing' | 'new' | 'too-noisy' | 'not-run';
  metric?: 'ratioToGate' | 'nsPerDraw' | 'evaluationsPerDraw' | 'uniformsPerDraw';
  baseline?: number;
  current?: number;
  /** Smallest relative change the noise of this row lets the gate see. */
  resolvable?: number;
  message: string;
}

/** Result of {@link gate}. */
export interface GateResult {
  findings: GateFinding[];
  /** `'pass'`, `'regression'` (a gated metric grew beyond the tolerance and the noise, or a baseline row is missing), or `'too-noisy'` (no regression, but some row's noise exceeds the tolerance). */
  verdict: 'pass' | 'regression' | 'too-noisy';
}

const pct = (x: number): string => `${(100 * x).toFixed(1)} %`;

/**
 * Compares the rows of a run with a baseline's.
 *
 * Time is gated on each row's ratio to the gate reference (medians of
 * per-round ratios). A ratio regresses when it exceeds the baseline's by
 * more than `tolerance` and by more than the noise (`GATE_Z` combined
 * standard errors of this run and the baseline), so that noise alone is
 * flagged with probability below 0.2 % per row. When the noise exceeds the
 * tolerance, the row is reported `too-noisy`: a regression of the
 * tolerance's size could not be told from noise there. Counts are deterministic for a seed and are
 * gated with `countTolerance`. A baseline row absent from the run (renamed
 * or deleted) is `missing`, a row absent from the baseline `new`.
 */
export function gate(current: readonly GateRow[], baseline: readonly GateRow[], opts: GateOptions): GateResult {
  const findings: GateFinding[] = [];
  const cur = new Map(current.map((r) => [r.name, r]));
  const base = new Map(baseline.map((r) => [r.name, r]));
  const limit = Math.log1p(opts.tolerance);
  for (const b of baseline) {
    if (cur.has(b.name)) continue;
    if (opts.skipped.has(b.name)) findings.push({ name: b.name, kind: 'not-run', message: `not run (--only): ${b.name}` });
    else findings.push({ name: b.name, kind: 'missing', message: `MISSING ${b.name}: in the baseline but not in this run (renamed or removed? refresh the baseline with --out)` });
  }
  for (const r of current) {
    const b = base.get(r.name);
    if (b === undefined) {
      findings.push({ name: r.name, kind: 'new', message: `new row ${r.name}: not in the baseline, not gated` });
      continue;
    }
    if (r.name !== opts.gateReference && r.ratioToGate !== null && b.ratioToGate !== null && r.gateLogNoise !== null && b.gateLogNoise !== null) {
      const noise = GATE_Z * Math.hypot(r.gateLogNoise, b.gateLogNoise);
      const delta = Math.log(r.ratioToGate / b.ratioToGate);
      if (delta > limit && delta > noise) {
        findings.push({
          name: r.name,
          kind: 'regression',
          metric: 'ratioToGate',
          baseline: b.ratioToGate,
          current: r.ratioToGate,
          resolvable: Math.expm1(noise),
          message: `REGRESSION ${r.name}: time ratio to '${opts.gateReference}' ${r.ratioToGate.toPrecision(4)} vs baseline ${b.ratioToGate.toPrecision(4)} (+${pct(Math.expm1(delta))}, tolerance ${pct(opts.tolerance)}, noise ±${pct(Math.expm1(noise))})`,
        });
      } else if (noise >= limit) {
        findings.push({
          name: r.name,
          kind: 'too-noisy',
          metric: 'ratioToGate',
          baseline: b.ratioToGate,
          current: r.ratioToGate,
          resolvable: Math.expm1(noise),
          message: `TOO NOISY ${r.name}: ratio ${r.ratioToGate.toPrecision(4)} vs baseline ${b.ratioToGate.toPrecision(4)}; the noise of this run and the baseline (${GATE_Z} standard errors: ${pct(Math.expm1(noise))}) exceeds the tolerance ${pct(opts.tolerance)}, so only a change beyond the noise is flagged (use more --rounds or --draws, or a quieter machine)`,
        });
      }
    }
    if (opts.gateTimes && r.nsPerDraw > b.nsPerDraw * (1 + opts.tolerance)) {
      findings.push({ name: r.name, kind: 'regression', metric: 'nsPerDraw', baseline: b.nsPerDraw, current: r.nsPerDraw, message: `REGRESSION ${r.name}: nsPerDraw ${r.nsPerDraw.toPrecision(4)} vs baseline ${b.nsPerDraw.toPrecision(4)} (raw time, tolerance ${pct(opts.tolerance)})` });
    }
    for (const metric of ['evaluationsPerDraw', 'uniformsPerDraw'] as const) {
      const c = r[metric];
      const bb = b[metric];
      if (c !== null && bb !== null && c > bb * (1 + opts.countTolerance) + 1e-9) {
        findings.push({ name: r.name, kind: 'regression', metric, baseline: bb, current: c, message: `REGRESSION ${r.name}: ${metric} ${c.toPrecision(4)} vs baseline ${bb.toPrecision(4)} (count tolerance ${pct(opts.countTolerance)})` });
      }
    }
  }
  const verdict = findings.some((f) => f.kind === 'regression' || f.kind === 'missing') ? 'regression' : findings.some((f) => f.kind === 'too-noisy') ? 'too-noisy' : 'pass';
  return { findings, verdict };
}

/** Result of {@link selfCheck}. */
export interface SelfCheck {
  /** Median ns per draw of the raw-uniform case in the harness. */
  harnessNs: number;
  /** Median ns per draw of the same loop alone in a fresh process. */
  aloneNs: number;
  /** `harnessNs / aloneNs - 1`. */
  difference: number;
  /** The allowed |difference| (0.1). */
  tolerance: number;
  /** True when |difference| ≤ tolerance. */
  ok: boolean;
  message: string;
}

/** Tolerance of the harness self-check. */
export const SELF_CHECK_TOLERANCE = 0.1;

/**
 * The harness self-check: the raw-uniform case timed in the harness must
 * agree within `tolerance` with the same loop timed alone in a fresh process;
 * otherwise the harness distorts timings and the message says so.
 */
export function selfCheck(harnessRoundsNs: readonly number[], aloneRoundsNs: readonly number[], tolerance = SELF_CHECK_TOLERANCE): SelfCheck {
  const harnessNs = median(harnessRoundsNs);
  const aloneNs = median(aloneRoundsNs);
  const difference = harnessNs / aloneNs - 1;
  const ok = Math.abs(difference) <= tolerance;
  const sign = difference >= 0 ? '+' : '';
  const figures = `raw uniform ${harnessNs.toFixed(2)} ns/draw in the harness vs ${aloneNs.toFixed(2)} alone in a fresh process (${sign}${pct(difference)})`;
  const message = ok
    ? `self-check ok: ${figures}, within ${pct(tolerance)}`
    : `SELF-CHECK FAILED: ${figures}, beyond ${pct(tolerance)}: the harness (or the machine's load) distorts this run's timings`;
  return { harnessNs, aloneNs, difference, tolerance, ok, message };
}
