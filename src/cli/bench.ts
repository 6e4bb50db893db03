/**
 * `exactdraw bench`: ns per draw, ratios to references timed in the same
 * rounds, acceptance, evaluations and uniforms per draw, as a table or JSON,
 * with a regression gate against a baseline file.
 *
 * Harness: every case runs in a child process of its own (a fresh V8, so no
 * call site is shared between generators and none becomes megamorphic, as
 * happens when one loop calls several generators). The parent interleaves the
 * rounds: round r times every case once, one after the other (the starting
 * case rotates), so a case and its reference are timed moments apart and the
 * machine's load mostly cancels in their ratio. A self-check times the raw
 * uniform alone in a fresh process and compares.
 *
 * @packageDocumentation
 */
import { fork } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { substream } from '../random/substream.js';
import type { Sampler, Uniform } from '../core/types.js';
import { builtinSuite } from './builtin.js';
import type { BuiltinEntry } from './builtin.js';
import { loadSuite } from '../node/suite.js';
import { median, roundRatios, selfCheck } from './gate.js';
import type { GateRow, SelfCheck } from './gate.js';

/** JSON schema tag of bench reports. */
export const BENCH_SCHEMA = 'exactdraw-bench/2';

/** One case to time. */
export interface BenchCase {
  name: string;
  /** Stream index: the case draws from substream(seed, index). */
  index: number;
  peer: boolean;
  reference: string | null;
  /** Where the child finds the entry: the built-in suite, or a module URL. */
  module: string | null;
  /** Draws per round for this case (the gibbs case draws fewer, each being a fresh setup). */
  draws: number;
}

/** Options of {@link runBench}. */
export interface BenchOptions {
  /** Draws per round. */
  draws: number;
  /** Timed rounds after warm-up. */
  rounds: number;
  /** Seed of the uniform streams (entry i uses substream(seed, i)). */
  seed: number;
  /** Name of the row every row's ratio is gated on. */
  gateReference: string;
  /** Script that runs a case when started with the argument `__bench-case` (the command's own main.js). */
  childScript: string;
  /** Run the harness self-check (default true). */
  selfCheck?: boolean;
  /** Version of exactdraw recorded in the report. */
  version: string;
  /** Called with a progress line. */
  progress?: (line: string) => void;
}

/** One row of the benchmark report (JSON schema `exactdraw-bench/2`). */
export interface BenchRow extends GateRow {
  name: string;
  peer: boolean;
  /** Stream index (substream(seed, index)). */
  index: number;
  /** Draws per round of this row. */
  draws: number;
  /** Median over the rounds of CPU ns per draw (reported, gated only with --gate-times). */
  nsPerDraw: number;
  /** CPU ns per draw of each round (the fastest of its fills). */
  roundsNs: number[];
  /** Median over the rounds of wall-clock ns per draw (reported only). */
  wallNsPerDraw: number;
  /** Median of per-round ratios to the gate reference. */
  ratioToGate: number | null;
  /** Robust standard error of log(ratioToGate). */
  gateLogNoise: number | null;
  acceptanceRate: number | null;
  evaluationsPerDraw: number | null;
  /** Calls of the uniform source per draw (null when the sampler owns its stream: see uniformsNote). */
  uniformsPerDraw: number | null;
  uniformsNote: string | null;
  setupEvaluations: number | null;
  setupMs: number;
  reference: string | null;
  /** Median of per-round ratios to `reference`. */
  ratioToReference: number | null;
}

/** The benchmark report (JSON schema `exactdraw-bench/2`). */
export interface BenchReport {
  schema: typeof BENCH_SCHEMA;
  exactdraw: string;
  node: string;
  cpu: string;
  platform: string;
  draws: number;
  rounds: number;
  seed: number;
  gateReference: string;
  /** Names selected with --only (null: all). */
  only: string[] | null;
  selfCheck: SelfCheck | null;
  rows: BenchRow[];
}

/** What the child reports at the end. */
interface ChildDone {
  type: 'done';
  acceptanceRate: number | null;
  evaluationsPerDraw: number | null;
  uniformsPerDraw: number | null;
  uniformsNote: string | null;
  setupEvaluations: number | null;
}

type ChildMessage =
  | { type: 'ready'; setupMs: number }
  | { type: 'round'; ns: number; wallNs: number }
  | { type: 'alone'; roundsNs: number[] }
  | ChildDone
  | { type: 'error'; message: string };

/** A child process running one case, answering one request at a time. */
class CaseProcess {
  private readonly child: ChildProcess;
  private waiting: { resolve: (m: ChildMessage) => void; reject: (e: Error) => void } | null = null;
  private readonly queue: ChildMessage[] = [];
  private dead: Error | null = null;

  constructor(script: string, readonly c: BenchCase, seed: number, mode: 'interleaved' | 'alone', rounds: number) {
    this.child = fork(script, ['__bench-case'], { stdio: ['ignore', 'ignore', 'inherit', 'ipc'], serialization: 'json' });
    this.child.on('message', (m: ChildMessage) => {
      const w = this.waiting;
      this.waiting = null;
      if (w === null) {
        this.queue.push(m);
        return;
      }
      if (m.type === 'error') w.reject(new Error(`exactdraw bench: '${this.c.name}': ${m.message}`));
      else w.resolve(m);
    });
    this.child.on('exit', (code) => {
      this.dead ??= new Error(`exactdraw bench: the process timing '${this.c.name}' exited with code ${String(code)}`);
      const w = this.waiting;
      this.waiting = null;
      w?.reject(this.dead);
    });
    this.child.send({ type: 'init', case: c, seed, mode, rounds });
  }

  /** Sends a request (or none) and waits for the next message. */
  next(request?: object): Promise<ChildMessage> {
    const queued = this.queue.shift();
    if (queued !== undefined) {
      if (request !== undefined) this.child.send(request);
      return queued.type === 'error' ? Promise.reject(new Error(`exactdraw bench: '${this.c.name}': ${queued.message}`)) : Promise.resolve(queued);
    }
    if (this.dead !== null) return Promise.reject(this.dead);
    return new Promise((resolve, reject) => {
      this.waiting = { resolve, reject };
      if (request !== undefined) this.child.send(request);
    });
  }

  kill(): void {
    this.dead ??= new Error('killed');
    if (this.child.exitCode === null) this.child.kill();
  }
}

async function expect<T extends ChildMessage['type']>(p: Promise<ChildMessage>, type: T): Promise<Extract<ChildMessage, { type: T }>> {
  const m = await p;
  if (m.type !== type) throw new Error(`exactdraw bench: internal: expected '${type}', got '${m.type}'`);
  return m as Extract<ChildMessage, { type: T }>;
}

/** Runs the cases (one child process each, rounds interleaved) and returns the report. */
export async function runBench(cases: BenchCase[], opts: BenchOptions, only: string[] | null = null): Promise<BenchReport> {
  const procs: CaseProcess[] = [];
  const P = Math.max(1, Math.min(REPLICAS, opts.rounds));
  try {
    // P processes per case (a process's level can differ from another's by tens of per cent: JIT
    // decisions, placement); round r times replica r mod P of every case, so the spread of the
    // per-round ratios includes that variation. Start at most two at a time; each builds its sampler and warms up.
    const all: Array<{ k: number; p: number }> = [];
    for (let k = 0; k < cases.length; k++) for (let p = 0; p < P; p++) all.push({ k, p });
    const grid: CaseProcess[][] = cases.map(() => []);
    const setupMs: number[][] = cases.map(() => []);
    for (let i = 0; i < all.length; i += 2) {
      const batch = all.slice(i, i + 2).map(({ k, p }) => {
        const proc = new CaseProcess(opts.childScript, cases[k], opts.seed, 'interleaved', opts.rounds);
        grid[k][p] = proc;
        procs.push(proc);
        return { k, proc };
      });
      opts.progress?.(`starting ${Math.min(i + 2, all.length)}/${all.length} processes: ${batch.map((b) => b.proc.c.name).join(', ')}`);
      const msgs = await Promise.all(batch.map((b) => expect(b.proc.next(), 'ready')));
      msgs.forEach((m, j) => setupMs[batch[j].k].push(m.setupMs));
    }
    const ready = setupMs.map((xs) => median(xs));
    const roundsNs: number[][] = cases.map(() => []);
    const wallNs: number[][] = cases.map(() => []);
    for (let r = 0; r < opts.rounds; r++) {
      opts.progress?.(`round ${r + 1}/${opts.rounds}`);
      for (let j = 0; j < cases.length; j++) {
        const k = (j + r) % cases.length;
        const m = await expect(grid[k][r % P].next({ type: 'round' }), 'round');
        roundsNs[k].push(m.ns);
        wallNs[k].push(m.wallNs);
      }
    }
    const done = await Promise.all(grid.map((g) => expect(g[0].next({ type: 'finish' }), 'done')));
    for (const g of grid) for (const p of g.slice(1)) p.kill();
    let check: SelfCheck | null = null;
    const gateIndex = cases.findIndex((c) => c.name === opts.gateReference);
    const uniformIndex = cases.findIndex((c) => c.module === null && c.name === RAW_UNIFORM);
    if (opts.selfCheck !== false && uniformIndex >= 0) {
      opts.progress?.('self-check: the raw uniform alone in a fresh process');
      const alone = new CaseProcess(opts.childScript, cases[uniformIndex], opts.seed, 'alone', opts.rounds);
      procs.push(alone);
      const m = await expect(alone.next(), 'alone');
      check = selfCheck(roundsNs[uniformIndex], m.roundsNs);
    }
    const rows: BenchRow[] = cases.map((c, k) => {
      const d = done[k];
      const toGate = gateIndex >= 0 ? roundRatios(roundsNs[k], roundsNs[gateIndex], P) : null;
      const refIndex = c.reference === null ? -1 : cases.findIndex((x) => x.name === c.reference);
      return {
        name: c.name,
        peer: c.peer,
        index: c.index,
        draws: c.draws,
        nsPerDraw: median(roundsNs[k]),
        roundsNs: roundsNs[k],
        wallNsPerDraw: median(wallNs[k]),
        ratioToGate: toGate?.ratio ?? null,
        gateLogNoise: toGate?.logNoise ?? null,
        acceptanceRate: d.acceptanceRate,
        evaluationsPerDraw: d.evaluationsPerDraw,
        uniformsPerDraw: d.uniformsPerDraw,
        uniformsNote: d.uniformsNote,
        setupEvaluations: d.setupEvaluations,
        setupMs: ready[k],
        reference: c.reference,
        ratioToReference: refIndex >= 0 ? roundRatios(roundsNs[k], roundsNs[refIndex], P).ratio : null,
      };
    });
    return {
      schema: BENCH_SCHEMA,
      exactdraw: opts.version,
      node: process.version,
      cpu: cpus()[0]?.model ?? 'unknown',
      platform: `${process.platform}-${process.arch}`,
      draws: opts.draws,
      rounds: opts.rounds,
      seed: opts.seed,
      gateReference: opts.gateReference,
      only,
      selfCheck: check,
      rows,
    };
  } finally {
    for (const p of procs) p.kill();
  }
}

/** Processes per case (rounds rotate over them). */
export const REPLICAS = 6;

/** Name of the raw uniform row (the default gate reference, always run). */
export const RAW_UNIFORM = 'mt19937 uniform (raw)';

/** Formats the report as a text table. */
export function formatBench(report: BenchReport): string {
  const pad = (s: string, n: number): string => s.padEnd(n);
  const num = (x: number | null, d: number): string => (x === null ? '-' : x.toFixed(d));
  const lines = [
    `exactdraw bench: ${report.draws} draws x ${report.rounds} rounds (ns/draw: process CPU time, median over rounds of the fastest fill of each round; counts: a fresh sampler over one round's draws), each case in ${REPLICAS} processes of its own, rounds interleaved; exactdraw ${report.exactdraw}, node ${report.node}, ${report.cpu}, seed ${report.seed}`,
    pad('case', 46) + pad('ns/draw', 10) + pad('wall ns', 10) + pad('x gate', 8) + pad('±noise', 8) + pad('accept', 8) + pad('evals/draw', 11) + pad('unif/draw', 10) + pad('setup ms', 9) + pad('x ref', 7) + 'reference',
  ];
  for (const r of report.rows) {
    const noise = r.gateLogNoise === null || r.name === report.gateReference ? '-' : `${(100 * Math.expm1(r.gateLogNoise)).toFixed(1)}%`;
    lines.push(
      pad(r.name, 46) + pad(num(r.nsPerDraw, 1), 10) + pad(num(r.wallNsPerDraw, 1), 10) + pad(num(r.ratioToGate, 3), 8) + pad(noise, 8) + pad(num(r.acceptanceRate, 4), 8) + pad(num(r.evaluationsPerDraw, 3), 11) +
        pad(r.uniformsPerDraw === null ? (r.uniformsNote === null ? '-' : 'own') : r.uniformsPerDraw.toFixed(3), 10) + pad(num(r.setupMs, 1), 9) + pad(num(r.ratioToReference, 2), 7) + (r.reference ?? ''),
    );
  }
  lines.push(`x gate: median of per-round time ratios to '${report.gateReference}'; ±noise: its standard error; unif/draw 'own': the sampler owns its stream (not counted)`);
  if (report.selfCheck !== null) lines.push(report.selfCheck.message);
  return lines.join('\n');
}

/**
 * Reads and validates a baseline file before the run.
 * @throws Error naming the file and what is wrong
 */
export function readBaseline(path: string): BenchReport {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new BaselineError(`exactdraw bench: cannot read the baseline ${path}: ${(e as Error).message}`);
  }
  let v: Partial<BenchReport>;
  try {
    v = JSON.parse(text) as Partial<BenchReport>;
  } catch (e) {
    throw new BaselineError(`exactdraw bench: the baseline ${path} is not JSON: ${(e as Error).message}`);
  }
  if (v === null || typeof v !== 'object' || v.schema !== BENCH_SCHEMA || !Array.isArray(v.rows)) {
    const got = v !== null && typeof v === 'object' ? String((v as { schema?: unknown }).schema) : typeof v;
    throw new BaselineError(`exactdraw bench: the baseline ${path} is not an ${BENCH_SCHEMA} report (schema ${got}); make one with exactdraw bench --out FILE`);
  }
  for (const [i, r] of v.rows.entries()) {
    if (r === null || typeof r !== 'object' || typeof r.name !== 'string' || typeof r.nsPerDraw !== 'number') {
      throw new BaselineError(`exactdraw bench: the baseline ${path} has a malformed row ${i}`);
    }
  }
  return v as BenchReport;
}

/** A baseline that cannot be used (exit 2, before the run). */
export class BaselineError extends Error {}

// ---------------------------------------------------------------- child side

/** Wraps a uniform source, counting calls. */
function counting(u: Uniform): { u: Uniform; calls: () => number } {
  let n = 0;
  return {
    u: () => {
      n++;
      return u();
    },
    calls: () => n,
  };
}

async function findCase(c: BenchCase): Promise<BuiltinEntry> {
  const entries: BuiltinEntry[] = c.module === null ? builtinSuite() : await loadSuite(c.module, 'exactdraw bench');
  const e = entries.find((x) => x.name === c.name);
  if (e === undefined) throw new Error(`no entry named '${c.name}'`);
  return e;
}

/** Fills per round, at least; a round reports the fastest (interruptions only ever add time). */
export const FILLS_PER_ROUND = 3;
/** A round repeats fills until it has used this much CPU time (ms), so that short fills are timed many times. */
export const ROUND_CPU_MS = 20;

/**
 * Times at least `FILLS_PER_ROUND` fills, and more until the round has used
 * `ROUND_CPU_MS` of CPU time (at most 1000); returns the fastest in CPU time
 * of this process (user + system, µs resolution) and in wall time, as ns per draw.
 * CPU time does not count the time the process waits for a core, which on a
 * shared machine is most of the noise of wall time.
 */
function timedFill(s: Sampler, out: Float64Array, name: string): { cpu: number; wall: number } {
  let cpu = Infinity;
  let wall = Infinity;
  let used = 0;
  for (let k = 0; k < 1000 && (k < FILLS_PER_ROUND || used < ROUND_CPU_MS * 1e6); k++) {
    const c0 = process.cpuUsage();
    const a = performance.now();
    s.fill(out);
    const b = performance.now();
    const c1 = process.cpuUsage(c0);
    let sum = 0;
    for (let i = 0; i < out.length; i += 97) sum += out[i];
    if (!Number.isFinite(sum)) throw new Error(`'${name}' produced a non-finite draw`);
    const ns = (c1.user + c1.system) * 1e3;
    used += ns;
    cpu = Math.min(cpu, ns);
    wall = Math.min(wall, (b - a) * 1e6);
  }
  return { cpu: cpu / out.length, wall: wall / out.length };
}

/**
 * The body of a case process (`main.js __bench-case`): builds the sampler,
 * warms up, then times one round per request; at the end counts uniforms per
 * draw on a fresh sampler.
 */
export function runBenchChild(): void {
  const send = (m: ChildMessage): Promise<void> =>
    new Promise((resolve) => {
      if (process.send === undefined) resolve();
      else process.send(m, undefined, {}, () => resolve());
    });
  let sampler: Sampler | undefined;
  let entry: BuiltinEntry | undefined;
  let c: BenchCase | undefined;
  let seed = 0;
  let out = new Float64Array(1);
  process.on('message', (msg: { type: string; case?: BenchCase; seed?: number; mode?: string; rounds?: number }) => {
    const handle = async (): Promise<void> => {
      if (msg.type === 'init') {
        c = msg.case as BenchCase;
        seed = msg.seed as number;
        entry = await findCase(c);
        out = new Float64Array(c.draws);
        const t0 = performance.now();
        sampler = entry.create(substream(seed, c.index), { seed, stream: c.index });
        const setupMs = performance.now() - t0;
        sampler.fill(out); // warm-up (also adapts adaptive samplers)
        sampler.fill(out);
        if (msg.mode === 'alone') {
          const roundsNs: number[] = [];
          for (let r = 0; r < (msg.rounds as number); r++) roundsNs.push(timedFill(sampler, out, c.name).cpu);
          await send({ type: 'alone', roundsNs });
          process.exit(0);
        }
        await send({ type: 'ready', setupMs });
      } else if (msg.type === 'round') {
        const t = timedFill(sampler as Sampler, out, (c as BenchCase).name);
        await send({ type: 'round', ns: t.cpu, wallNs: t.wall });
      } else if (msg.type === 'finish') {
        // counts from a fresh sampler over one round's draws: deterministic for a seed and --draws
        // (the timed sampler made as many fills as the clock allowed)
        const e = entry as BuiltinEntry;
        const cc = c as BenchCase;
        const cnt = counting(substream(seed, cc.index));
        const fresh = e.create(cnt.u, { seed, stream: cc.index });
        const n = cc.draws;
        fresh.fill(new Float64Array(n));
        const st = fresh.stats;
        const owns = cnt.calls() === 0;
        await send({
          type: 'done',
          acceptanceRate: e.peer === true ? null : st.acceptanceRate,
          evaluationsPerDraw: e.peer === true ? null : st.densityEvaluations / st.samples,
          uniformsPerDraw: owns ? null : cnt.calls() / n,
          uniformsNote: owns ? 'owns its stream (uniforms not counted)' : null,
          setupEvaluations: e.peer === true ? null : st.setupEvaluations,
        });
        process.exit(0);
      }
    };
    handle().catch(async (err: unknown) => {
      await send({ type: 'error', message: err instanceof Error ? err.message : String(err) });
      process.exit(1);
    });
  });
}
