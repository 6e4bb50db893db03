#!/usr/bin/env node
// certifiedSampler: setup cost (interval evaluations, cells, milliseconds)
// and ns per draw, against peers in the same process. Against the build:
//   npm run build && node bench/certified.mjs [--draws 1000000] [--rounds 7] [--setups 50]
// Targets carry hand-written interval bounds (the derivations are in
// test/methods/certified/hand-bounds.ts). Each generator is timed in a loop
// of its own (one function per case, so no call site is shared between
// generators), rounds are interleaved, the median is reported, and a NaN
// draw aborts the run. Figures are noisy on a shared machine: compare the
// ratios printed side by side, not absolute numbers across runs.
import zigguratPkg from '@stdlib/random-base-improved-ziggurat';
import mt19937 from '@stdlib/random-base-mt19937';
import * as ed from '../dist/index.js';

const args = process.argv.slice(2);
const opt = (name, def) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : def;
};
const DRAWS = opt('--draws', 1_000_000);
const ROUNDS = opt('--rounds', 7);
const SETUPS = opt('--setups', 50);
const median = (a) => [...a].sort((x, y) => x - y)[a.length >> 1];

// ---- targets with hand bounds -------------------------------------------
const LOG_SQRT_2PI = 0.9189385332046727;
const W = 1e-9;
const wl = (v) => (Number.isFinite(v) ? v - W * (1 + Math.abs(v)) : v);
const wh = (v) => (Number.isFinite(v) ? v + W * (1 + Math.abs(v)) : v);
function lse(v) {
  let m = -Infinity;
  for (const x of v) if (x > m) m = x;
  if (!Number.isFinite(m)) return m;
  let s = 0;
  for (const x of v) s += Math.exp(x - m);
  return m + Math.log(s);
}
function sqRange(a, b, mu) {
  const da = a - mu;
  const db = b - mu;
  return [a <= mu && mu <= b ? 0 : Math.min(da * da, db * db), Math.max(da * da, db * db)];
}
function mixture(ws, mus, sds) {
  const c = ws.map((w, i) => Math.log(w) - Math.log(sds[i]) - LOG_SQRT_2PI);
  return {
    logDensity: (x) => lse(c.map((ci, i) => ci - (0.5 * (x - mus[i]) ** 2) / sds[i] ** 2)),
    logDensityBounds: (a, b) => {
      const lo = [];
      const hi = [];
      for (let i = 0; i < ws.length; i++) {
        const [q0, q1] = sqRange(a, b, mus[i]);
        lo.push(c[i] - q1 / (2 * sds[i] ** 2));
        hi.push(c[i] - q0 / (2 * sds[i] ** 2));
      }
      return [wl(lse(lo)), wh(lse(hi))];
    },
    dLogDensityBounds: (a, b) => {
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = 0; i < ws.length; i++) {
        lo = Math.min(lo, -(b - mus[i]) / sds[i] ** 2);
        hi = Math.max(hi, -(a - mus[i]) / sds[i] ** 2);
      }
      return [wl(lo), wh(hi)];
    },
  };
}
function sin2Range(k, a, b) {
  if (!(Number.isFinite(a) && Number.isFinite(b)) || k * (b - a) >= Math.PI) return [0, 1];
  const fa = Math.sin(k * a) ** 2;
  const fb = Math.sin(k * b) ** 2;
  let lo = Math.min(fa, fb);
  let hi = Math.max(fa, fb);
  if ((Math.ceil((k * a) / Math.PI) * Math.PI) / k <= b) lo = 0;
  if (((Math.ceil((k * a) / Math.PI - 0.5) + 0.5) * Math.PI) / k <= b) hi = 1;
  return [Math.max(0, lo - 1e-12), Math.min(1, hi + 1e-12)];
}
const worked = {
  logDensity: (x) => -0.5 * x * x + Math.log(Math.sin(6 * x) ** 2 + 3 * Math.cos(x) ** 2 * Math.sin(4 * x) ** 2 + 1),
  logDensityBounds: (a, b) => {
    const [q0, q1] = sqRange(a, b, 0);
    const [s6lo, s6hi] = sin2Range(6, a, b);
    const [s1lo, s1hi] = sin2Range(1, a, b);
    const [s4lo, s4hi] = sin2Range(4, a, b);
    return [wl(-0.5 * q1 + Math.log(1 + s6lo + 3 * (1 - s1hi) * s4lo)), wh(-0.5 * q0 + Math.log(1 + s6hi + 3 * (1 - s1lo) * s4hi))];
  },
  dLogDensityBounds: (a, b) => [-b - 21 - 1e-6, -a + 21 + 1e-6],
};
const normal = mixture([1], [0], [1]);
const narrow = mixture([0.7, 0.3], [0, 6], [1, 1e-3]);
const targets = { 'N(0,1)': normal, '0.7N(0,1)+0.3N(6,0.001^2)': narrow, 'worked exp(-x^2/2)(sin^2 6x+...)': worked };

// ---- setup cost ------------------------------------------------------------
console.log(`# certifiedSampler, node ${process.version}; figures noisy under load (shared 2-core machine)`);
console.log(`## setup: median of ${SETUPS} builds (after one warm-up build)`);
for (const [name, t] of Object.entries(targets)) {
  ed.certifiedSampler(t, { seed: 1 });
  const ms = [];
  let st;
  for (let i = 0; i < SETUPS; i++) {
    const t0 = performance.now();
    const s = ed.certifiedSampler(t, { seed: i + 1 });
    ms.push(performance.now() - t0);
    st = s.stats;
  }
  console.log(
    `${name.padEnd(34)} ${median(ms).toFixed(3).padStart(8)} ms  logDensityBounds ${st.setupBoundEvaluations}  dLogDensityBounds ${st.derivativeBoundEvaluations}  cells ${st.cells}`,
  );
}

// ---- ns per draw: one function per generator -----------------------------
const out = new Float64Array(DRAWS);
let sink = 0;
const guard = (a) => {
  for (let i = 0; i < a.length; i += 997) if (a[i] !== a[i]) throw new Error('NaN draw');
  sink += a[0];
};
const certNormal = ed.certifiedSampler(normal, { seed: 11 });
const certNarrow = ed.certifiedSampler(narrow, { seed: 12 });
const certWorked = ed.certifiedSampler(worked, { seed: 13 });
const pwWorked = ed.piecewiseSampler({ logDensity: worked.logDensity }, { seed: 13, fast: true });
const zig = zigguratPkg.factory({ prng: mt19937.factory({ seed: 11 }).normalized });
const mt = mt19937.factory({ seed: 14 }).normalized;
function runCertNormal() {
  const t0 = performance.now();
  certNormal.fill(out);
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
function runCertNarrow() {
  const t0 = performance.now();
  certNarrow.fill(out);
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
function runCertWorked() {
  const t0 = performance.now();
  certWorked.fill(out);
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
function runPiecewiseWorked() {
  const t0 = performance.now();
  pwWorked.fill(out);
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
function runZiggurat() {
  const t0 = performance.now();
  for (let i = 0; i < DRAWS; i++) out[i] = zig();
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
function runUniform() {
  const t0 = performance.now();
  for (let i = 0; i < DRAWS; i++) out[i] = mt();
  const dt = performance.now() - t0;
  guard(out);
  return (dt * 1e6) / DRAWS;
}
const cases = [
  ['certifiedSampler N(0,1)', runCertNormal],
  ['certifiedSampler narrow mixture', runCertNarrow],
  ['certifiedSampler worked target', runCertWorked],
  ['piecewiseSampler fast, worked (peer)', runPiecewiseWorked],
  ['@stdlib improved ziggurat (peer)', runZiggurat],
  ['raw MT19937 uniform (floor)', runUniform],
];
const times = cases.map(() => []);
for (let r = -1; r < ROUNDS; r++) {
  for (let k = 0; k < cases.length; k++) {
    const ns = cases[k][1]();
    if (r >= 0) times[k].push(ns);
  }
}
console.log(`## ns per draw: median of ${ROUNDS} interleaved rounds of ${DRAWS} draws (fill), after one warm-up round`);
const zigMed = median(times[4]);
for (let k = 0; k < cases.length; k++) {
  const m = median(times[k]);
  console.log(`${cases[k][0].padEnd(40)} ${m.toFixed(1).padStart(7)} ns/draw  ${(m / zigMed).toFixed(2)}x ziggurat`);
}
const sts = [
  ['N(0,1)', certNormal.stats],
  ['narrow mixture', certNarrow.stats],
  ['worked', certWorked.stats],
];
for (const [name, st] of sts) {
  console.log(`${name}: acceptance ${st.acceptanceRate.toFixed(4)}, evaluations/draw ${(st.densityEvaluations / st.samples).toExponential(2)}, cells ${st.cells} (refined on rejection ${st.refinements})`);
}
if (!Number.isFinite(sink)) throw new Error('non-finite draw');
