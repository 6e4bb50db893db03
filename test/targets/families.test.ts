import erfc from '@stdlib/math-base-special-erfc';
import { describe, expect, it } from 'vitest';
import {
  InvalidTargetError,
  betaTarget,
  gammaTarget,
  logisticTarget,
  normalTarget,
  studentTTarget,
} from '../../src/index.js';
import type { FamilyTarget } from '../../src/index.js';
import gammaln from '@stdlib/math-base-special-gammaln';
import { centralDifference, integrateLineByTan, midpoint, simpson } from './quadrature.js';

interface Case {
  name: string;
  t: FamilyTarget;
  /** ∫_{lower end}^{x} density, by a quadrature suited to the family. */
  massTo: (x: number) => number;
  /** Points in the bulk where the derivative and the cdf are checked. */
  points: number[];
  /** Scale of the distribution (finite-difference step and derivative tolerance). */
  scale: number;
}

function normalCase(m: number, s: number): Case {
  const t = normalTarget(m, s);
  return {
    name: `normal(${m}, ${s})`,
    t,
    massTo: (x) => simpson((y) => Math.exp(t.logDensity(y)), m - 12 * s, Math.min(x, m + 12 * s), 4000),
    points: [-2.5, -1, -0.3, 0.4, 1.7, 3].map((k) => m + k * s),
    scale: s,
  };
}

function gammaCase(a: number, r: number): Case {
  const t = gammaTarget(a, r);
  const mean = a / r;
  const sd = Math.sqrt(a) / r;
  const top = mean + 40 * sd + 40 / r;
  // x = y², dx = 2y dy: smooth integrand for shape 1/2 and every shape >= 1;
  // the midpoint rule never evaluates the end y = 0
  return {
    name: `gamma(${a}, ${r})`,
    t,
    massTo: (x) => {
      const g = (y: number): number => Math.exp(t.logDensity(y * y)) * 2 * y;
      // below mean − 15 sd the mass is negligible (< 1e-20) for the large shapes
      const yLo = Math.sqrt(Math.max(0, mean - 15 * sd));
      const yHi = Math.sqrt(Math.min(x, top));
      return yLo > 0 ? simpson(g, yLo, yHi, 8000) : midpoint(g, 0, yHi, 20000);
    },
    points: [-1.5, -0.5, 0.2, 1, 2.5].map((k) => mean + k * sd).filter((x) => x > 0),
    scale: sd,
  };
}

function betaCase(a: number, b: number): Case {
  const t = betaTarget(a, b);
  const mean = a / (a + b);
  const sd = Math.sqrt((a * b) / ((a + b) * (a + b) * (a + b + 1)));
  // x = sin²θ, dx = 2 sinθ cosθ dθ: the integrand 2 sin^(2a−1)θ cos^(2b−1)θ / B is
  // smooth for a, b in {1/2} ∪ [1, ∞); the midpoint rule never evaluates the ends
  const g = (th: number): number => {
    const s = Math.sin(th);
    const c = Math.cos(th);
    const x = s * s;
    const ld = t.logDensity(x);
    return ld === -Infinity ? 0 : Math.exp(ld) * 2 * s * c;
  };
  return {
    name: `beta(${a}, ${b})`,
    t,
    massTo: (x) => midpoint(g, 0, Math.asin(Math.sqrt(Math.min(1, x))), 20000),
    points: [-1.5, -0.5, 0.3, 1.2].map((k) => mean + k * sd).filter((x) => x > 0.001 && x < 0.999),
    scale: sd,
  };
}

function tCase(df: number, loc: number, sc: number): Case {
  const t = studentTTarget(df, loc, sc);
  return {
    name: `studentT(${df}, ${loc}, ${sc})`,
    t,
    massTo: (x) => integrateLineByTan((y) => t.logDensity(y), loc, sc, Math.atan((x - loc) / sc), 8000),
    points: [-4, -1, -0.2, 0.5, 2, 6].map((k) => loc + k * sc),
    scale: sc,
  };
}

function logisticCase(loc: number, sc: number): Case {
  const t = logisticTarget(loc, sc);
  return {
    name: `logistic(${loc}, ${sc})`,
    t,
    massTo: (x) => simpson((y) => Math.exp(t.logDensity(y)), loc - 45 * sc, Math.min(x, loc + 45 * sc), 8000),
    points: [-5, -1, -0.1, 0.7, 3].map((k) => loc + k * sc),
    scale: sc,
  };
}

const CASES: Case[] = [
  normalCase(0, 1),
  normalCase(-3, 1e5),
  normalCase(1e6, 1e-3),
  normalCase(0, 1e-9),
  gammaCase(0.5, 1),
  gammaCase(1, 2),
  gammaCase(2.5, 1),
  gammaCase(10, 0.1),
  gammaCase(1000, 3),
  betaCase(0.5, 0.5),
  betaCase(1, 1),
  betaCase(2, 3),
  betaCase(1, 5),
  betaCase(5, 1),
  betaCase(0.5, 4),
  betaCase(3, 0.5),
  betaCase(50, 50),
  betaCase(300, 700),
  tCase(1, 0, 1),
  tCase(3, 2, 0.5),
  tCase(30, -1, 4),
  logisticCase(0, 1),
  logisticCase(5, 0.01),
];

describe('ready-made targets', () => {
  for (const c of CASES) {
    it(`${c.name}: logDensity integrates to 1`, () => {
      expect(Math.abs(c.massTo(Infinity) - 1)).toBeLessThan(1e-7);
    });

    it(`${c.name}: dLogDensity matches central finite differences`, () => {
      const h = 1e-5 * c.scale;
      for (const x of c.points) {
        const fd = centralDifference((y) => c.t.logDensity(y), x, h);
        const d = c.t.dLogDensity(x);
        expect(Math.abs(d - fd), `x = ${x}: d = ${d}, fd = ${fd}`).toBeLessThan(1e-6 * Math.max(1, Math.abs(d)) + 1e-6 / c.scale);
      }
    });

    it(`${c.name}: cdf (from @stdlib or the gamma series) matches the integral of the density`, () => {
      for (const x of c.points) {
        expect(Math.abs(c.t.cdf(x) - c.massTo(x)), `x = ${x}`).toBeLessThan(1e-7);
      }
    });

    it(`${c.name}: sf = 1 − cdf in the bulk, cdf is 0 and 1 at the ends of the support`, () => {
      for (const x of c.points) expect(Math.abs(c.t.sf(x) + c.t.cdf(x) - 1), `x = ${x}`).toBeLessThan(1e-12);
      const [lo, hi] = c.t.support;
      expect(c.t.cdf(lo)).toBe(0);
      expect(c.t.cdf(hi)).toBe(1);
      expect(c.t.sf(lo)).toBe(1);
      expect(c.t.sf(hi)).toBe(0);
      expect(c.t.logDensity(lo - 1)).toBe(-Infinity);
      expect(c.t.logDensity(hi + 1)).toBe(-Infinity);
    });
  }
});

describe('normalTarget', () => {
  it('normalTarget works in standardized form for mean ±1e9 and sd from 1e-9 to 1e9', () => {
    const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);
    for (const m of [-1e9, 0, 1e9]) {
      for (const s of [1e-9, 1, 1e9]) {
        const t = normalTarget(m, s);
        expect(t.logDensity(m)).toBeCloseTo(-Math.log(s) - HALF_LOG_2PI, 10);
        expect(Math.abs(t.dLogDensity(m))).toBe(0);
        expect(t.cdf(m)).toBe(0.5);
        // a point one representable step above the mean, however many sd that is
        const x = m + Math.max(Math.abs(m) * 2.3e-16, s);
        const z = (x - m) / s;
        expect(Number.isFinite(t.logDensity(x))).toBe(true);
        expect(t.logDensity(x) + Math.log(s)).toBeCloseTo(normalTarget(0, 1).logDensity(z), 8);
      }
    }
  });

  it('normalTarget sf is accurate in the far upper tail (vs @stdlib erfc)', () => {
    const t = normalTarget(3, 2);
    for (const z of [5, 8, 12, 20, 30]) {
      const ref = 0.5 * erfc(z / Math.SQRT2); // Φ̄(z) = erfc(z/√2)/2
      expect(Math.abs(t.sf(3 + 2 * z) / ref - 1), `z = ${z}`).toBeLessThan(1e-12);
      expect(Math.abs(t.cdf(3 - 2 * z) / ref - 1), `z = −${z}`).toBeLessThan(1e-12);
    }
  });
});

describe('gammaTarget', () => {
  it('gammaTarget ends at 0: shape > 1 → −Infinity, shape = 1 → log(rate), shape < 1 → −Infinity by convention', () => {
    expect(gammaTarget(2, 3).logDensity(0)).toBe(-Infinity);
    expect(gammaTarget(1, 3).logDensity(0)).toBeCloseTo(Math.log(3), 14);
    expect(gammaTarget(0.5, 3).logDensity(0)).toBe(-Infinity);
    expect(gammaTarget(0.5, 3).logDensity(-1e-300)).toBe(-Infinity);
    // just above 0 the shape < 1 density is large but finite and correct:
    // Gamma(1/2, 1) density is x^(-1/2) e^(-x) / √π (closed form)
    for (const x of [1e-300, 1e-10, 0.3]) {
      expect(gammaTarget(0.5).logDensity(x)).toBeCloseTo(-0.5 * Math.log(x) - x - 0.5 * Math.log(Math.PI), 10);
    }
    expect(gammaTarget(2, 3).dLogDensity(0)).toBe(Infinity);
    expect(gammaTarget(1, 3).dLogDensity(0)).toBe(-3);
    expect(gammaTarget(0.5, 3).dLogDensity(0)).toBe(-Infinity);
    expect(gammaTarget(2, 3).dLogDensity(-1)).toBeNaN();
  });

  it('gammaTarget mode hints: (shape − 1)/rate for shape >= 1, else 0', () => {
    expect(gammaTarget(5, 2).mode).toBe(2);
    expect(gammaTarget(1, 2).mode).toBe(0);
    expect(gammaTarget(0.3, 2).mode).toBe(0);
    expect(gammaTarget(5, 2).support).toEqual([0, Infinity]);
  });

  it('gammaTarget default rate is 1 and the exponential case matches its closed form', () => {
    const t = gammaTarget(1);
    for (const x of [0.1, 1, 7]) {
      expect(t.logDensity(x)).toBeCloseTo(-x, 14);
      expect(t.cdf(x)).toBeCloseTo(-Math.expm1(-x), 14);
    }
  });

  it('gammaTarget cdf is accurate at shape >= 1000 (series, not @stdlib): P(1e4, 1e4) ≈ 0.50133 (test/reference/README.md)', () => {
    expect(gammaTarget(1e4, 1).cdf(1e4)).toBeCloseTo(0.50133, 5);
    expect(gammaTarget(1e4, 2).cdf(5e3)).toBeCloseTo(0.50133, 5);
  });
});

describe('betaTarget', () => {
  it('betaTarget a = 1 or b = 1 gives a finite nonzero density at that end (closed forms)', () => {
    // Beta(1, b) density b(1 − x)^(b−1); Beta(a, 1) density a x^(a−1)
    expect(betaTarget(1, 4).logDensity(0)).toBeCloseTo(Math.log(4), 13);
    expect(betaTarget(3, 1).logDensity(1)).toBeCloseTo(Math.log(3), 13);
    expect(betaTarget(1, 1).logDensity(0)).toBeCloseTo(0, 14);
    expect(betaTarget(1, 1).logDensity(1)).toBeCloseTo(0, 14);
    expect(betaTarget(1, 4).logDensity(1)).toBe(-Infinity);
    expect(betaTarget(1, 4).cdf(0.3)).toBeCloseTo(1 - Math.pow(0.7, 4), 13);
    expect(betaTarget(3, 1).cdf(0.3)).toBeCloseTo(Math.pow(0.3, 3), 13);
    expect(betaTarget(1, 4).dLogDensity(0)).toBe(-3);
    expect(betaTarget(3, 1).dLogDensity(1)).toBe(2);
  });

  it('betaTarget a < 1 or b < 1: unbounded end is −Infinity at the point itself by convention, correct inside', () => {
    const t = betaTarget(0.5, 0.5);
    expect(t.logDensity(0)).toBe(-Infinity);
    expect(t.logDensity(1)).toBe(-Infinity);
    // arcsine law: density 1/(π √(x(1 − x))) (closed form)
    for (const x of [1e-12, 0.2, 0.5, 1 - 1e-12]) {
      expect(t.logDensity(x)).toBeCloseTo(-Math.log(Math.PI) - 0.5 * Math.log(x * (1 - x)), 6);
    }
    expect(t.mode).toBeUndefined();
    expect(t.dLogDensity(0)).toBe(-Infinity);
    expect(t.dLogDensity(1)).toBe(Infinity);
  });

  it('betaTarget mode hints', () => {
    expect(betaTarget(3, 5).mode).toBeCloseTo(2 / 6, 15);
    expect(betaTarget(1, 1).mode).toBe(0.5);
    expect(betaTarget(1, 3).mode).toBe(0);
    expect(betaTarget(0.5, 3).mode).toBe(0);
    expect(betaTarget(0.5, 1).mode).toBe(0);
    expect(betaTarget(3, 1).mode).toBe(1);
    expect(betaTarget(3, 0.5).mode).toBe(1);
    expect(betaTarget(1, 0.5).mode).toBe(1);
  });

  it('betaTarget sf is accurate near 1 (closed form for Beta(a, 1): 1 − x^a)', () => {
    const t = betaTarget(2, 1);
    for (const e0 of [1e-3, 1e-8, 1e-14]) {
      const x = 1 - e0;
      const e = 1 - x; // exact (Sterbenz)
      const ref = -Math.expm1(2 * Math.log1p(-e)); // 1 − x² without cancellation
      expect(Math.abs(t.sf(x) / ref - 1), `x = 1 − ${e}`).toBeLessThan(1e-6);
    }
  });
});

describe('studentTTarget and logisticTarget', () => {
  it('studentTTarget(1) is the Cauchy distribution (closed forms)', () => {
    const t = studentTTarget(1);
    for (const x of [-30, -1, 0, 0.5, 4, 1e6]) {
      expect(t.logDensity(x)).toBeCloseTo(-Math.log(Math.PI) - Math.log1p(x * x), 12);
      expect(t.cdf(x)).toBeCloseTo(0.5 + Math.atan(x) / Math.PI, 12);
    }
    expect(Math.abs(t.sf(1e6) / (Math.atan(1e-6) / Math.PI) - 1)).toBeLessThan(1e-9); // sf(x) = atan(1/x)/π for x > 0
  });

  it('studentTTarget normalizing constant matches the lnΓ form Γ((ν+1)/2) / (√(νπ) Γ(ν/2)) for small df', () => {
    // Heavy tails (df < 1) defeat the quadrature above; check the constant directly.
    for (const df of [0.1, 0.5, 0.9, 2]) {
      const logC = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
      const t = studentTTarget(df, 1, 3);
      for (const x of [1, -2, 40]) {
        const z = (x - 1) / 3;
        expect(t.logDensity(x), `df = ${df}, x = ${x}`).toBeCloseTo(logC - Math.log(3) - ((df + 1) / 2) * Math.log1p((z * z) / df), 12);
      }
    }
  });

  it('studentTTarget stays finite for huge |x| and large df', () => {
    const t = studentTTarget(3, 0, 1);
    expect(Number.isFinite(t.logDensity(1e200))).toBe(true);
    expect(t.logDensity(1e200)).toBeCloseTo(t.logDensity(1e100) - 4 * 100 * Math.log(10), 6);
    expect(t.dLogDensity(1e200)).toBeLessThan(0);
    // df → ∞ approaches the standard normal: log density at 0 → −log(2π)/2
    expect(studentTTarget(1e12).logDensity(0)).toBeCloseTo(-0.5 * Math.log(2 * Math.PI), 9);
    expect(studentTTarget(2, 3, 4).mode).toBe(3);
  });

  it('logisticTarget logDensity is stable for large |z| and matches the closed form', () => {
    const t = logisticTarget(1, 2);
    for (const x of [-3, 0, 1, 2.5, 9]) {
      const z = (x - 1) / 2;
      // density e^(−z) / (s (1 + e^(−z))²) (closed form)
      expect(t.logDensity(x)).toBeCloseTo(-z - Math.log(2) - 2 * Math.log1p(Math.exp(-z)), 12);
    }
    expect(t.logDensity(1 + 2 * 1e4)).toBeCloseTo(-1e4 - Math.log(2), 9);
    expect(t.logDensity(1 - 2 * 1e4)).toBeCloseTo(-1e4 - Math.log(2), 9);
    expect(t.sf(1 + 2 * 50)).toBeCloseTo(1 / (1 + Math.exp(50)), 30);
    expect(Math.abs(t.sf(1 + 2 * 50) * (1 + Math.exp(50)) - 1)).toBeLessThan(1e-12);
    expect(logisticTarget().mode).toBe(0);
  });
});

describe('parameter validation', () => {
  const cases: [string, () => unknown, RegExp][] = [
    ['normalTarget sd 0', () => normalTarget(0, 0), /normalTarget: sd .* got 0/],
    ['normalTarget sd -1', () => normalTarget(0, -1), /normalTarget: sd .* got -1/],
    ['normalTarget mean NaN', () => normalTarget(NaN, 1), /normalTarget: mean .* got NaN/],
    ['normalTarget mean Infinity', () => normalTarget(Infinity, 1), /normalTarget: mean .* got Infinity/],
    ['normalTarget sd string', () => normalTarget(0, '1' as unknown as number), /normalTarget: sd/],
    ['gammaTarget shape 0', () => gammaTarget(0), /gammaTarget: shape .* got 0/],
    ['gammaTarget rate -2', () => gammaTarget(2, -2), /gammaTarget: rate .* got -2/],
    ['gammaTarget shape Infinity', () => gammaTarget(Infinity), /gammaTarget: shape .* got Infinity/],
    ['betaTarget a 0', () => betaTarget(0, 1), /betaTarget: a .* got 0/],
    ['betaTarget b NaN', () => betaTarget(1, NaN), /betaTarget: b .* got NaN/],
    ['studentTTarget df 0', () => studentTTarget(0), /studentTTarget: df .* got 0/],
    ['studentTTarget df Infinity', () => studentTTarget(Infinity), /studentTTarget: df .* got Infinity/],
    ['studentTTarget scale -1', () => studentTTarget(3, 0, -1), /studentTTarget: scale .* got -1/],
    ['studentTTarget location NaN', () => studentTTarget(3, NaN), /studentTTarget: location .* got NaN/],
    ['logisticTarget scale 0', () => logisticTarget(0, 0), /logisticTarget: scale .* got 0/],
    ['logisticTarget location -Infinity', () => logisticTarget(-Infinity), /logisticTarget: location .* got -Infinity/],
  ];
  for (const [name, f, re] of cases) {
    it(`${name} throws InvalidTargetError naming API, parameter and value`, () => {
      expect(f).toThrow(InvalidTargetError);
      expect(f).toThrow(re);
    });
  }
});
