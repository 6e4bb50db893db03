#!/usr/bin/env node
// Benchmark of the table-driven fast path (tableSampler) against @stdlib peers,
// run against the build (dist/): `npm run build && node bench/fast-path.mjs`.
//
// Options: --draws N (per fill, default 1e6), --passes P (rounds of fresh
//          processes, default 5), --rounds R (in-process rounds, default 9),
//          --json FILE (also write the figures as JSON).
//
// Harness rule (DEVELOPERS.md, benchmark policy): every generator is timed in a
// loop of its own, written out in its case below as a user would write it
// (`for (...) out[i] = next()` for a peer, `s.fill(out)` for a sampler), so no
// per-draw call site is shared between generators; V8 makes a call site that
// sees several generator closures megamorphic (about 10 ns per call here), which
// once made the peers look twice as slow as in a user's program. Every
// generator draws from MT19937 (@stdlib/random-base-mt19937 through
// mersenneTwister). Medians of interleaved rounds after two warm-up fills; a
// non-finite draw aborts the run.
//
// 1. ns per draw, every case alone in a fresh process (`--case NAME`), in
//    interleaved rounds (the figures the ratios use: each generator is the only
//    one in its process, as in a user's program), and every case in this
//    process, each in its own loop (second column: with several MT19937
//    instances in one process the shared wrapper's call sites cost some ns per
//    uniform, measured 1.24-1.28x for the raw uniform under load). Self-check:
//    the raw uniform as timed by the harness must agree within 10 % with the
//    same loop in bench/lib/raw-alone.mjs (no harness code), run after every
//    round; the run prints whether it does.
// 2. ns per draw against the number of strips (10 ... 10,000) and the lookup
//    alone on a flat density: every strip count alone in a fresh process,
//    interleaved passes (several samplers in one process would share the
//    library's per-draw call sites).
// 3. setup payback: setup + 10,000 draws, fast path vs plain hull sampler,
//    warm (setup code optimized) and cold (first sampler in a fresh process).
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import ziggurat from '@stdlib/random-base-improved-ziggurat';
import stdlibGamma from '@stdlib/random-base-gamma';
import * as ed from '../dist/index.js';
import { guard, loadLine, machineLine, median, option, perRoundRatio, runChildIfAsked, selfCheck, timeAloneFull, timeInFreshProcesses, timeInterleaved } from './lib/harness.mjs';

const args = process.argv.slice(2);
const HERE = fileURLToPath(import.meta.url);
const normal = ed.normalTarget(0, 1);
const gamma = ed.gammaTarget(2.5, 1);
const flatTarget = { logDensity: (x) => (x >= 0 && x <= 1 ? 0 : -Infinity), support: [0, 1], mode: 0.5 };
const STRIPS = [10, 30, 100, 300, 500, 1000, 3000, 10000];

const RAW = 'mt19937 uniform (raw)';
const Z = '@stdlib improved-ziggurat normal';
const G = '@stdlib gamma(2.5)';
const FN = 'fast normal (seed: own MT19937 in blocks)';
const FG = 'fast gamma(2.5) (seed)';
const FNI = 'fast normal (uniform: mersenneTwister, per value)';
const FGI = 'fast gamma(2.5) (uniform: mersenneTwister)';
const HN = 'adaptive hull normal (plain)';
const HG = 'adaptive hull gamma(2.5) (plain)';
const MF = 'exactSampler multimodal, fast path (expectedDraws 1e6)';
const MP = 'exactSampler multimodal, plain piecewise';
// the suite's worked multimodal example (src/cli/builtin.ts, multimodalLogDensity)
const multimodal = {
  logDensity(x) {
    const s6 = Math.sin(6 * x);
    const c1 = Math.cos(x);
    const s4 = Math.sin(4 * x);
    return -0.5 * x * x + Math.log(s6 * s6 + 3 * c1 * c1 * s4 * s4 + 1);
  },
};

// Each make() builds one generator and returns its fill with the loop written out.
const CASES = {
  [RAW]: () => {
    const next = ed.mersenneTwister(101);
    return {
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = next();
      },
    };
  },
  [Z]: () => {
    const zig = ziggurat.factory({ prng: ed.mersenneTwister(102) });
    return {
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = zig();
      },
    };
  },
  [G]: () => {
    const gam = stdlibGamma.factory(2.5, 1, { prng: ed.mersenneTwister(103) });
    return {
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = gam();
      },
    };
  },
  [FN]: () => {
    const s = ed.tableSampler(normal, { seed: 11 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [FG]: () => {
    const s = ed.tableSampler(gamma, { seed: 12 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [FNI]: () => {
    const s = ed.tableSampler(normal, { uniform: ed.mersenneTwister(13) });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [FGI]: () => {
    const s = ed.tableSampler(gamma, { uniform: ed.mersenneTwister(14) });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [HN]: () => {
    const s = ed.adaptiveRejectionSampler(normal, { seed: 15 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [HG]: () => {
    const s = ed.adaptiveRejectionSampler(gamma, { seed: 16 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [MF]: () => {
    const s = ed.exactSampler(multimodal, { seed: 17, expectedDraws: 1e6 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
  [MP]: () => {
    const s = ed.exactSampler(multimodal, { seed: 18 });
    return { sampler: s, fill: (out) => s.fill(out) };
  },
};
// strip counts: only ever timed alone in a fresh process (one sampler per process)
for (const n of STRIPS) {
  CASES[`strips ${n}`] = () => {
    const s = ed.tableSampler(normal, { seed: 20 + n, strips: n });
    return { sampler: s, fill: (out) => s.fill(out) };
  };
  CASES[`flat ${n}`] = () => {
    const s = ed.tableSampler(flatTarget, { seed: 40 + n, strips: n });
    return { sampler: s, fill: (out) => s.fill(out) };
  };
}

if (runChildIfAsked(args, CASES)) process.exit(0);

const coldChild = option(args, '--cold', undefined);
if (coldChild !== undefined) {
  // the first sampler in a fresh process: setup and the first 10,000 draws
  const [kind, tname] = coldChild.split(':');
  const t = tname === 'normal' ? ed.normalTarget(0, 1) : ed.gammaTarget(2.5, 1);
  const out = new Float64Array(10_000);
  const a = performance.now();
  const s = kind === 'fast' ? ed.tableSampler(t, { seed: 3 }) : ed.adaptiveRejectionSampler(t, { seed: 3 });
  const b = performance.now();
  s.fill(out);
  const c = performance.now();
  guard(coldChild, out, 1);
  process.stdout.write(JSON.stringify({ setupMs: b - a, totalMs: c - a }));
  process.exit(0);
}

const DRAWS = Number(option(args, '--draws', 1_000_000));
const ROUNDS = Number(option(args, '--rounds', 9));
const JSON_OUT = option(args, '--json', undefined);
const CHILD_ROUNDS = 5;
const PASSES = Number(option(args, '--passes', 5));
const command = `node bench/fast-path.mjs --draws ${DRAWS} --rounds ${ROUNDS} --passes ${PASSES}${JSON_OUT ? ` --json ${JSON_OUT}` : ''}`;
const load0 = os.loadavg();
const say = (s = '') => console.log(s);
say(`# exactdraw fast-path benchmark`);
say(`# command: ${command} (after npm run build)`);
say(machineLine());
say(loadLine('at start'));
say(`# ${DRAWS} draws per fill; ${PASSES} interleaved rounds of fresh processes, ${ROUNDS} in-process rounds; medians of ns per draw; each generator in a loop of its own`);
say();

// ----- 1. per-draw time, side by side ---------------------------------------------
// (a) every case alone in a fresh process, interleaved rounds (the primary figures: each
//     generator is the only one in its process, as in a user's program with one generator);
// (b) every case in this process, each in its own loop (several MT19937 instances then share
//     the wrapper's call sites, which costs some ns per uniform: see the in-process line).
const MAIN = [RAW, Z, G, FN, FG, FNI, FGI, HN, HG, MF, MP];
const fresh = timeInFreshProcesses(HERE, MAIN, { size: DRAWS, rounds: PASSES, childRounds: CHILD_ROUNDS });
const alone = Object.fromEntries(MAIN.map((n) => [n, fresh.cases[n].ns]));
const aloneRuns = Object.fromEntries(MAIN.map((n) => [n, fresh.cases[n].runs]));
const check = selfCheck(aloneRuns[RAW], fresh.reference);
const built = MAIN.map((name) => ({ name, ...CASES[name]() }));
const side = timeInterleaved(built, { size: DRAWS, rounds: ROUNDS });
const ns = Object.fromEntries(side.map((r) => [r.name, r.ns]));
const inProcessRaw = ns[RAW] / alone[RAW];
say(`## 1. ns per draw, same MT19937 implementation; each generator in its own loop`);
say(`${'case'.padEnd(56)} ${'fresh process'.padStart(13)}   ${'this process'.padStart(12)}`);
for (const name of MAIN) say(`${name.padEnd(56)} ${alone[name].toFixed(2).padStart(13)}   ${ns[name].toFixed(2).padStart(12)}`);
say(`# fresh process: median of ${PASSES} interleaved rounds, each case alone in its own process (${CHILD_ROUNDS} fills there); this process: median of ${ROUNDS} interleaved rounds`);
say(check.line);
say(`# in this process the raw uniform took ${inProcessRaw.toFixed(3)}x its fresh-process time (several generator instances in one process); ratios below use the fresh-process figures`);
for (const [label, name] of [['fast normal (seed)', FN], ['fast gamma(2.5) (seed)', FG], ['multimodal fast path', MF], ['multimodal plain', MP]]) {
  const s = built.find((b) => b.name === name).sampler;
  const st = s.stats;
  say(`${label}: acceptance ${st.acceptanceRate.toFixed(5)}, evaluations per draw ${(st.densityEvaluations / st.samples).toExponential(2)}${s.table ? `, ${s.table.strips} strips, ${s.table.cells} cells` : ''}${s.choice ? `, method ${s.choice.method}` : ''}`);
}
// ratios: median over rounds of the per-round ratio of fresh processes run back to back
const ratio = (a, b) => perRoundRatio(aloneRuns[a], aloneRuns[b]);
const ratioHere = (a, b) => ns[a] / ns[b];
const ratios = {
  normalVsZiggurat: ratio(FN, Z),
  normalInjectedVsZiggurat: ratio(FNI, Z),
  gammaVsStdlib: ratio(FG, G),
  gammaInjectedVsStdlib: ratio(FGI, G),
  normalVsRawUniform: ratio(FN, RAW),
  gammaVsRawUniform: ratio(FG, RAW),
  hullNormalVsZiggurat: ratio(HN, Z),
  hullGammaVsStdlib: ratio(HG, G),
  multimodalFastVsPlain: ratio(MF, MP),
  injectedVsOwnNormal: ratio(FNI, FN),
  thisProcess: {
    normalVsZiggurat: ratioHere(FN, Z),
    normalInjectedVsZiggurat: ratioHere(FNI, Z),
    gammaVsStdlib: ratioHere(FG, G),
    gammaInjectedVsStdlib: ratioHere(FGI, G),
    hullNormalVsZiggurat: ratioHere(HN, Z),
    hullGammaVsStdlib: ratioHere(HG, G),
    rawUniformVsFreshProcess: inProcessRaw,
  },
};
say();

// ----- 2. flatness over the number of strips (each count alone in a fresh process) -------
const stripRuns = Object.fromEntries(STRIPS.flatMap((n) => [[`strips ${n}`, []], [`flat ${n}`, []]]));
const stripStats = {};
const STRIP_PASSES = 3;
for (let p = 0; p < STRIP_PASSES; p++) {
  for (const name of Object.keys(stripRuns)) {
    const r = timeAloneFull(HERE, name, DRAWS, CHILD_ROUNDS);
    stripRuns[name].push(r.ns);
    stripStats[name] = r.stats;
  }
}
const stripNs = Object.fromEntries(Object.entries(stripRuns).map(([k, v]) => [k, median(v)]));
say(`## 2. fast normal (seed), ns per draw against the number of strips (each alone in a fresh process, median of ${STRIP_PASSES} interleaved passes)`);
for (const n of STRIPS) {
  const st = stripStats[`strips ${n}`];
  say(`${`${n} strips`.padEnd(14)} ${stripNs[`strips ${n}`].toFixed(2).padStart(8)} ns   cells ${String(st.cells).padStart(6)}   acceptance ${st.acceptanceRate.toFixed(4)}   evaluations/draw ${st.evaluationsPerDraw.toExponential(2)}`);
}
say('## 2b. the lookup alone: flat density on [0, 1] (no caps), ns per draw against the number of strips');
for (const n of STRIPS) say(`${`${n} strips`.padEnd(14)} ${stripNs[`flat ${n}`].toFixed(2).padStart(8)} ns   cells ${String(stripStats[`flat ${n}`].cells).padStart(6)}`);
const spread = (prefix, from) => {
  const v = STRIPS.filter((n) => n >= from).map((n) => stripNs[`${prefix} ${n}`]);
  return Math.max(...v) / Math.min(...v);
};
ratios.flatness10to10000 = spread('strips', 10);
ratios.flatness30to10000 = spread('strips', 30);
ratios.flatness100to10000 = spread('strips', 100);
ratios.lookupFlatness10to10000 = spread('flat', 10);
say();

// ----- 3. setup payback ----------------------------------------------------------------------
// warm: after WARM fresh samplers of each kind (optimized setup code), median of REPS more;
// cold: the first sampler in a fresh process (setup code still interpreted), median of COLD processes
const PAYBACK_DRAWS = 10_000;
const WARM = 200;
const REPS = 41;
const COLD = 5;
const buf = new Float64Array(PAYBACK_DRAWS);
say(`## 3. setup + ${PAYBACK_DRAWS} draws: fast path vs plain hull (warm: median of ${REPS} fresh samplers after ${WARM}; cold: first sampler in a fresh process, median of ${COLD})`);
const payback = {};
const coldRun = (kind, tname) => {
  const runs = [];
  for (let r = 0; r < COLD; r++) runs.push(JSON.parse(execFileSync(process.execPath, [HERE, '--cold', `${kind}:${tname}`], { encoding: 'utf8' })));
  return { setupMs: median(runs.map((x) => x.setupMs)), totalMs: median(runs.map((x) => x.totalMs)) };
};
// the two warm loops are written out separately (no shared call site between the methods)
const warmFast = (t) => {
  const setup = [];
  const total = [];
  for (let r = -WARM; r < REPS; r++) {
    const a = performance.now();
    const s = ed.tableSampler(t, { seed: r + WARM + 1 });
    const b = performance.now();
    s.fill(buf);
    const c = performance.now();
    guard('warm fast', buf);
    if (r >= 0) {
      setup.push(b - a);
      total.push(c - a);
    }
  }
  return { setupMs: median(setup), totalMs: median(total) };
};
const warmHull = (t) => {
  const setup = [];
  const total = [];
  for (let r = -WARM; r < REPS; r++) {
    const a = performance.now();
    const s = ed.adaptiveRejectionSampler(t, { seed: r + WARM + 1 });
    const b = performance.now();
    s.fill(buf);
    const c = performance.now();
    guard('warm hull', buf);
    if (r >= 0) {
      setup.push(b - a);
      total.push(c - a);
    }
  }
  return { setupMs: median(setup), totalMs: median(total) };
};
for (const [label, t] of Object.entries({ normal, 'gamma(2.5)': gamma })) {
  const res = {};
  for (const mode of ['warm', 'cold']) {
    const fast = mode === 'warm' ? warmFast(t) : coldRun('fast', label);
    const hull = mode === 'warm' ? warmHull(t) : coldRun('hull', label);
    const nsFast = ((fast.totalMs - fast.setupMs) * 1e6) / PAYBACK_DRAWS;
    const nsHull = ((hull.totalMs - hull.setupMs) * 1e6) / PAYBACK_DRAWS;
    const breakEven = nsHull > nsFast ? Math.max(0, ((fast.setupMs - hull.setupMs) * 1e6) / (nsHull - nsFast)) : Infinity;
    res[mode] = { fast, hull, breakEvenDraws: breakEven, totalRatio: fast.totalMs / hull.totalMs };
    say(
      `${label.padEnd(11)} ${mode}: fast setup ${fast.setupMs.toFixed(3)} ms, setup + draws ${fast.totalMs.toFixed(3)} ms | plain hull setup ${hull.setupMs.toFixed(3)} ms, setup + draws ${hull.totalMs.toFixed(3)} ms | ratio ${(fast.totalMs / hull.totalMs).toFixed(3)} | break-even about ${Number.isFinite(breakEven) ? Math.round(breakEven) : 'never'} draws`,
    );
  }
  payback[label] = res;
}
say();

const load1 = os.loadavg();
const f = (x) => x.toFixed(3);
say('## ratios (medians of per-round ratios of fresh processes; in brackets: this process)');
const T = ratios.thisProcess;
say(`fast normal / @stdlib improved-ziggurat, own stream            ${f(ratios.normalVsZiggurat)} [${f(T.normalVsZiggurat)}]   (goal <= 0.9)`);
say(`fast normal / @stdlib improved-ziggurat, injected uniform      ${f(ratios.normalInjectedVsZiggurat)} [${f(T.normalInjectedVsZiggurat)}]   (goal <= 1.1)`);
say(`fast gamma(2.5) / @stdlib gamma(2.5), own stream               ${f(ratios.gammaVsStdlib)} [${f(T.gammaVsStdlib)}]   (goal <= 0.5)`);
say(`fast gamma(2.5) / @stdlib gamma(2.5), injected uniform         ${f(ratios.gammaInjectedVsStdlib)} [${f(T.gammaInjectedVsStdlib)}]   (goal <= 0.5)`);
say(`fast normal / raw uniform, fast gamma(2.5) / raw uniform       ${f(ratios.normalVsRawUniform)}, ${f(ratios.gammaVsRawUniform)}   (goal <= 1.5)`);
say(`fast normal, injected uniform / own stream                     ${f(ratios.injectedVsOwnNormal)}`);
say(`plain hull normal / ziggurat, plain hull gamma / stdlib gamma  ${f(ratios.hullNormalVsZiggurat)} [${f(T.hullNormalVsZiggurat)}], ${f(ratios.hullGammaVsStdlib)} [${f(T.hullGammaVsStdlib)}]   (goals <= 2.5, <= 0.6)`);
say(`multimodal: exactSampler fast path / plain piecewise          ${f(ratios.multimodalFastVsPlain)}`);
say(`ns per draw max/min over 10..10,000 strips                      ${f(ratios.flatness10to10000)}; over 30.. ${f(ratios.flatness30to10000)}; over 100.. ${f(ratios.flatness100to10000)}; lookup alone ${f(ratios.lookupFlatness10to10000)}`);
for (const [label, p] of Object.entries(payback)) {
  for (const mode of ['warm', 'cold']) {
    const q = p[mode];
    say(`setup + 10,000 draws, fast / plain hull, ${label.padEnd(10)} ${mode}     ${f(q.totalRatio)}   (break-even about ${Number.isFinite(q.breakEvenDraws) ? Math.round(q.breakEvenDraws) : 'never'} draws)`);
  }
}
say(check.line);
say(loadLine('at end'));

if (JSON_OUT) {
  writeFileSync(
    JSON_OUT,
    JSON.stringify(
      { schema: 'exactdraw-fast-path/2', command, node: process.version, load: { start: load0, end: load1 }, draws: DRAWS, rounds: ROUNDS, perDraw: side, alone, aloneRuns, reference: fresh.reference, selfCheck: check, strips: stripNs, payback, ratios },
      null,
      2,
    ) + '\n',
  );
}
