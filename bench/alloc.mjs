#!/usr/bin/env node
// Bytes allocated per draw by each method's fill, against the build (dist/):
//   npm run build && node bench/alloc.mjs [--draws 200000]
//
// V8's sampling heap profiler (node:inspector), objects collected by the
// minor and major GC included, over three fills after three warm-up fills;
// every case in a fresh process (the profile of one case must not see
// another's code). A kernel should allocate nothing per draw (DEVELOPERS.md,
// benchmark policy); a figure near 16 bytes per draw is one boxed double per
// draw, usually a value that the engine keeps tagged because it merges with a
// call's result or a field of an object. Sampling is statistical: figures
// below about 1 byte per draw are noise of the profiler's interval.
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : dflt;
};
const DRAWS = Number(opt('--draws', 200000));
const CASES = {
  'adaptiveRejectionSampler normal': (ed) => ed.adaptiveRejectionSampler(ed.normalTarget(0, 1), { seed: 1 }),
  'adaptiveRejectionSampler gamma(2.5)': (ed) => ed.adaptiveRejectionSampler(ed.gammaTarget(2.5, 1), { seed: 1 }),
  'tableSampler normal': (ed) => ed.tableSampler(ed.normalTarget(0, 1), { seed: 1 }),
  'tableSampler gamma(2.5)': (ed) => ed.tableSampler(ed.gammaTarget(2.5, 1), { seed: 1 }),
  'piecewiseSampler normal': (ed) => ed.piecewiseSampler(ed.normalTarget(0, 1), { seed: 1 }),
  'piecewiseSampler normal, fast': (ed) => ed.piecewiseSampler(ed.normalTarget(0, 1), { seed: 1, fast: true }),
  'ratioOfUniformsSampler Student-t(3)': (ed) => ed.ratioOfUniformsSampler(ed.studentTTarget(3), { seed: 1 }),
  'rejectionSampler normal, Cauchy proposal': (ed) => ed.rejectionSampler(ed.normalTarget(0, 1), { proposal: ed.cauchyProposal(0, 1), seed: 1 }),
  'discreteSampler Poisson(30)': (ed) => ed.discreteSampler(ed.poissonTarget(30), { seed: 1 }),
  'weightedIndexSampler 5 weights': (ed) => ed.weightedIndexSampler(new Float64Array([1, 2, 3, 4, 5]), { seed: 1 }),
  // a Gibbs step per "draw": the bench/gibbs.mjs workload (a gamma-shaped conditional whose shape and
  // rate change every step), one conditionalSampler, one target object whose closures read the state
  'conditionalSampler step, tangents (per step)': (ed) => gibbsSteps(ed, true),
  'conditionalSampler step, secants (per step)': (ed) => gibbsSteps(ed, false),
};

function gibbsSteps(ed, tangents) {
  let a = 2.5;
  let b = 1.3;
  const conditional = tangents
    ? { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t, dLogDensity: (t) => (a - 1) / t - b }
    : { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t };
  const s = ed.conditionalSampler({ seed: 1 });
  return {
    fill(out) {
      for (let i = 0; i < out.length; i++) {
        a = 1.5 + (i % 11) * 0.4;
        b = 0.5 + (i % 7) * 0.25;
        out[i] = s.draw(conditional);
      }
      return out;
    },
  };
}

const child = opt('--case', undefined);
if (child !== undefined) {
  const { Session } = await import('node:inspector/promises');
  const ed = await import('../dist/index.js');
  const s = CASES[child](ed);
  const out = new Float64Array(DRAWS);
  for (let r = 0; r < 3; r++) s.fill(out);
  const session = new Session();
  session.connect();
  await session.post('HeapProfiler.startSampling', { samplingInterval: 512, includeObjectsCollectedByMinorGC: true, includeObjectsCollectedByMajorGC: true });
  for (let r = 0; r < 3; r++) s.fill(out);
  const { profile } = await session.post('HeapProfiler.stopSampling');
  for (let i = 0; i < out.length; i++) if (out[i] !== out[i]) throw new Error('NaN draw');
  const byFunction = {};
  let total = 0;
  (function walk(n) {
    const k = n.callFrame.functionName || '(anonymous)';
    byFunction[k] = (byFunction[k] ?? 0) + n.selfSize;
    total += n.selfSize;
    for (const c of n.children) walk(c);
  })(profile.head);
  const top = Object.entries(byFunction).sort((a, b) => b[1] - a[1]).slice(0, 3);
  console.log(JSON.stringify({ perDraw: total / (3 * DRAWS), top: top.map(([k, v]) => [k, v / (3 * DRAWS)]) }));
} else {
  console.log(`bytes allocated per draw (${DRAWS} draws per fill, 3 fills after 3 warm-up fills, sampling heap profiler, fresh process per case)`);
  for (const name of Object.keys(CASES)) {
    const r = JSON.parse(execFileSync(process.execPath, [fileURLToPath(import.meta.url), '--case', name, '--draws', String(DRAWS)], { encoding: 'utf8' }));
    console.log(`${name.padEnd(44)} ${r.perDraw.toFixed(2).padStart(7)} B/draw   top: ${r.top.map(([k, v]) => `${k} ${v.toFixed(1)}`).join(', ')}`);
  }
}
