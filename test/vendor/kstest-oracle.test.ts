/** The vendored Kolmogorov-Smirnov routine against the full `@stdlib/stats-kstest` package (the oracle). */
import { describe, expect, it } from 'vitest';
import kstestPackage from '@stdlib/stats-kstest';
import { kstest } from '../../src/vendor/stdlib.js';
import { mersenneTwister, normalTarget } from '../../src/index.js';

const full = kstestPackage as unknown as (x: Float64Array, cdf: (x: number) => number, o: { sorted: boolean }) => { statistic: number; pValue: number };

describe('vendored kstest', () => {
  it('kstest(x, cdf) gives the statistic and p-value of @stdlib/stats-kstest, bit for bit, on 40 samples', () => {
    const u = mersenneTwister(9);
    const cdf = normalTarget(0, 1).cdf as (x: number) => number;
    for (let k = 0; k < 40; k++) {
      const n = 5 + k * 37;
      const shift = (k % 4) * 0.1; // samples near and far from the cdf
      const x = Float64Array.from({ length: n }, () => (u() - 0.5) * 4 + shift).sort();
      const a = kstest(x, cdf, { sorted: true });
      const b = full(Float64Array.from(x), cdf, { sorted: true });
      expect([a.statistic, a.pValue]).toEqual([b.statistic, b.pValue]);
    }
  });

  it('twin: a different sample gives a different statistic (the comparison can fail)', () => {
    const cdf = normalTarget(0, 1).cdf as (x: number) => number;
    const x = Float64Array.from([-1, -0.2, 0.3, 0.9, 1.7]);
    const y = x.map((v) => v + 0.01);
    expect(kstest(x, cdf, { sorted: true }).statistic).not.toBe(full(y, cdf, { sorted: true }).statistic);
  });
});
