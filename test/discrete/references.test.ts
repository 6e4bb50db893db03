/**
 * @stdlib discrete pmfs and cdfs checked pointwise against second sources
 * before the statistical tests lean on them.
 */
import binomialLogpmf from '@stdlib/stats-base-dists-binomial-logpmf';
import negativeBinomialLogpmf from '@stdlib/stats-base-dists-negative-binomial-logpmf';
import poissonCdf from '@stdlib/stats-base-dists-poisson-cdf';
import poissonLogpmf from '@stdlib/stats-base-dists-poisson-logpmf';
import gammaln from '@stdlib/math-base-special-gammaln';
import { describe, expect, it } from 'vitest';
import { poissonTarget } from '../../src/index.js';
import { binomialLogPmfRef, poissonLogPmfRef, stirlerr } from '../helpers/discrete-reference.js';

function maxAbsDiff(ks: number[], a: (k: number) => number, b: (k: number) => number): number {
  let m = 0;
  for (const k of ks) m = Math.max(m, Math.abs(a(k) - b(k)));
  return m;
}
const around = (centre: number, sd: number, halfWidth: number, points: number): number[] =>
  Array.from({ length: points }, (_, i) => Math.max(0, Math.round(centre + sd * (-halfWidth + (2 * halfWidth * i) / (points - 1)))));

describe('second-source references', () => {
  it('stirlerr: the series agrees with the exact log-sum at n = 16..40 (checks the recalled coefficients)', () => {
    for (let n = 16; n <= 40; n++) {
      let lf = 0;
      for (let i = 2; i <= n; i++) lf += Math.log(i);
      const exact = lf - ((n + 0.5) * Math.log(n) - n + 0.5 * Math.log(2 * Math.PI));
      expect(Math.abs(stirlerr(n) - exact)).toBeLessThan(2e-13); // log-sum rounding ~ n ulps of ln n!
    }
  });

  it('@stdlib poisson logpmf agrees with Loader\'s saddle-point form at λ = 0.5, 30, 1e4, 1e7 (k within ±8 sd)', () => {
    // measured here (Node 20): max abs differences about 1e-15, 5e-14, 3e-12, 4e-8;
    // at 1e7 @stdlib's k ln λ − λ − ln k! cancels terms near 1.6e8 (ulp 3e-8).
    const cases: [number, number][] = [
      [0.5, 1e-13],
      [30, 1e-12],
      [1e4, 1e-10],
      [1e7, 2e-7],
    ];
    for (const [lambda, tol] of cases) {
      const ks = [...new Set([0, 1, 2, 3, ...around(lambda, Math.sqrt(lambda), 8, 801)])];
      const d = maxAbsDiff(ks, (k) => poissonLogpmf(k, lambda), (k) => poissonLogPmfRef(k, lambda));
      expect(d, `λ = ${lambda}`).toBeLessThan(tol);
    }
  });

  it('@stdlib binomial logpmf agrees with Loader\'s form at (20, 0.3) on all k and at (1e6, 1e-4) within ±8 sd', () => {
    expect(maxAbsDiff(Array.from({ length: 21 }, (_, k) => k), (k) => binomialLogpmf(k, 20, 0.3), (k) => binomialLogPmfRef(k, 20, 0.3))).toBeLessThan(1e-12);
    const ks = around(100, 10, 8, 161);
    expect(maxAbsDiff(ks, (k) => binomialLogpmf(k, 1e6, 1e-4), (k) => binomialLogPmfRef(k, 1e6, 1e-4))).toBeLessThan(1e-9);
  });

  it('@stdlib negative binomial logpmf agrees with the gamma-function form ln Γ(k + r) − ln Γ(r) − ln k! + r ln p + k ln(1 − p)', () => {
    for (const [r, p] of [
      [3.5, 0.1],
      [0.5, 0.05],
      [40, 0.6],
    ] as const) {
      const ref = (k: number): number => gammaln(k + r) - gammaln(r) - gammaln(k + 1) + r * Math.log(p) + k * Math.log1p(-p);
      const ks = Array.from({ length: 400 }, (_, k) => k);
      expect(maxAbsDiff(ks, (k) => negativeBinomialLogpmf(k, r, p), ref), `r = ${r}, p = ${p}`).toBeLessThan(1e-10);
    }
  });

  it('@stdlib poisson cdf: accurate at λ = 30 against summation of the pmf, measured off at λ = 1e4 (so checks sum the pmf instead)', () => {
    let s = 0;
    let worst = 0;
    for (let k = 0; k <= 80; k++) {
      s += Math.exp(poissonLogPmfRef(k, 30));
      worst = Math.max(worst, Math.abs(poissonCdf(k, 30) - s));
    }
    expect(worst).toBeLessThan(1e-13);
    // λ = 1e4 at k = λ: the cdf is Q(k + 1, λ) through @stdlib's incomplete gamma, measured wrong at
    // shapes ≥ 1000 in this project's REFERENCES (gamma cdf); record the size of the error here.
    let t = 0;
    let c = 0;
    for (let k = 0; k <= 1e4; k++) {
      const x = Math.exp(poissonLogPmfRef(k, 1e4));
      const y = t + x;
      c += Math.abs(t) >= Math.abs(x) ? t - y + x : x - y + t;
      t = y;
    }
    t += c;
    // measured: @stdlib gives 0.50670, the summed pmf 0.50266 (error 4.0e-3): poissonTarget does not use it there
    expect(Math.abs(poissonCdf(1e4, 1e4) - t)).toBeGreaterThan(1e-3);
    expect(Math.abs(poissonTarget(1e4).cdf(1e4) - t)).toBeLessThan(1e-10);
  });

  it('poissonTarget cdf (incomplete-gamma series from λ = 100) agrees with summed pmfs at λ = 100, 1e4, 1e6', () => {
    // tolerances: the series is documented better than 1e-10 up to shape 1e5; measured 1.2e-9 at 1e6
    for (const [lambda, tol] of [
      [100, 1e-10],
      [1e4, 1e-10],
      [1e6, 5e-9],
    ]) {
      const sd = Math.sqrt(lambda);
      const lo = Math.max(0, Math.floor(lambda - 12 * sd));
      const hi = Math.ceil(lambda + 6 * sd);
      const cdf = poissonTarget(lambda).cdf;
      let s = 0;
      let worst = 0;
      for (let k = lo; k <= hi; k++) {
        s += Math.exp(poissonLogPmfRef(k, lambda));
        if ((k - lo) % 7 === 0) worst = Math.max(worst, Math.abs(cdf(k) - s));
      }
      expect(worst, `λ = ${lambda}`).toBeLessThan(tol);
    }
  });
});
