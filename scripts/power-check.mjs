#!/usr/bin/env node
// High-power goodness-of-fit check of a kernel's stream, for stream changes (not part of the test suite,
// which stays under ten minutes): N draws binned into 4,000 equal bins over a range, a Pearson
// chi-square against the @stdlib cdf, bins with fewer than 20 expected counts left out.
//   npm run build && node scripts/power-check.mjs CASE [N = 2e8]
// CASE: hullNormal, hullGamma, hullNormalSecant, piecewiseNormal, certifiedNormal (a formula normal), or
// the twin hullNormalVsWide (the
// hull's normal draws against N(0, 1.001): it must be rejected, which shows what N can see).
// Measured 2026-12-04 (two-uniform candidate), N = 2e8: p = 0.20, 0.49, 0.57, 0.50, certified 0.76; twin p = 1.6e-8.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const ncdf = require('@stdlib/stats-base-dists-normal-cdf');
const gcdf = require('@stdlib/stats-base-dists-gamma-cdf');
const chi2cdf = require('@stdlib/stats-base-dists-chisquare-cdf');
const ed = await import('../dist/index.js');

const CASES = {
  hullNormal: [() => ed.adaptiveRejectionSampler(ed.normalTarget(0, 1), { seed: 777 }), (x) => ncdf(x, 0, 1), -6, 6],
  hullGamma: [() => ed.adaptiveRejectionSampler(ed.gammaTarget(2.5, 1), { seed: 778 }), (x) => gcdf(x, 2.5, 1), 0, 20],
  hullNormalSecant: [() => ed.adaptiveRejectionSampler(ed.normalTarget(0, 1), { seed: 779, derivativeFree: true }), (x) => ncdf(x, 0, 1), -6, 6],
  piecewiseNormal: [() => ed.piecewiseSampler(ed.normalTarget(0, 1), { seed: 780 }), (x) => ncdf(x, 0, 1), -6, 6],
  certifiedNormal: [() => ed.certifiedSampler(ed.formulaTarget('-x^2/2', { support: [-Infinity, Infinity] }), { seed: 781 }), (x) => ncdf(x, 0, 1), -6, 6],
  hullNormalVsWide: [() => ed.adaptiveRejectionSampler(ed.normalTarget(0, 1), { seed: 777 }), (x) => ncdf(x, 0, 1.001), -6, 6],
};
const which = process.argv[2];
const N = Number(process.argv[3] ?? 2e8);
if (!(which in CASES) || !(N >= 1e6)) {
  console.error(`usage: node scripts/power-check.mjs ${Object.keys(CASES).join('|')} [N >= 1e6]`);
  process.exit(2);
}
const [make, cdf, lo, hi] = CASES[which];
const BINS = 4000;
const counts = new Float64Array(BINS + 2);
const s = make();
const buf = new Float64Array(1e6);
const w = (hi - lo) / BINS;
for (let done = 0; done < N; done += buf.length) {
  s.fill(buf);
  for (let i = 0; i < buf.length; i++) {
    const x = buf[i];
    counts[x < lo ? 0 : x >= hi ? BINS + 1 : 1 + Math.floor((x - lo) / w)]++;
  }
}
const n = Math.ceil(N / buf.length) * buf.length;
let chi = 0;
let used = 0;
let prev = 0;
for (let k = 0; k < BINS + 2; k++) {
  const c = k === BINS + 1 ? 1 : cdf(lo + k * w);
  const e = (c - prev) * n;
  prev = c;
  if (e < 20) continue;
  chi += (counts[k] - e) ** 2 / e;
  used++;
}
const p = 1 - chi2cdf(chi, used - 1);
console.log(`${which}: ${n} draws, ${used} bins, chi-square ${chi.toFixed(1)}, p = ${p.toExponential(2)}, stats ${JSON.stringify(s.stats)}`);
