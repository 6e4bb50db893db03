import betaln from '@stdlib/math-base-special-betaln';
import gammaln from '@stdlib/math-base-special-gammaln';
import { describe, expect, it } from 'vitest';
import {
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  MIN_POLE_DISTANCE,
  ShapeViolationError,
  adaptiveRejectionSampler,
  betaTarget,
  exactSampler,
  gammaTarget,
  normalTarget,
  poleTransform,
  ratioOfUniformsSampler,
  weibullTarget,
} from '../../../src/index.js';
import type { PoleTarget, TransformedSampler } from '../../../src/index.js';

/** softplus(t) = log(1 + e^t), computed stably (common practice). */
const softplus = (t: number): number => Math.max(t, 0) + Math.log1p(Math.exp(-Math.abs(t)));

describe('poleTransform: the transformed density is stable far into its tails', () => {
  it("poleTransform(gamma(shape), 'lower'): log g(y) = shape·y − e^y − lnΓ(shape) (closed form) from y = −700 to 6", () => {
    for (const a of [0.5, 0.05]) {
      const tr = poleTransform(gammaTarget(a), 'lower');
      expect(tr.map).toBe('log-lower');
      for (const y of [-700, -300, -40, -1, 0, 2, 6]) {
        const ref = a * y - Math.exp(y) - gammaln(a);
        expect(Math.abs(tr.target.logDensity(y) - ref), `y = ${y}`).toBeLessThan(1e-12 * (1 + Math.abs(ref)));
        expect(Math.abs(tr.target.dLogDensity!(y) - (a - Math.exp(y))), `y = ${y}`).toBeLessThan(1e-12 * (1 + Math.exp(y)));
      }
      expect(tr.target.support![0]).toBeCloseTo(Math.log(MIN_POLE_DISTANCE), 12);
    }
  });

  it("poleTransform(beta(a, b), 'both'): log g(y) = −a·softplus(−y) − b·softplus(y) − lnB(a, b) (closed form) for |y| up to 700", () => {
    for (const [a, b] of [[0.5, 0.5], [0.1, 0.1], [0.3, 0.8]] as const) {
      const tr = poleTransform(betaTarget(a, b), 'both');
      expect(tr.map).toBe('logit');
      for (const y of [-700, -200, -37, -5, -0.5, 0, 0.5, 5, 37, 200, 700]) {
        const ref = -a * softplus(-y) - b * softplus(y) - betaln(a, b);
        expect(Math.abs(tr.target.logDensity(y) - ref), `beta(${a}, ${b}) y = ${y}`).toBeLessThan(1e-12 * (1 + Math.abs(ref)));
        // d/dy: a·σ(−y) − b·σ(y)
        const sig = (t: number): number => (t >= 0 ? 1 / (1 + Math.exp(-t)) : Math.exp(t) / (1 + Math.exp(t)));
        const dref = a * sig(-y) - b * sig(y);
        expect(Math.abs(tr.target.dLogDensity!(y) - dref), `beta(${a}, ${b}) y = ${y}`).toBeLessThan(1e-12);
      }
    }
  });

  it("poleTransform(beta(2, 0.3), 'upper'): evaluated by the distance 1 − x, exact where x itself rounds to 1", () => {
    const tr = poleTransform(betaTarget(2, 0.3), 'upper');
    for (const y of [-600, -60, -40, -3]) {
      // log f(1 − d) + log d with d = e^y: log(2 − 1 + …): (a − 1)·log1p(−d) + (b − 1)·y + y − lnB (closed form)
      const d = Math.exp(y);
      const ref = Math.log1p(-d) + 0.3 * y - betaln(2, 0.3);
      expect(Math.abs(tr.target.logDensity(y) - ref), `y = ${y}`).toBeLessThan(1e-12 * (1 + Math.abs(ref)));
    }
    // without the distance form the same end would need x = 1 − e^−60, which is 1: the density there is lost
    expect(1 - Math.exp(-60)).toBe(1);
  });

  it('toX maps back with full resolution at 0 and never onto a pole', () => {
    const g = poleTransform(gammaTarget(0.5), 'lower');
    expect(g.toX(-700)).toBe(Math.exp(-700));
    expect(g.toX(g.target.support![0])).toBeGreaterThan(0);
    const b = poleTransform(betaTarget(0.5, 0.5), 'both');
    expect(b.toX(-700)).toBe(Math.exp(-700) / (1 + Math.exp(-700)));
    expect(b.toX(700)).toBeLessThan(1); // 1 − e^−700 rounds to 1: moved to the largest double below 1
    expect(b.toX(700)).toBe(1 - Math.pow(2, -53));
    expect(b.toX(3)).toBe(1 - Math.exp(-3) / (1 + Math.exp(-3)));
  });

  it('a pole at an end e ≠ 0 without a distance form is represented down to 2^30 spacings of the doubles at e', () => {
    // invented: f(x) ∝ (x − 2)^(−1/2) on [2, 3]
    const t = { logDensity: (x: number) => (x > 2 && x <= 3 ? -0.5 * Math.log(x - 2) : -Infinity), support: [2, 3] as const };
    const tr = poleTransform(t, 'lower');
    expect(tr.minDistanceLower).toBe(Math.pow(2, 30) * 2 * Number.EPSILON);
    // with the distance form: 2^−1022
    const tf: PoleTarget = { ...t, logDensityFromLower: (d: number) => (d > 0 && d <= 1 ? -0.5 * Math.log(d) : -Infinity) };
    expect(poleTransform(tf, 'lower').minDistanceLower).toBe(MIN_POLE_DISTANCE);
    // the mass below 2^30 ulps (√(4.8e-7) ≈ 7e-4 of it) is too much to leave out: refused loudly
    expect(() => exactSampler(t)).toThrow(InvalidTargetError);
    expect(() => exactSampler(t)).toThrow(/closer than the change of variables Y = log\(X − 2\) represents.*logDensityFromLower/);
    // with the distance form it samples
    const xs = exactSampler(tf, { seed: 3 }).fill(new Float64Array(200));
    for (const x of xs) expect(x > 2 && x <= 3).toBe(true);
  });

  it('poleTransform refuses a bad side or an infinite end with InvalidOptionError', () => {
    expect(() => poleTransform(gammaTarget(0.5), 'upper')).toThrow(InvalidOptionError);
    expect(() => poleTransform(gammaTarget(0.5), 'upper')).toThrow(/poleTransform: a pole at the upper end needs a finite upper end of the support, got Infinity/);
    expect(() => poleTransform(gammaTarget(0.5), 'left' as never)).toThrow(/poleTransform: the pole side must be 'lower', 'upper' or 'both', got 'left'/);
    expect(() => poleTransform({ logDensity: 5 } as never, 'lower')).toThrow(InvalidTargetError);
  });
});

describe('samplers across a pole: errors, counts, options', () => {
  it('gamma(0.01): the mass within 2^−1022 of 0 (about 8e-4) cannot be represented: InvalidTargetError, never a draw', () => {
    // P(X < 2^−1022) = (2^−1022)^0.01 / Γ(1.01) ≈ 8.4e-4 (series of A&S 6.5.29, first term)
    expect(() => exactSampler(gammaTarget(0.01))).toThrow(InvalidTargetError);
    expect(() => exactSampler(gammaTarget(0.01))).toThrow(/of the mass \(estimated\) lies within 2\.2250738585072014e-308 of the lower end 0/);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.01), { poleAt: 'lower' })).toThrow(InvalidTargetError);
  });

  it('a pole like 1/x is not integrable: ImproperDensityError', () => {
    const t = { logDensity: (x: number) => (x > 0 && x <= 1 ? -Math.log(x) : -Infinity), support: [0, 1] as const };
    expect(() => adaptiveRejectionSampler(t, { poleAt: 'lower' })).toThrow(ImproperDensityError);
    expect(() => ratioOfUniformsSampler(t, { poleAt: 'auto' })).toThrow(ImproperDensityError);
  });

  it('without poleAt the hull and ratio-of-uniforms samplers keep refusing, naming the end and suggesting the option', () => {
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5))).toThrow(ImproperDensityError);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5))).toThrow(/adaptiveRejectionSampler: the density is unbounded at the end 0 \(the lower end of the support\).*poleAt: 'lower'/);
    expect(() => adaptiveRejectionSampler(betaTarget(0.5, 0.5))).toThrow(ShapeViolationError);
    expect(() => adaptiveRejectionSampler(betaTarget(0.5, 0.5))).toThrow(/unbounded at the ends 0 and 1 of the support.*poleAt: 'both'/);
    expect(() => ratioOfUniformsSampler(betaTarget(2, 0.5))).toThrow(InvalidTargetError);
    expect(() => ratioOfUniformsSampler(betaTarget(2, 0.5))).toThrow(/ratioOfUniformsSampler: the density is unbounded at the end 1 \(the upper end of the support\).*poleAt: 'upper'/);
    // a bounded target's own errors are unchanged
    expect(() => adaptiveRejectionSampler({ logDensity: (x: number) => x * x })).toThrow(/^adaptiveRejectionSampler: (?!the density is unbounded)/);
  });

  it('poleAt is validated; it cannot be combined with options given in x', () => {
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'left' as never })).toThrow(InvalidOptionError);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'left' as never })).toThrow(/adaptiveRejectionSampler: options.poleAt must be 'lower', 'upper', 'both' or 'auto', got 'left'/);
    expect(() => ratioOfUniformsSampler(gammaTarget(0.5), { poleAt: 3 as never })).toThrow(/options.poleAt must be .* got 3/);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'lower', startPoints: [0.1, 1] })).toThrow(InvalidOptionError);
    expect(() => ratioOfUniformsSampler(gammaTarget(0.5), { poleAt: 'lower', shift: 0.3 })).toThrow(InvalidOptionError);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'upper' })).toThrow(/finite upper end/);
    expect(() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'lower', nope: 1 } as never)).toThrow(/unknown option 'nope'/);
  });

  it("poleAt: 'auto' on a target without a pole samples it directly (no transform)", () => {
    const s = adaptiveRejectionSampler(normalTarget(0, 1), { seed: 1, poleAt: 'auto' });
    expect((s as unknown as Partial<TransformedSampler>).transform).toBeUndefined();
    const w = adaptiveRejectionSampler(weibullTarget(2), { seed: 1, poleAt: 'auto' });
    expect((w as unknown as Partial<TransformedSampler>).transform).toBeUndefined();
  });

  it('counts: samples and proposals are those of the sampler of Y; setup includes the transform probes; fill returns its array', () => {
    const s = adaptiveRejectionSampler(gammaTarget(0.5), { seed: 4, poleAt: 'lower' }) as unknown as TransformedSampler & { envelope: { touchPoints: readonly number[] } };
    const out = new Float64Array(1000);
    expect(s.fill(out)).toBe(out);
    const st = s.stats;
    expect(st.samples).toBe(1000);
    expect(st.proposals).toBeGreaterThanOrEqual(1000);
    expect(st.setupEvaluations).toBeGreaterThan(s.inner.stats.setupEvaluations);
    expect(st.setupEvaluations - s.inner.stats.setupEvaluations).toBeLessThan(400); // 129-point grid, golden section, 4 end probes
    expect(s.envelope.touchPoints.every((y) => y < 10)).toBe(true); // the hull lives in y = log x
    expect(s.transform.description).toBe('Y = log(X − 0)');
    expect(s.sample()).toBeGreaterThan(0);
  });

  it('exactSampler names the transform in choice.reason and exposes the transformed sampler', () => {
    const s = exactSampler(betaTarget(0.5, 0.5), { seed: 1 });
    expect(s.choice.reason).toMatch(/unbounded at both ends 0 and 1 \(declared by target.poles\): the change of variables Y = logit\(\(X − 0\)\/1\)/);
    expect((s.sampler as TransformedSampler).transform.map).toBe('logit');
    const u = exactSampler({ logDensity: (x: number) => (x > 0 ? -0.5 * Math.log(x) - x : -Infinity), support: [0, Infinity] }, { seed: 1 });
    expect(u.choice.reason).toMatch(/unbounded at the lower end 0 \(logDensity rises by about 0\.347 per halving/);
    // −log(2)/2 = −0.347 per halving for x^(−1/2) (closed form)
    expect(u.stats.setupEvaluations).toBeGreaterThan(u.choice.scan.evaluations);
  });

  it('a +Infinity at the end point itself is read as a pole by exactSampler', () => {
    const t = { logDensity: (x: number) => (x >= 0 && x <= 1 ? (x === 0 ? Infinity : -0.5 * Math.log(x)) : -Infinity), support: [0, 1] as const };
    const xs = exactSampler(t, { seed: 2 }).fill(new Float64Array(100));
    for (const x of xs) expect(x > 0 && x <= 1).toBe(true);
  });
});

describe('stream snapshots of the transformed paths (regression guards, not reference values)', () => {
  const first = (s: { fill(o: Float64Array): Float64Array }): number[] => Array.from(s.fill(new Float64Array(4)));
  it('exactSampler(gamma(0.5)), exactSampler(beta(0.5, 0.5), fast path), the hull and ratio-of-uniforms with poleAt', () => {
    expect(first(exactSampler(gammaTarget(0.5), { seed: 7 }))).toMatchInlineSnapshot(`
      [
        0.10672134377665322,
        0.6694342965225406,
        0.3377764305696608,
        0.004258158724463623,
      ]
    `);
    expect(first(exactSampler(betaTarget(0.5, 0.5), { seed: 7, expectedDraws: 1e5 }))).toMatchInlineSnapshot(`
      [
        0.0011437951831718832,
        0.9669327999614111,
        0.385717900091425,
        0.9262599461333672,
      ]
    `);
    expect(first(adaptiveRejectionSampler(betaTarget(0.3, 2), { seed: 7, poleAt: 'lower' }))).toMatchInlineSnapshot(`
      [
        0.012579525758722704,
        0.04663807047984121,
        0.7516961716795303,
        0.029740017342009338,
      ]
    `);
    expect(first(ratioOfUniformsSampler(betaTarget(2, 0.3), { seed: 7, poleAt: 'upper' }))).toMatchInlineSnapshot(`
      [
        0.763164955299964,
        0.8325579543221728,
        0.9985677659578762,
        0.9402508900351221,
      ]
    `);
  });
});
