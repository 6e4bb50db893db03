#!/usr/bin/env node
// Benchmark of the table-driven fast path (tableSampler) against @stdlib peers,
// run against the build (dist/): `npm run build && node bench/fast-path.mjs`.
//
// Options: --draws N (per round, default 1e6), --rounds R (default 9),
//          --json FILE (also write the figures as JSON).
//
// What it measures (ns per draw are medians over interleaved rounds after a
// warm-up; every generator draws from MT19937 via @stdlib/random-base-mt19937):
// 1. per-draw time side by side in one process: standard normal from its
//    log-density vs @stdlib improved-ziggurat, gamma(2.5) vs @stdlib gamma;
//    the peers also once more in a fresh process of their own (see below);
// 2. ns per draw against the number of strips (10 ... 10,000);
// 3. setup payback: setup + 10,000 draws, fast path vs plain hull sampler,
//    warm (setup code optimized) and cold (first sampler in a fresh process).
//
// Why the peers are also timed alone: V8 specializes the @stdlib MT19937
// closures on their context only while a single generator instance reaches a
// call site; with several instances in one process (any realistic program,
// and this benchmark) every per-call uniform gets slower. The seeded fast
// path reads its own MT19937 in blocks (same stream) and is not affected; a
// fast path given an injected `uniform` calls it per value like the peers.
// Both comparisons are printed.
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import ziggurat from '@stdlib/random-base-improved-ziggurat';
import stdlibGamma from '@stdlib/random-base-gamma';
import * as ed from '../dist/index.js';

const args = process.argv.slice(2);
const opt = (name, def) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : def;
};
const DRAWS = Number(opt('--draws', 1_000_000));
const ROUNDS = Number(opt('--rounds', 9));
const JSON_OUT = opt('--json', undefined);
const CHILD = opt('--child', undefined);

const median = (a) => {
  const s = [...a].sort((x, y) => x - y);
  return s.length % 2 ? s[(s.length - 1) / 2] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
};

/** A fill function over a generator closure, with a NaN guard so the loop cannot be optimised away. */
function loopFill(next) {
  return (out) => {
    for (let i = 0; i < out.length; i++) out[i] = next();
    return out;
  };
}

/** Interleaved rounds: every case runs once per round, in the same order. Returns median ns per draw. */
function timeCases(cases, draws, rounds) {
  const out = new Float64Array(draws);
  for (const c of cases) {
    c.fill(out); // warm-up (JIT)
    c.fill(out);
  }
  const t = cases.map(() => []);
  for (let r = 0; r < rounds; r++) {
    cases.forEach((c, k) => {
      const a = performance.now();
      c.fill(out);
      const b = performance.now();
      let sum = 0;
      for (let i = 0; i < out.length; i += 101) sum += out[i];
      if (!Number.isFinite(sum)) throw new Error(`${c.name}: non-finite draw`);
      t[k].push(((b - a) * 1e6) / draws);
    });
  }
  return cases.map((c, k) => ({ name: c.name, ns: median(t[k]), rounds: t[k] }));
}

const normal = ed.normalTarget(0, 1);
const gamma = ed.gammaTarget(2.5, 1);
const peerCases = (seed) => [
  { name: 'mt19937 uniform (raw)', fill: loopFill(ed.mersenneTwister(seed)) },
  { name: '@stdlib improved-ziggurat normal', fill: loopFill(ziggurat.factory({ prng: ed.mersenneTwister(seed + 1) })) },
  { name: '@stdlib gamma(2.5)', fill: loopFill(stdlibGamma.factory(2.5, 1, { prng: ed.mersenneTwister(seed + 2) })) },
];

if (CHILD !== undefined && CHILD.startsWith('cold:')) {
  // the first sampler in a fresh process: setup and the first 10,000 draws
  const [, kind, tname] = CHILD.split(':');
  const t = tname === 'normal' ? ed.normalTarget(0, 1) : ed.gammaTarget(2.5, 1);
  const out = new Float64Array(10_000);
  const a = performance.now();
  const s = kind === 'fast' ? ed.tableSampler(t, { seed: 3 }) : ed.adaptiveRejectionSampler(t, { seed: 3 });
  const b = performance.now();
  s.fill(out);
  const c = performance.now();
  process.stdout.write(JSON.stringify({ setupMs: b - a, totalMs: c - a }));
  process.exit(0);
}

if (CHILD === 'peers') {
  // a fresh process with only the peers: each call site sees one generator
  process.stdout.write(JSON.stringify(timeCases(peerCases(101), DRAWS, ROUNDS)));
  process.exit(0);
}

const command = `node bench/fast-path.mjs --draws ${DRAWS} --rounds ${ROUNDS}${JSON_OUT ? ` --json ${JSON_OUT}` : ''}`;
const load0 = os.loadavg();
const lines = [];
const say = (s = '') => {
  lines.push(s);
  console.log(s);
};
say(`# exactdraw fast-path benchmark`);
say(`# command: ${command} (after npm run build)`);
say(`# node ${process.version}, ${os.cpus()[0]?.model ?? 'cpu'} x ${os.cpus().length}, ${new Date().toISOString()}`);
say(`# load average at start: ${load0.map((x) => x.toFixed(2)).join(', ')}`);
say(`# ${DRAWS} draws per round, ${ROUNDS} interleaved rounds, medians of ns per draw`);
say();

// ----- 1. per-draw time, side by side ---------------------------------------------
const fastNormal = ed.tableSampler(normal, { seed: 11 });
const fastGamma = ed.tableSampler(gamma, { seed: 12 });
const fastNormalInj = ed.tableSampler(normal, { uniform: ed.mersenneTwister(13) });
const fastGammaInj = ed.tableSampler(gamma, { uniform: ed.mersenneTwister(14) });
const hullNormal = ed.adaptiveRejectionSampler(normal, { seed: 15 });
const hullGamma = ed.adaptiveRejectionSampler(gamma, { seed: 16 });
const side = timeCases(
  [
    ...peerCases(1),
    { name: 'fast normal (seed: own MT19937 in blocks)', fill: (o) => fastNormal.fill(o) },
    { name: 'fast gamma(2.5) (seed)', fill: (o) => fastGamma.fill(o) },
    { name: 'fast normal (uniform: mersenneTwister, per value)', fill: (o) => fastNormalInj.fill(o) },
    { name: 'fast gamma(2.5) (uniform: mersenneTwister)', fill: (o) => fastGammaInj.fill(o) },
    { name: 'adaptive hull normal (plain)', fill: (o) => hullNormal.fill(o) },
    { name: 'adaptive hull gamma(2.5) (plain)', fill: (o) => hullGamma.fill(o) },
  ],
  DRAWS,
  ROUNDS,
);
const ns = Object.fromEntries(side.map((r) => [r.name, r.ns]));
let alone = null;
try {
  const here = fileURLToPath(import.meta.url);
  const raw = execFileSync(process.execPath, [here, '--child', 'peers', '--draws', String(DRAWS), '--rounds', String(ROUNDS)], { encoding: 'utf8' });
  alone = Object.fromEntries(JSON.parse(raw).map((r) => [r.name, r.ns]));
} catch (e) {
  say(`# (peers in a fresh process could not be timed: ${e.message})`);
}
say('## 1. ns per draw, one process, same MT19937 implementation');
for (const r of side) say(`${r.name.padEnd(52)} ${r.ns.toFixed(2).padStart(8)}${alone && alone[r.name] !== undefined ? `   (alone in a fresh process: ${alone[r.name].toFixed(2)})` : ''}`);
for (const [label, s] of [['fast normal (seed)', fastNormal], ['fast gamma(2.5) (seed)', fastGamma]]) {
  const st = s.stats;
  say(`${label}: acceptance ${st.acceptanceRate.toFixed(5)}, evaluations per draw ${(st.densityEvaluations / st.samples).toExponential(2)}, ${s.table.strips} strips, ${s.table.cells} cells`);
}
const Z = '@stdlib improved-ziggurat normal';
const G = '@stdlib gamma(2.5)';
const ratios = {
  normalVsZiggurat: ns['fast normal (seed: own MT19937 in blocks)'] / ns[Z],
  gammaVsStdlib: ns['fast gamma(2.5) (seed)'] / ns[G],
  normalInjectedVsZiggurat: ns['fast normal (uniform: mersenneTwister, per value)'] / ns[Z],
  gammaInjectedVsStdlib: ns['fast gamma(2.5) (uniform: mersenneTwister)'] / ns[G],
  normalVsZigguratAlone: alone ? ns['fast normal (seed: own MT19937 in blocks)'] / alone[Z] : null,
  gammaVsStdlibAlone: alone ? ns['fast gamma(2.5) (seed)'] / alone[G] : null,
};
say();

// ----- 2. flatness over the number of strips ---------------------------------------------
const STRIPS = [10, 30, 100, 300, 500, 1000, 3000, 10000];
const bySamplers = STRIPS.map((n) => ed.tableSampler(normal, { seed: 20 + n, strips: n }));
const flat = timeCases(
  bySamplers.map((s, k) => ({ name: `${STRIPS[k]} strips`, fill: (o) => s.fill(o) })),
  DRAWS,
  ROUNDS,
);
say('## 2. fast normal (seed), ns per draw against the number of strips');
flat.forEach((r, k) => {
  const s = bySamplers[k];
  const st = s.stats;
  say(`${r.name.padEnd(14)} ${r.ns.toFixed(2).padStart(8)} ns   cells ${String(s.table.cells).padStart(6)}   acceptance ${st.acceptanceRate.toFixed(4)}   evaluations/draw ${(st.densityEvaluations / st.samples).toExponential(2)}`);
});
// the lookup alone: a flat density on [0, 1] has no caps (envelope = squeeze on every strip),
// so every draw is a table lookup (the two strips at the support's ends take the clamped path)
const flatTarget = { logDensity: (x) => (x >= 0 && x <= 1 ? 0 : -Infinity), support: [0, 1], mode: 0.5 };
const lookupSamplers = STRIPS.map((n) => ed.tableSampler(flatTarget, { seed: 40 + n, strips: n }));
const lookup = timeCases(
  lookupSamplers.map((s, k) => ({ name: `${STRIPS[k]} strips`, fill: (o) => s.fill(o) })),
  DRAWS,
  ROUNDS,
);
say('## 2b. the lookup alone: flat density on [0, 1] (no caps), ns per draw against the number of strips');
lookup.forEach((r, k) => say(`${r.name.padEnd(14)} ${r.ns.toFixed(2).padStart(8)} ns   cells ${String(lookupSamplers[k].table.cells).padStart(6)}`));
ratios.lookupFlatness10to10000 = Math.max(...lookup.map((r) => r.ns)) / Math.min(...lookup.map((r) => r.ns));
const spread = (from) => {
  const v = flat.filter((_, k) => STRIPS[k] >= from).map((r) => r.ns);
  return Math.max(...v) / Math.min(...v);
};
ratios.flatness10to10000 = spread(10);
ratios.flatness30to10000 = spread(30);
ratios.flatness100to10000 = spread(100);
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
const makers = {
  fast: (t, seed) => ed.tableSampler(t, { seed }),
  hull: (t, seed) => ed.adaptiveRejectionSampler(t, { seed }),
};
const targets = { normal, 'gamma(2.5)': gamma };
const coldRun = (kind, tname) => {
  const here = fileURLToPath(import.meta.url);
  const runs = [];
  for (let r = 0; r < COLD; r++) {
    runs.push(JSON.parse(execFileSync(process.execPath, [here, '--child', `cold:${kind}:${tname}`], { encoding: 'utf8' })));
  }
  return { setupMs: median(runs.map((x) => x.setupMs)), totalMs: median(runs.map((x) => x.totalMs)) };
};
for (const [label, t] of Object.entries(targets)) {
  const warm = (make) => {
    const setup = [];
    const total = [];
    for (let r = -WARM; r < REPS; r++) {
      const a = performance.now();
      const s = make(t, r + WARM + 1);
      const b = performance.now();
      s.fill(buf);
      const c = performance.now();
      if (r >= 0) {
        setup.push(b - a);
        total.push(c - a);
      }
    }
    return { setupMs: median(setup), totalMs: median(total) };
  };
  const res = {};
  for (const mode of ['warm', 'cold']) {
    const fast = mode === 'warm' ? warm(makers.fast) : coldRun('fast', label);
    const hull = mode === 'warm' ? warm(makers.hull) : coldRun('hull', label);
    // break-even: setup difference over the per-draw difference of the first 10,000 draws
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
say('## ratios');
say(`fast normal / @stdlib improved-ziggurat (one process)         ${ratios.normalVsZiggurat.toFixed(3)}   (target <= 1.1)`);
say(`fast gamma(2.5) / @stdlib gamma(2.5) (one process)            ${ratios.gammaVsStdlib.toFixed(3)}   (target <= 0.5)`);
say(`  same, fast path on an injected uniform (per value)          ${ratios.normalInjectedVsZiggurat.toFixed(3)}, ${ratios.gammaInjectedVsStdlib.toFixed(3)}`);
if (alone) say(`  same, peers timed alone in a fresh process                  ${ratios.normalVsZigguratAlone.toFixed(3)}, ${ratios.gammaVsStdlibAlone.toFixed(3)}`);
say(`ns per draw max/min over 10..10,000 strips                     ${ratios.flatness10to10000.toFixed(3)}   (target <= 1.2)`);
say(`  over 30..10,000 strips                                       ${ratios.flatness30to10000.toFixed(3)}`);
say(`  over 100..10,000 strips                                      ${ratios.flatness100to10000.toFixed(3)}`);
say(`  the lookup alone (flat density, no caps), 10..10,000 strips  ${ratios.lookupFlatness10to10000.toFixed(3)}`);
for (const [label, p] of Object.entries(payback)) {
  for (const mode of ['warm', 'cold']) {
    const q = p[mode];
    say(`setup + 10,000 draws, fast / plain hull, ${label.padEnd(10)} ${mode}     ${q.totalRatio.toFixed(3)}   (target < 1; break-even about ${Number.isFinite(q.breakEvenDraws) ? Math.round(q.breakEvenDraws) : 'never'} draws)`);
  }
}
say(`# load average at end: ${load1.map((x) => x.toFixed(2)).join(', ')}`);

if (JSON_OUT) {
  writeFileSync(
    JSON_OUT,
    JSON.stringify({ schema: 'exactdraw-fast-path/1', command, node: process.version, load: { start: load0, end: load1 }, draws: DRAWS, rounds: ROUNDS, perDraw: side, peersAlone: alone, strips: flat.map((r, k) => ({ strips: STRIPS[k], ns: r.ns })), payback, ratios }, null, 2) + '\n',
  );
}
