/**
 * One after-failure behaviour for every method (core/draws.ts, wrapDraws):
 * after an error that shows the sampler cannot draw correctly (here a
 * logDensity that starts returning NaN once the sampler is built), every
 * later sample() and fill() throws the same error object without drawing;
 * after fill throws, out[0..k) hold the k draws completed before the failure
 * (k = the increase of stats.samples) and the rest of out is unchanged. A
 * StalledSamplerError leaves the sampler usable.
 */
import { describe, expect, it } from 'vitest';
import {
  NonFiniteDensityError,
  StalledSamplerError,
  adaptiveRejectionSampler,
  cauchyProposal,
  exactSampler,
  normalTarget,
  piecewiseSampler,
  ratioOfUniformsSampler,
  rejectionSampler,
  tableSampler,
} from '../../../src/index.js';
import type { Sampler, Target } from '../../../src/index.js';

const makers: [string, (t: Target) => Sampler][] = [
  ['rejectionSampler', (t) => rejectionSampler(t, { proposal: cauchyProposal(0, 1), seed: 1 })],
  ['adaptiveRejectionSampler', (t) => adaptiveRejectionSampler(t, { seed: 1 })],
  ['adaptiveRejectionSampler ({ fast: true })', (t) => adaptiveRejectionSampler(t, { seed: 1, fast: true })],
  ['tableSampler', (t) => tableSampler(t, { seed: 1 })],
  ['piecewiseSampler', (t) => piecewiseSampler(t, { seed: 1 })],
  ['piecewiseSampler ({ fast: true })', (t) => piecewiseSampler(t, { seed: 1, fast: true })],
  ['ratioOfUniformsSampler', (t) => ratioOfUniformsSampler(t, { seed: 1 })],
  ['exactSampler', (t) => exactSampler(t, { seed: 1 })],
  ['exactSampler (expectedDraws 1e6)', (t) => exactSampler(t, { seed: 1, expectedDraws: 1_000_000 })],
];

const UNTOUCHED = -12345;

describe('after a failure every method behaves the same', () => {
  for (const [name, make] of makers) {
    it(`${name}: the error is kept and rethrown; out holds the completed draws, the rest is unchanged`, () => {
      const base = normalTarget(0, 1);
      let broken = false;
      const target: Target = {
        logDensity: (x: number) => (broken ? NaN : base.logDensity(x)),
        dLogDensity: (x: number) => (base.dLogDensity as (x: number) => number)(x),
        mode: 0,
      };
      const s = make(target);
      s.fill(new Float64Array(1000));
      broken = true;
      const before = s.stats.samples;
      // the table paths evaluate the target at about 1e-4 of draws: 500,000 draws reach an evaluation
      const out = new Float64Array(500_000).fill(UNTOUCHED);
      let first: unknown;
      try {
        s.fill(out);
      } catch (e) {
        first = e;
      }
      expect(first, name).toBeInstanceOf(NonFiniteDensityError);
      const k = s.stats.samples - before;
      expect(k).toBeLessThan(out.length);
      for (let i = 0; i < k; i++) expect(out[i]).not.toBe(UNTOUCHED);
      for (let i = k; i < out.length; i++) if (out[i] !== UNTOUCHED) expect.fail(`${name}: out[${i}] written after the failure at ${k}`);
      const stats = s.stats;
      broken = false; // even a target that recovers does not revive the sampler
      expect(() => s.sample()).toThrow(first as Error);
      let again: unknown;
      try {
        s.fill(new Float64Array(10));
      } catch (e) {
        again = e;
      }
      expect(again, `${name}: the same error object`).toBe(first);
      expect(s.stats).toEqual(stats);
    });
  }

  it('a StalledSamplerError leaves rejectionSampler and adaptiveRejectionSampler usable', () => {
    // a wrong-but-valid proposal far from the mass: almost every candidate is rejected
    const r = rejectionSampler(normalTarget(0, 1), { proposal: cauchyProposal(30, 0.1), maxRejections: 2, seed: 1 });
    expect(() => r.fill(new Float64Array(100))).toThrow(StalledSamplerError);
    let ok = 0;
    for (let i = 0; i < 2000 && ok === 0; i++) {
      try {
        r.sample();
        ok++;
      } catch (e) {
        expect(e).toBeInstanceOf(StalledSamplerError);
      }
    }
    expect(ok).toBe(1);
    const a = adaptiveRejectionSampler(normalTarget(0, 1), { maxRejections: 1, seed: 1, startPoints: [-0.1, 0.1] });
    let stalls = 0;
    let draws = 0;
    for (let i = 0; i < 200; i++) {
      try {
        a.sample();
        draws++;
      } catch (e) {
        expect(e).toBeInstanceOf(StalledSamplerError);
        stalls++;
      }
    }
    expect(stalls).toBeGreaterThan(0);
    expect(draws).toBeGreaterThan(stalls);
  });
});
