import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import { normalFromUniform, normalQuantile } from '../../src/proposals/_internals/normal-quantile.js';

describe('normalQuantile (Wichura AS 241, PPND16)', () => {
  it('normalQuantile inverts @stdlib normal cdf to ~1e-15 relative across (1e-300, 1/2]', () => {
    // Reference: @stdlib/stats-base-dists-normal-cdf. The relative error of p = Φ(z(p))
    // is at most |z|·Δz·φ/Φ ≈ z² · (relative error of z) in the tail, so a 1e-16
    // quantile gives about 1e-13 at p = 1e-300 (|z| ≈ 37).
    for (let e = -300; e <= -1; e += 0.5) {
      for (const m of [1, 2.5, 5]) {
        const p = m * Math.pow(10, e);
        if (p > 0.5) continue;
        const z = normalQuantile(p);
        const tol = 2e-15 * Math.max(1, z * z);
        expect(Math.abs(normalCdf(z, 0, 1) / p - 1), `p = ${p}`).toBeLessThan(tol);
      }
    }
    for (let p = 0.075; p <= 0.5; p += 0.0125) {
      expect(Math.abs(normalCdf(normalQuantile(p), 0, 1) / p - 1), `p = ${p}`).toBeLessThan(2e-15);
    }
  });

  it('normalQuantile is antisymmetric and matches known quantiles', () => {
    // Φ⁻¹(0.975) = 1.959963984540054 (standard tables; common practice)
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963984540054, 14);
    expect(normalQuantile(0.5)).toBe(0);
    // dyadic p, so that 1 − p is exact
    for (const p of [2 ** -34, 2 ** -7, 0.25, 0.375]) expect(normalQuantile(1 - p) + normalQuantile(p)).toBeCloseTo(0, 12);
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
    expect(normalQuantile(1.5)).toBeNaN();
    expect(normalQuantile(NaN)).toBeNaN();
  });

  it('normalFromUniform maps the ends of [0, 1) to finite, opposite deviates', () => {
    const lo = normalFromUniform(0);
    const hi = normalFromUniform(1 - Math.pow(2, -53));
    expect(Number.isFinite(lo)).toBe(true);
    expect(lo).toBeCloseTo(-hi, 10);
    expect(lo).toBeLessThan(-8);
    expect(lo).toBeGreaterThan(-8.5);
    // p = 0 + 2^-54: Φ(lo) = 2^-54
    expect(Math.abs(normalCdf(lo, 0, 1) / Math.pow(2, -54) - 1)).toBeLessThan(1e-13);
    // symmetric: v and 1 − 2^-53 − v give opposite deviates
    for (const v of [0.001, 0.1, 0.3, 0.49]) {
      expect(normalFromUniform(v) + normalFromUniform(1 - Math.pow(2, -53) - v)).toBeCloseTo(0, 12);
    }
  });
});
