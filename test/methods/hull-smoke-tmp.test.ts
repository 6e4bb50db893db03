import { it } from 'vitest';
import { adaptiveRejectionSampler } from '../../src/methods/adaptive-rejection.js';
import { normalTarget } from '../../src/targets/normal.js';
import { gammaTarget } from '../../src/targets/gamma.js';
import { betaTarget } from '../../src/targets/beta.js';
import { studentTTarget } from '../../src/targets/student-t.js';
import { truncate } from '../../src/targets/truncate.js';
import { ksCheck } from '../../src/checks/ks.js';

function run(name: string, t: any, opts: any = {}) {
  try {
    const s = adaptiveRejectionSampler(t, { seed: 1, ...opts });
    const st0 = s.stats; const e0 = s.envelope;
    const xs = s.fill(new Float64Array(20000));
    const st = s.stats;
    const ks = t.cdf ? ksCheck(xs, (x: number) => t.cdf(x)).pValue : NaN;
    console.log(name, 'setup', st0.setupEvaluations, 'k0', e0.touchPoints.length, 'pts', e0.touchPoints.map((x:number)=>x.toPrecision(4)).join(' '), '| evals/draw', (st.densityEvaluations/st.samples).toFixed(4), 'acc', st.acceptanceRate.toFixed(4), 'k', s.envelope.touchPoints.length, 'ks p', ks.toFixed(4));
  } catch (e) { console.log(name, 'ERROR', (e as Error).name, (e as Error).message); }
}
it('smoke', () => {
  run('normal', normalTarget(0, 1));
  run('normal free', normalTarget(0, 1), { derivativeFree: true });
  run('normal inv', normalTarget(0, 1), { transform: 'inverse-sqrt' });
  run('normal far', normalTarget(1e6, 1e-6));
  run('normal big', normalTarget(-1e6, 1e6));
  run('normal 1e9', normalTarget(1e9, 1e-9));
  run('gamma 2.5', gammaTarget(2.5));
  run('gamma 1', gammaTarget(1));
  run('gamma 1.2', gammaTarget(1.2, 3));
  run('gamma 1e4', gammaTarget(1e4));
  run('gamma 2.5 free', gammaTarget(2.5), { derivativeFree: true });
  run('gamma 2.5 inv', gammaTarget(2.5), { transform: 'inverse-sqrt' });
  run('beta 2 3', betaTarget(2, 3));
  run('beta 1 4', betaTarget(1, 4));
  run('beta 1 4 free', betaTarget(1, 4), { derivativeFree: true });
  run('beta 1000 1000', betaTarget(1000, 1000));
  run('beta 1 1', betaTarget(1, 1));
  run('tn 8', truncate(normalTarget(0, 1), 8, Infinity));
  run('tn 8 free', truncate(normalTarget(0, 1), 8, Infinity), { derivativeFree: true });
  run('t3 inv', studentTTarget(3), { transform: 'inverse-sqrt' });
  run('t3 inv free', studentTTarget(3), { transform: 'inverse-sqrt', derivativeFree: true });
  run('t1 inv', studentTTarget(1), { transform: 'inverse-sqrt' });
  run('t3 log', studentTTarget(3));
  run('exp+', { logDensity: (x: number) => (x >= 0 ? x : -Infinity), dLogDensity: () => 1, support: [0, Infinity] });
  run('exp+ free', { logDensity: (x: number) => (x >= 0 ? x : -Infinity), support: [0, Infinity] });
  const mix = { logDensity: (x: number) => Math.log(Math.exp(-0.5*(x-3)**2) + Math.exp(-0.5*(x+3)**2)) };
  run('bimodal free', mix);
  run('normal nohint', { logDensity: (x: number) => -0.5*((x-1e6)/1e-6)**2, dLogDensity: (x: number) => -(x-1e6)/1e-12 });
  run('normal nohint free', { logDensity: (x: number) => -0.5*((x-1e3)/1e-2)**2 });
});
