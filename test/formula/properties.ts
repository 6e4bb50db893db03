/**
 * Reusable fast-check properties for formula targets: random expression
 * trees over every supported function, random intervals, containment of the
 * point evaluations in the interval bounds, and AD against central
 * differences. Used by the soundness tests and by their deliberately
 * unsound twins (which must fail with the same seeds).
 */
import fc from 'fast-check';
import { formulaTarget } from '../../src/formula/formula-target.js';
import { InvalidTargetError } from '../../src/core/errors.js';

/** A random tree printed fully parenthesized (the test's own printer, independent of the library's). */
export type Tree = string;

const UNARY = ['exp', 'log', 'log1p', 'expm1', 'sqrt', 'abs', 'sin', 'cos', 'tan', 'atan', 'tanh', 'sinh', 'cosh', 'lgamma'] as const;
const SMOOTH_UNARY = ['exp', 'log', 'log1p', 'expm1', 'sqrt', 'sin', 'cos', 'atan', 'tanh', 'sinh', 'cosh', 'lgamma'] as const;

const constants = fc.constantFrom('0', '1', '2', '3', '0.5', '1.5', '0.1', '7', '1e-3', '1e3', '1e-300', '1e300', 'pi', 'e', 'p', 'q');
/** Moderate constants for the difference property (1e300 + x is flat in doubles, which a difference cannot see through). */
const moderate = fc.constantFrom('0', '1', '2', '3', '0.5', '1.5', '0.1', '7', 'pi', 'e', 'p', 'q');
const exponents = fc.constantFrom('2', '3', '-1', '-2', '0.5', '-0.5', '1.5', '0', '1', '4', '0.3333', '(-3)', '(1/3)');

/** Arbitrary of random formulas over all functions (depth-bounded). */
export function anyFormula(maxDepth: number, smooth = false): fc.Arbitrary<Tree> {
  const unary = smooth ? SMOOTH_UNARY : UNARY;
  const { tree } = fc.letrec<{ tree: Tree; leaf: Tree; node: Tree }>((tie) => ({
    leaf: fc.oneof({ weight: 3, arbitrary: fc.constant('x') }, { weight: 2, arbitrary: smooth ? moderate : constants }),
    tree: fc.oneof({ depthSize: 'small', maxDepth, withCrossShrink: true }, tie('leaf'), tie('node'), tie('node')),
    node: fc.oneof(
      fc.tuple(fc.constantFrom('+', '-', '*', '/'), tie('tree'), tie('tree')).map(([o, a, b]) => `(${a} ${o} ${b})`),
      fc.tuple(tie('tree'), exponents).map(([a, k]) => `(${a})^${k}`),
      fc.tuple(tie('tree'), tie('tree')).map(([a, b]) => `pow(${a}, ${b})`),
      tie('tree').map((a) => `(-${a})`),
      fc.tuple(fc.constantFrom(...unary), tie('tree')).map(([f, a]) => `${f}(${a})`),
      fc.tuple(fc.constantFrom(...unary), tie('tree')).map(([f, a]) => `${f}(${a})`),
      ...(smooth
        ? []
        : [fc.tuple(fc.constantFrom('min', 'max'), tie('tree'), tie('tree')).map(([f, a, b]) => `${f}(${a}, ${b})`)]),
      fc.array(tie('tree'), { minLength: 1, maxLength: 3 }).map((xs) => `logsumexp(${xs.join(', ')})`),
    ),
  }));
  return tree;
}

/** Random closed intervals: degenerate, tiny, ordinary, huge, infinite, sign-straddling. */
export const anyInterval: fc.Arbitrary<[number, number]> = fc.oneof(
  fc.double({ min: -50, max: 50, noNaN: true }).map((a): [number, number] => [a, a]),
  fc.tuple(fc.double({ min: -10, max: 10, noNaN: true }), fc.integer({ min: 1, max: 64 })).map(([a, k]): [number, number] => [a, a + k * 2 ** -50 * Math.max(1, Math.abs(a))]),
  fc.tuple(fc.double({ min: -8, max: 8, noNaN: true }), fc.double({ min: -8, max: 8, noNaN: true })).map(([a, b]): [number, number] => (a <= b ? [a, b] : [b, a])),
  fc.tuple(fc.double({ min: -1, max: 0, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })).map(([a, b]): [number, number] => [a, b]),
  fc.tuple(fc.double({ min: -1e300, max: 1e300, noNaN: true }), fc.double({ min: -1e300, max: 1e300, noNaN: true })).map(([a, b]): [number, number] => (a <= b ? [a, b] : [b, a])),
  fc.double({ min: -20, max: 20, noNaN: true }).map((a): [number, number] => [-Infinity, a]),
  fc.double({ min: -20, max: 20, noNaN: true }).map((a): [number, number] => [a, Infinity]),
  fc.constant<[number, number]>([-Infinity, Infinity]),
  fc.constantFrom<[number, number]>([0, 0], [0, 1], [-1, 0], [1, 1], [1, 2], [1.4, 1.5], [-Math.PI, Math.PI], [Math.PI / 2 - 1e-9, Math.PI / 2 + 1e-9]),
);

/** Points inside [a, b]: the ends and interior points (spread over huge ranges). */
export function pointsIn(a: number, b: number, us: readonly number[]): number[] {
  const pts: number[] = [];
  if (Number.isFinite(a)) pts.push(a);
  if (Number.isFinite(b)) pts.push(b);
  for (const u of us) {
    let x: number;
    if (a === -Infinity && b === Infinity) x = Math.tan((u - 0.5) * 3.1);
    else if (a === -Infinity) x = b - (Math.exp(20 * u) - 1);
    else if (b === Infinity) x = a + (Math.exp(20 * u) - 1);
    else x = a + u * (b - a);
    if (!(x >= a)) x = a;
    if (!(x <= b)) x = b;
    if (Number.isFinite(x)) pts.push(x);
  }
  return pts;
}

export const PARAMS = { p: 0.75, q: -2.5 };

/** What a violated containment looks like (for messages). */
export interface Violation {
  formula: string;
  interval: [number, number];
  x: number;
  which: 'value' | 'd1' | 'd2';
  point: number;
  bounds: readonly [number, number];
}

/**
 * Checks that every non-NaN point value, first and second derivative at
 * points of [a, b] lies in the corresponding bounds; returns the first
 * violation or undefined. A bound that is NaN is a violation too.
 */
export function findViolation(formula: string, interval: [number, number], us: readonly number[]): Violation | undefined {
  const t = formulaTarget(formula, { support: [-Infinity, Infinity], parameters: PARAMS });
  const [a, b] = interval;
  let vb: readonly [number, number];
  let db: readonly [number, number];
  let eb: readonly [number, number];
  try {
    vb = t.logDensityBounds(a, b);
    db = t.dLogDensityBounds(a, b);
    eb = t.d2LogDensityBounds(a, b);
  } catch (err) {
    if (!(err instanceof InvalidTargetError)) throw err;
    // undefined everywhere: every point value must be NaN
    for (const x of pointsIn(a, b, us)) {
      const v = t.logDensity(x);
      if (v === v) return { formula, interval, x, which: 'value', point: v, bounds: [NaN, NaN] };
    }
    return undefined;
  }
  for (const bd of [vb, db, eb]) {
    if (bd[0] !== bd[0] || bd[1] !== bd[1] || bd[0] > bd[1]) return { formula, interval, x: NaN, which: 'value', point: NaN, bounds: bd };
  }
  for (const x of pointsIn(a, b, us)) {
    const v = t.logDensity(x);
    if (v === v && !(v >= vb[0] && v <= vb[1])) return { formula, interval, x, which: 'value', point: v, bounds: vb };
    const d = t.dLogDensity(x);
    if (d === d && !(d >= db[0] && d <= db[1])) return { formula, interval, x, which: 'd1', point: d, bounds: db };
    const e = t.d2LogDensity(x);
    if (e === e && !(e >= eb[0] && e <= eb[1])) return { formula, interval, x, which: 'd2', point: e, bounds: eb };
  }
  return undefined;
}

/** The containment property over random formulas and intervals. */
export function containmentProperty(maxDepth = 4): fc.IPropertyWithHooks<[Tree, [number, number], number[]]> {
  return fc.property(anyFormula(maxDepth), anyInterval, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 4, maxLength: 8 }), (f, iv, us) => {
    const v = findViolation(f, iv, us);
    if (v !== undefined) throw new Error(`bounds violated: ${JSON.stringify(v)}`);
  });
}

/** Fourth-order central difference of g at x with step h. */
function cd4(g: (t: number) => number, x: number, h: number): number {
  return (8 * (g(x + h) - g(x - h)) - (g(x + 2 * h) - g(x - 2 * h))) / (12 * h);
}

/** Counters of the difference property (how many points were smooth enough to check). */
export interface DifferenceCounts {
  checked: number;
  skipped: number;
  /** skipped because the value or an AD derivative is not finite there */
  nonFinite?: number;
  /** skipped because the two differences disagree (not smooth at the step's scale) */
  rough?: number;
}

/**
 * AD against central differences on smooth formulas: where two fourth-order
 * differences with steps h and h/2 agree with each other (the function is
 * smooth at that scale), the AD first derivative must agree with them, and
 * the AD second derivative with the difference of the AD first derivative.
 */
export function differenceProperty(counts: DifferenceCounts): fc.IPropertyWithHooks<[Tree, number]> {
  return fc.property(anyFormula(4, true), fc.integer({ min: -3000, max: 3000 }).map((k) => k / 1000 + 1e-4), (f, x) => {
    const t = formulaTarget(f, { support: [-Infinity, Infinity], parameters: PARAMS });
    // removable singularities (x / sinh(x) at 0) defeat floating-point AD near them: stay away from 0
    if (Math.abs(x) < 1e-2) {
      counts.skipped++;
      return;
    }
    const h = 1e-3 * Math.max(1, Math.abs(x));
    const f0 = t.logDensity(x);
    const ad1 = t.dLogDensity(x);
    const ad2 = t.d2LogDensity(x);
    if (!Number.isFinite(f0) || !Number.isFinite(ad1) || !Number.isFinite(ad2) || Math.abs(f0) > 1e8) {
      counts.skipped++;
      counts.nonFinite = (counts.nonFinite ?? 0) + 1;
      return;
    }
    const ld = (s: number): number => t.logDensity(s);
    const dd = (s: number): number => t.dLogDensity(s);
    for (const [g, ad] of [[ld, ad1], [dd, ad2]] as const) {
      const c1 = cd4(g, x, h);
      const c2 = cd4(g, x, h / 2);
      const scale = 1 + Math.abs(c2);
      if (!Number.isFinite(c1) || !Number.isFinite(c2) || Math.abs(c1 - c2) > 1e-6 * scale) {
        counts.skipped++;
        counts.rough = (counts.rough ?? 0) + 1;
        return;
      }
      if (Math.abs(ad - c2) > 1e-5 * scale) throw new Error(`AD ${ad} vs central difference ${c2} (h=${h / 2}) for ${f} at x=${x}`);
    }
    counts.checked++;
  });
}
