// Shared machinery of the bench/*.mjs scripts. Timing rule (DEVELOPERS.md,
// benchmark policy): each case's `make()` returns a fill function with the
// per-draw loop written out in that case's own code, as a user would write it,
// so no per-draw call site is shared between generators (V8 makes a call site
// that sees several generator closures megamorphic, about 10 ns per call here).
// This module only calls `fill(out)` once per round (one call per 1e6 draws).
import { execFileSync } from 'node:child_process';
import os from 'node:os';
import { median, selfCheck } from './self-check.mjs';

export { median, selfCheck };

/** Reads `--name value` from argv. */
export function option(args, name, def) {
  const i = args.indexOf(name);
  return i >= 0 && i + 1 < args.length ? args[i + 1] : def;
}

/** Throws when `out` holds a non-finite value (checked on a stride, so the fill cannot be optimised away). */
export function guard(name, out, stride = 97) {
  let sum = 0;
  for (let i = 0; i < out.length; i += stride) sum += out[i];
  if (!Number.isFinite(sum)) throw new Error(`${name}: non-finite draw`);
  return sum;
}

/** The load line every benchmark prints (the machine may be shared). */
export function loadLine(when) {
  return `# load average ${when}: ${os.loadavg().map((x) => x.toFixed(2)).join(', ')} (${os.availableParallelism()} cores)`;
}

/** The machine line. */
export function machineLine() {
  return `# node ${process.version}, ${os.cpus()[0]?.model ?? 'cpu'} x ${os.cpus().length}, ${new Date().toISOString()}`;
}

/**
 * Times `cases` ([{ name, fill, size? }]) in interleaved rounds: two warm-up fills
 * per case, then every round runs each case once in the same order, with the NaN
 * guard after each fill. `between(r)` runs after round r (e.g. a fresh-process
 * reference run, so that it interleaves with the rounds). Returns
 * [{ name, ns, rounds }] with ns per element (median over rounds).
 */
export function timeInterleaved(cases, { size, rounds, between }) {
  const bufs = cases.map((c) => new Float64Array(c.size ?? size));
  cases.forEach((c, k) => {
    c.fill(bufs[k]);
    c.fill(bufs[k]);
  });
  const t = cases.map(() => []);
  for (let r = 0; r < rounds; r++) {
    cases.forEach((c, k) => {
      const out = bufs[k];
      const a = performance.now();
      c.fill(out);
      const b = performance.now();
      guard(c.name, out);
      t[k].push(((b - a) * 1e6) / out.length);
    });
    if (between) between(r);
  }
  return cases.map((c, k) => ({ name: c.name, ns: median(t[k]), rounds: t[k] }));
}

/**
 * Runs `script --case NAME --size N --rounds R` in a fresh Node process and returns
 * the median ns per element it reports (the script builds that case only).
 */
export function timeAlone(script, name, size, rounds, extra = []) {
  return timeAloneFull(script, name, size, rounds, extra).ns;
}

/** As {@link timeAlone}, returning the child's whole report { ns, rounds, stats? }. */
export function timeAloneFull(script, name, size, rounds, extra = []) {
  const raw = execFileSync(process.execPath, [script, '--case', name, '--size', String(size), '--rounds', String(rounds), ...extra], { encoding: 'utf8' });
  const r = JSON.parse(raw);
  if (typeof r.ns !== 'number' || !(r.ns > 0)) throw new Error(`${script} --case '${name}': bad output ${raw}`);
  return r;
}

const RAW_ALONE = new URL('./raw-alone.mjs', import.meta.url);

/** The self-check's reference: the raw uniform loop alone in a fresh process (bench/lib/raw-alone.mjs), ns per uniform. */
export function rawAlone(size, rounds = 5) {
  const raw = execFileSync(process.execPath, [RAW_ALONE.pathname, String(size), String(rounds)], { encoding: 'utf8' });
  const r = JSON.parse(raw);
  if (typeof r.ns !== 'number' || !(r.ns > 0)) throw new Error(`raw-alone.mjs: bad output ${raw}`);
  return r.ns;
}

/**
 * Interleaved rounds of fresh processes: in every round each case of `names`
 * runs alone in a fresh process (`script --case NAME`), then the self-check's
 * reference (the raw uniform in bench/lib/raw-alone.mjs). Returns
 * { cases: { name: { ns, runs, stats } }, reference: [ns per round] }; `ns` is
 * the median over rounds, `runs` the per-round figures (for per-round ratios).
 */
export function timeInFreshProcesses(script, names, { size, rounds, childRounds = 5, extra = [], progress }) {
  const cases = Object.fromEntries(names.map((n) => [n, { ns: NaN, runs: [], stats: undefined }]));
  const reference = [];
  for (let r = 0; r < rounds; r++) {
    for (const n of names) {
      const res = timeAloneFull(script, n, size, childRounds, extra);
      cases[n].runs.push(res.ns);
      cases[n].stats = res.stats;
    }
    reference.push(rawAlone(size, childRounds));
    progress?.(r);
  }
  for (const n of names) cases[n].ns = median(cases[n].runs);
  return { cases, reference };
}

/** Median over rounds of the per-round ratio a/b (both measured in the same round, back to back). */
export function perRoundRatio(a, b) {
  return median(a.map((v, i) => v / b[i]));
}

/**
 * Child-process entry: when argv has `--case NAME`, builds that one case from
 * `table` (name -> make), times it alone and prints { ns } as JSON. Returns true
 * when it ran (the caller then exits).
 */
export function runChildIfAsked(args, table) {
  const name = option(args, '--case', undefined);
  if (name === undefined) return false;
  const make = table[name];
  if (!make) throw new Error(`no case '${name}' (have: ${Object.keys(table).join(', ')})`);
  const size = Number(option(args, '--size', 1e6));
  const rounds = Number(option(args, '--rounds', 5));
  const c = { name, ...make() };
  const [res] = timeInterleaved([c], { size: c.size ?? size, rounds });
  const st = c.sampler?.stats;
  const stats = st
    ? { acceptanceRate: st.acceptanceRate, evaluationsPerDraw: st.samples > 0 ? st.densityEvaluations / st.samples : null, cells: c.sampler.table?.cells ?? null, strips: c.sampler.table?.strips ?? null }
    : c.stats?.();
  process.stdout.write(JSON.stringify({ ns: res.ns, rounds: res.rounds, stats }));
  return true;
}
