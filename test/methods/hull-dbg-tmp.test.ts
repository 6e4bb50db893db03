import { it } from 'vitest';
import { adaptiveRejectionSampler } from '../../src/methods/adaptive-rejection.js';
import { normalTarget } from '../../src/targets/normal.js';
import { mersenneTwister } from '../../src/random/mersenne-twister.js';
it('dbg', () => {
  const u = mersenneTwister(1);
  let acc = 0; let t0 = performance.now(); for (let i = 0; i < 3e6; i++) acc += u(); console.log('3e6 uniforms ms', performance.now() - t0, acc > 0);
  let x = 0; t0 = performance.now(); for (let i = 0; i < 1e6; i++) { x += Math.exp(-i*1e-7) + Math.log1p(-i*1e-7); } console.log('1e6 exp+log1p ms', performance.now() - t0, x !== 0);
  for (const k of [1,2,3]) {
  const s = adaptiveRejectionSampler(normalTarget(0, 1), { seed: 3 });
  s.fill(new Float64Array(100000));
  t0 = performance.now(); const out = new Float64Array(1e6); s.fill(out); console.log('1e6 draws ms', (performance.now() - t0));
  }
  let y = 0; const v = () => Math.random(); t0 = performance.now(); for (let i = 0; i < 3e6; i++) y += v(); console.log('3e6 Math.random ms', performance.now() - t0, y>0);
});
