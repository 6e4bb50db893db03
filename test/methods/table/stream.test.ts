/**
 * Streams of the fast path: reproducibility, independence from how draws
 * are split between sample() and fill(), the block generator of the
 * sampler's own MT19937 against @stdlib/random-base-mt19937 and the
 * published MT19937 check value, support, the golden snapshot.
 */
import mt19937 from '@stdlib/random-base-mt19937';
import { describe, expect, it } from 'vitest';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import { mersenneTwister } from '../../../src/random/mersenne-twister.js';
import { UNIFORM_BLOCK_SIZE, UniformBlock, nextUniform } from '../../../src/random/uniform-block.js';
import { betaTarget } from '../../../src/targets/beta.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';
import { truncate } from '../../../src/targets/truncate.js';
import { draw, expectInSupport, expectReproducible } from '../../helpers/statistical.js';

/** A plain @stdlib MT19937 (the 32-bit generator with its `normalized` 53-bit uniform). */
function stdlibMt(seed: number): { (): number; normalized: () => number } {
  return mt19937.factory({ seed }) as unknown as { (): number; normalized: () => number };
}

describe('tableSampler streams', () => {
  it('tableSampler: same seed same draws, different seed different draws (log, inverse-sqrt, few strips)', () => {
    expectReproducible((seed) => tableSampler(gammaTarget(2.5), { seed }));
    expectReproducible((seed) => tableSampler(studentTTarget(3), { seed, transform: 'inverse-sqrt' }));
    expectReproducible((seed) => tableSampler(normalTarget(0, 1), { seed, strips: 10 }), 2000);
  });

  it('tableSampler: sample() and fill() in any split give the same draws (the table never adapts)', () => {
    for (const strips of [10, 1000]) {
      const a = draw(tableSampler(normalTarget(0, 1), { seed: 9, strips }), 3000);
      const b = tableSampler(normalTarget(0, 1), { seed: 9, strips });
      const ys: number[] = [];
      for (let i = 0; i < 1000; i++) ys.push(b.sample());
      ys.push(...draw(b, 1500));
      for (let i = 0; i < 500; i++) ys.push(b.sample());
      expect(Array.from(a)).toEqual(ys);
    }
  });

  it('tableSampler({ seed }) draws exactly what tableSampler({ uniform: mersenneTwister(seed) }) draws (block generator = @stdlib stream)', () => {
    // the seeded sampler reads its own MT19937 in blocks; the injected one calls the
    // @stdlib-backed source one value at a time: equal draws mean equal uniforms
    for (const [t, strips] of [[normalTarget(0, 1), 1000], [gammaTarget(2.5), 10], [betaTarget(2, 5), 40]] as const) {
      for (const seed of [1, 5489, 2 ** 40 + 3]) {
        const a = draw(tableSampler(t, { seed, strips }), 5000);
        const b = draw(tableSampler(t, { uniform: mersenneTwister(seed), strips }), 5000);
        expect(Array.from(a)).toEqual(Array.from(b));
      }
    }
  });

  it('UniformBlock.fromOwnedMersenneTwister reproduces @stdlib normalized() over many twists, from a fresh and from a used state', () => {
    const ref = stdlibMt(2024);
    const blk = UniformBlock.fromOwnedMersenneTwister(mersenneTwister(2024));
    for (let i = 0; i < 20 * UNIFORM_BLOCK_SIZE + 7; i++) {
      const v = nextUniform(blk);
      const w = ref.normalized();
      if (v !== w) expect.fail(`uniform ${i}: block ${v}, @stdlib ${w}`);
    }
    // a source advanced by an odd number of 32-bit outputs before the block takes over
    const used = mersenneTwister(77);
    used.uint32();
    for (let i = 0; i < 333; i++) used();
    const ref2 = stdlibMt(77);
    ref2();
    for (let i = 0; i < 333; i++) ref2.normalized();
    const blk2 = UniformBlock.fromOwnedMersenneTwister(used);
    for (let i = 0; i < 3 * UNIFORM_BLOCK_SIZE; i++) expect(nextUniform(blk2)).toBe(ref2.normalized());
  });

  it('UniformBlock: the 10,000th MT19937 output for seed 5489 is 4123659995 (ISO/IEC 14882:2011 [rand.predef])', () => {
    // uniform k is ((a >>> 5)·2^26 + (b >>> 6))/2^53 for outputs a = 2k − 1, b = 2k, so the
    // 5,000th uniform carries the top 26 bits of the 10,000th output in its low 26 bits
    const blk = UniformBlock.fromOwnedMersenneTwister(mersenneTwister(5489));
    let u = 0;
    for (let i = 0; i < 5000; i++) u = nextUniform(blk);
    const k = u * 2 ** 53;
    expect(k % 2 ** 26).toBe(4123659995 >>> 6);
  });

  it('tableSampler keeps every draw inside the support (also at finite ends with positive density)', () => {
    expectInSupport(draw(tableSampler(gammaTarget(1.05), { seed: 3 }), 20_000), 0, Infinity);
    expectInSupport(draw(tableSampler(gammaTarget(1), { seed: 3, strips: 10 }), 20_000), 0, Infinity);
    expectInSupport(draw(tableSampler(betaTarget(1, 1), { seed: 3 }), 20_000), 0, 1);
    expectInSupport(draw(tableSampler(betaTarget(1, 1), { seed: 3, strips: 2 }), 20_000), 0, 1);
    expectInSupport(draw(tableSampler(truncate(normalTarget(0, 1), 8, Infinity), { seed: 3 }), 20_000), 8, Infinity);
    expectInSupport(draw(tableSampler(truncate(normalTarget(0, 1), -0.3, 0.2), { seed: 3, transform: 'inverse-sqrt' }), 20_000), -0.3, 0.2);
    expectInSupport(draw(tableSampler(truncate(gammaTarget(3), 40, 41), { seed: 3 }), 20_000), 40, 41);
    expectInSupport(draw(tableSampler(truncate(normalTarget(0, 1), 1, 1 + 1e-12), { seed: 3, strips: 50 }), 20_000), 1, 1 + 1e-12);
  });

  it('tableSampler works with densities near 1e-300 (unnormalized log-density offset by −700) and with 2 to 7 strips', () => {
    const t = { logDensity: (x: number) => -700 - 0.5 * x * x, dLogDensity: (x: number) => -x, mode: 0 };
    const s = tableSampler(t, { seed: 6 });
    const xs = draw(s, 20_000);
    let m = 0;
    for (const x of xs) m += x / xs.length;
    expect(Math.abs(m)).toBeLessThan(0.04); // 5.7 standard errors of the mean (1/sqrt(20000))
    // log of the envelope area >= log Z = -700 + log(sqrt(2π)) (normalizing constant of a normal, common practice)
    expect(s.table.logEnvelopeArea).toBeGreaterThanOrEqual(-700 + 0.5 * Math.log(2 * Math.PI));
    for (let strips = 2; strips <= 7; strips++) {
      const ys = draw(tableSampler(normalTarget(0, 1), { seed: strips, strips }), 5000);
      let v = 0;
      for (const y of ys) v += (y * y) / ys.length;
      expect(Math.abs(v - 1)).toBeLessThan(0.1); // sd of the sample second moment is sqrt(2/5000) = 0.02 (common practice)
    }
  });

  it('adaptiveRejectionSampler(t, { fast: true }) is tableSampler(t) with the defaults', () => {
    const a = draw(adaptiveRejectionSampler(gammaTarget(2.5), { seed: 4, fast: true }), 2000);
    const b = draw(tableSampler(gammaTarget(2.5), { seed: 4 }), 2000);
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('tableSampler(normal(0, 1), seed 1) and (gamma(2.5), 10 strips, seed 1): golden first five draws', () => {
    // Stream-stability snapshots recorded from this implementation (not correctness
    // references): a change here changes users' streams and must be noted in
    // CHANGELOG.md (DEVELOPERS.md, "Stream-stability policy").
    expect(Array.from(draw(tableSampler(normalTarget(0, 1), { seed: 1 }), 5))).toEqual(GOLDEN_NORMAL);
    expect(Array.from(draw(tableSampler(gammaTarget(2.5), { seed: 1, strips: 10 }), 5))).toEqual(GOLDEN_GAMMA_10);
  });
});

/** Snapshot of tableSampler(normalTarget(0, 1), { seed: 1 }), first five draws (recorded, not a reference). */
const GOLDEN_NORMAL: number[] = [-0.20090935806235302, 0.4614234512939177, -2.056998984042108, -0.4581672950089436, -1.3322895844384361];
/** Snapshot of tableSampler(gammaTarget(2.5), { seed: 1, strips: 10 }), first five draws (recorded, not a reference). */
const GOLDEN_GAMMA_10: number[] = [4.295824376001921, 2.647525926168273, 0.4394801518856295, 2.8972904147244534, 7.074217629862032];
