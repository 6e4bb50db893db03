import { describe, expect, it } from 'vitest';
import { InvalidTargetError, andersonDarlingCheck, mersenneTwister } from '../../src/index.js';
import { adPValue } from '../../src/checks/anderson-darling.js';
import { ALPHA, expectRate } from '../helpers/statistical.js';

const uniformCdf = (x: number): number => (x <= 0 ? 0 : x >= 1 ? 1 : x);

describe('andersonDarlingCheck', () => {
  it('adPValue(1e6, z) matches the asymptotic critical values of Stephens (1974)', () => {
    // Upper-tail percentage points of the limiting distribution of A² for a
    // fully specified distribution (Stephens 1974, JASA 69; D'Agostino &
    // Stephens 1986, Table 4.2, case 0), quoted from memory.
    const table: [number, number][] = [
      [1.933, 0.1],
      [2.492, 0.05],
      [3.07, 0.025],
      [3.857, 0.01],
    ];
    for (const [z, p] of table) {
      expect(Math.abs(adPValue(1e6, z) - p), `A2 = ${z}`).toBeLessThan(2e-3);
    }
  });

  it('adPValue is decreasing in z and lies in [0, 1]', () => {
    let prev = 1;
    for (let z = 0.05; z < 40; z *= 1.2) {
      const p = adPValue(100, z);
      expect(p >= 0 && p <= 1).toBe(true);
      expect(p).toBeLessThanOrEqual(prev + 1e-12);
      prev = p;
    }
  });

  it('andersonDarlingCheck computes A² by the defining formula on a small sample', () => {
    // A² = −n − (1/n) Σ (2i − 1)[ln u(i) + ln(1 − u(n+1−i))] (Anderson & Darling 1954),
    // evaluated by hand for u = (0.2, 0.5, 0.9), n = 3:
    // i=1: 1·[ln 0.2 + ln 0.1]; i=2: 3·[ln 0.5 + ln 0.5]; i=3: 5·[ln 0.9 + ln 0.8]
    const s = 1 * (Math.log(0.2) + Math.log(0.1)) + 3 * (Math.log(0.5) + Math.log(0.5)) + 5 * (Math.log(0.9) + Math.log(0.8));
    // s = −3.91202 − 4.15888 − 1.64252 = −9.71342, so A² = −3 + 9.71342/3 = 0.23781
    const expected = -3 - s / 3;
    expect(expected).toBeCloseTo(0.23781, 4);
    const r = andersonDarlingCheck([0.9, 0.2, 0.5], uniformCdf);
    expect(r.statistic).toBeCloseTo(expected, 12);
  });

  it('andersonDarlingCheck rejects at 0.05 about 5% of null samples (n = 50, 4000 replicates)', () => {
    const u = mersenneTwister(8101);
    const n = 50;
    const reps = 4000;
    const x = new Float64Array(n);
    let rejected = 0;
    for (let r = 0; r < reps; r++) {
      for (let i = 0; i < n; i++) x[i] = u();
      if (andersonDarlingCheck(x, uniformCdf).pValue < 0.05) rejected++;
    }
    expectRate(rejected, reps, 0.05, 'AD null rejection rate');
  });

  it('twin: andersonDarlingCheck rejects far more than 5% of biased samples (u^1.25, n = 50)', () => {
    const u = mersenneTwister(8101);
    const n = 50;
    const reps = 4000;
    const x = new Float64Array(n);
    let rejected = 0;
    for (let r = 0; r < reps; r++) {
      for (let i = 0; i < n; i++) x[i] = Math.pow(u(), 1.25);
      if (andersonDarlingCheck(x, uniformCdf).pValue < 0.05) rejected++;
    }
    expect(rejected / reps).toBeGreaterThan(0.05 + 4.4 * Math.sqrt((0.05 * 0.95) / reps));
  });

  it('andersonDarlingCheck accepts a large uniform sample and rejects a slightly biased one at ALPHA', () => {
    const u = mersenneTwister(8102);
    const n = 20_000;
    const good = new Float64Array(n);
    const bad = new Float64Array(n);
    for (let i = 0; i < n; i++) good[i] = u();
    for (let i = 0; i < n; i++) bad[i] = Math.pow(u(), 1.05);
    expect(andersonDarlingCheck(good, uniformCdf).pValue).toBeGreaterThan(ALPHA);
    expect(andersonDarlingCheck(bad, uniformCdf).pValue).toBeLessThan(ALPHA);
  });

  it('andersonDarlingCheck rejects bad inputs with InvalidTargetError', () => {
    expect(() => andersonDarlingCheck([0.5], uniformCdf)).toThrow(InvalidTargetError);
    expect(() => andersonDarlingCheck([0.5, NaN], uniformCdf)).toThrow(InvalidTargetError);
    expect(() => andersonDarlingCheck(null as unknown as number[], uniformCdf)).toThrow(InvalidTargetError);
    expect(() => andersonDarlingCheck([0.1, 0.2], 3 as unknown as (x: number) => number)).toThrow(InvalidTargetError);
    expect(() => andersonDarlingCheck([0.1, 0.2], () => 1.5)).toThrow(/andersonDarlingCheck: cdf\(.*\) = 1.5/);
    expect(() => andersonDarlingCheck([0.1, 0.2], () => NaN)).toThrow(InvalidTargetError);
  });
});
