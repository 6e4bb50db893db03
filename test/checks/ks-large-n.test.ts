import { describe, expect, it } from 'vitest';
import kstest from '@stdlib/stats-kstest';
import { KS_EXACT_MAX_N, kolmogorovQ, ksCheck } from '../../src/checks/ks.js';
import { mersenneTwister } from '../../src/random/mersenne-twister.js';

const uniformCdf = (x: number): number => (x <= 0 ? 0 : x >= 1 ? 1 : x);

describe('ksCheck for large n (Stephens-corrected limiting distribution)', () => {
  it('kolmogorovQ matches the asymptotic critical values: Q(1.3581) = 0.05, Q(1.6276) = 0.01, Q(1.9495) = 0.001', () => {
    // Critical values of the Kolmogorov distribution (Smirnov 1948 tables; from memory).
    expect(kolmogorovQ(1.3581)).toBeCloseTo(0.05, 4);
    expect(kolmogorovQ(1.6276)).toBeCloseTo(0.01, 4);
    expect(kolmogorovQ(1.9495)).toBeCloseTo(0.001, 5);
    // Both series agree where they switch.
    expect(Math.abs(kolmogorovQ(1.18 - 1e-12) - kolmogorovQ(1.18))).toBeLessThan(1e-10);
  });

  it('ksCheck p-values for n just above the exact threshold agree with @stdlib/stats-kstest (exact) within 5% of p', () => {
    const u = mersenneTwister(9100);
    const n = KS_EXACT_MAX_N + 200;
    const x = new Float64Array(n);
    let compared = 0;
    for (const power of [1, 1.02, 1.05, 1.08, 1.1, 1.12]) {
      for (let i = 0; i < n; i++) x[i] = Math.pow(u(), power);
      const ours = ksCheck(x, uniformCdf);
      const exact = kstest(Float64Array.from(x).sort(), uniformCdf, { sorted: true });
      expect(ours.statistic).toBeCloseTo(exact.statistic, 12);
      if (exact.pValue > 1e-6) {
        expect(Math.abs(ours.pValue / exact.pValue - 1), `p ${ours.pValue} vs exact ${exact.pValue}`).toBeLessThan(0.05);
        compared++;
      }
    }
    expect(compared).toBeGreaterThanOrEqual(4);
  });
});
