import { describe, expect, it } from 'vitest';
import { InvalidTargetError, chiSquareCheck, mersenneTwister, substream } from '../../src/index.js';
import type { Uniform } from '../../src/index.js';
import { ALPHA } from '../helpers/statistical.js';

const N = 100_000;

function take(u: Uniform, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = u();
  return out;
}

/** Pearson correlation of two equal-length samples. */
function correlation(x: Float64Array, y: Float64Array): number {
  const n = x.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  return sxy / Math.sqrt(sxx * syy);
}

/** Chi-square test of independence-and-uniformity of the pairs (x_i, y_i) on a 10 × 10 grid. */
function gridPValue(x: Float64Array, y: Float64Array): number {
  const counts = new Array<number>(100).fill(0);
  for (let i = 0; i < x.length; i++) {
    counts[Math.floor(x[i] * 10) * 10 + Math.floor(y[i] * 10)]++;
  }
  return chiSquareCheck(counts, new Array<number>(100).fill(0.01)).pValue;
}

describe('substream', () => {
  it('substream(seed, i) is reproducible from (seed, i) alone', () => {
    const a = take(substream(2026, 7), 1000);
    const b = take(substream(2026, 7), 1000);
    expect(Array.from(b)).toEqual(Array.from(a));
  });

  it('substream(seed, i) differs across i, across seeds, and from mersenneTwister(seed)', () => {
    const firsts = new Set<number>();
    for (let i = 0; i < 200; i++) firsts.add(substream(2026, i)());
    expect(firsts.size).toBe(200);
    expect(substream(2026, 0)()).not.toBe(substream(2027, 0)());
    expect(substream(2026, 0)()).not.toBe(mersenneTwister(2026)());
    // large seeds and indices are accepted and distinct
    expect(substream(2 ** 53 - 1, 2 ** 53 - 1)()).not.toBe(substream(2 ** 53 - 1, 2 ** 53 - 2)());
  });

  it('substream() values lie in [0, 1)', () => {
    const x = take(substream(1, 2), 50_000);
    for (let i = 0; i < x.length; i++) {
      if (!(x[i] >= 0 && x[i] < 1)) expect.fail(`draw ${i} = ${x[i]}`);
    }
  });

  it('substream(seed, 0) and substream(seed, 1) are uncorrelated and jointly uniform on a 10 x 10 grid', () => {
    const x = take(substream(2026, 0), N);
    const y = take(substream(2026, 1), N);
    // Under independence the sample correlation is approximately N(0, 1/n)
    // (common practice); 4.4 sd ≈ two-sided 1e-5.
    expect(Math.abs(correlation(x, y))).toBeLessThan(4.4 / Math.sqrt(N));
    expect(gridPValue(x, y)).toBeGreaterThan(ALPHA);
    // serial pairs (u_2k, u_2k+1) within substream 0 on the same grid
    const even = new Float64Array(N / 2);
    const odd = new Float64Array(N / 2);
    for (let k = 0; k < N / 2; k++) {
      even[k] = x[2 * k];
      odd[k] = x[2 * k + 1];
    }
    expect(gridPValue(even, odd)).toBeGreaterThan(ALPHA);
  });

  it('twin: a deliberately correlated pair of streams is rejected by the same checks at the same n', () => {
    const x = take(substream(2026, 0), N);
    const w = take(substream(2026, 1), N);
    const coin = substream(2026, 2);
    // y copies x 5% of the time: correlation about 0.05
    const y = new Float64Array(N);
    for (let i = 0; i < N; i++) y[i] = coin() < 0.05 ? x[i] : w[i];
    expect(Math.abs(correlation(x, y))).toBeGreaterThan(4.4 / Math.sqrt(N));
    expect(gridPValue(x, y)).toBeLessThan(ALPHA);
  });

  it('substream(2026, 3) regression snapshot of the first 5 values', () => {
    // REGRESSION SNAPSHOT, not a correctness reference: these values were
    // recorded from this implementation and guard the stability of the
    // substream derivation (a change is a breaking change: DEVELOPERS.md, "Stream-stability policy").
    const u = substream(2026, 3);
    expect(Array.from({ length: 5 }, () => u())).toEqual(SNAPSHOT);
  });

  it('substream rejects bad seeds and indices with InvalidTargetError', () => {
    for (const [s, i] of [
      [-1, 0],
      [0, -1],
      [1.5, 0],
      [0, 2.5],
      [NaN, 0],
      [0, Infinity],
      [2 ** 53, 0],
    ]) {
      expect(() => substream(s, i)).toThrow(InvalidTargetError);
    }
    expect(() => substream(3, -2)).toThrow(/substream: index .*-2/);
  });
});

const SNAPSHOT: number[] = [0.512380045011251, 0.11899377612206374, 0.6206518737319338, 0.6716839325978377, 0.5791510539459489];
