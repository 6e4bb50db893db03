/**
 * e^x: the algorithm of `@stdlib/math-base-special-exp` (FDLIBM's e_exp.c)
 * step for step, the same bits for every x, with the scaling by 2^k made
 * one multiplication. @internal @packageDocumentation
 */
import polyvalP from '@stdlib/math-base-special-exp/lib/polyval_p.js';
import { POW2 } from './pow2-table.js';
import { ldexp } from './ldexp.js';

const LN2_HI = 6.93147180369123816490e-1;
const LN2_LO = 1.90821492927058770002e-10;
const LOG2_E = 1.442695040888963387e0;
const OVERFLOW = 7.09782712893383973096e2;
const UNDERFLOW = -7.4513321910194110842e2;
const NEARZERO = 3.725290298461914e-9; // 2^-28

/** Scratch slot of the rare path (see {@link exp}). */
const SLOT = /* @__PURE__ */ new Float64Array(1);

/**
 * e^x, the same bits on every engine: bit for bit `@stdlib/math-base-special-exp`.
 *
 * @remarks
 * The package reduces x = k·ln 2 + r (r = hi − lo), evaluates its rational
 * approximation of e^r (its own polynomial evaluator, bundled once) and
 * returns ldexp(y, k). This function does the same operations in the same
 * order, and for k in [−1022, 1023] replaces ldexp(y, k) by y·2^k with 2^k
 * from a table: both are y·2^k rounded once to a double (exact when the
 * result is normal; ldexp builds a subnormal result with one
 * multiplication by 2^−52 as well), so the bits agree; the few x with k
 * outside that range (results near the overflow and underflow ends) take
 * the vendored ldexp, the package's own algorithm (./ldexp.ts). Why: the
 * package's ldexp, a word-level routine, was more than half the cost of
 * every exp in the sampling kernels and in a Gibbs step's setup. Checked bit for bit against the package in
 * test/vendor/exp.test.ts. The rare path returns through a Float64Array
 * slot, so that the engine need not box every result. The build gives this
 * function to the bundled @stdlib functions that import the package
 * (scripts/esbuild-stdlib.mjs), so a bundle holds one exp.
 * @internal
 */
export function exp(x: number): number {
  if (x !== x || x === Infinity) return x;
  if (x === -Infinity) return 0;
  if (x > OVERFLOW) return Infinity;
  if (x < UNDERFLOW) return 0;
  if (x > -NEARZERO && x < NEARZERO) return 1 + x;
  // the package's trunc of the rounded quotient; |value| < 1076, so ToInt32 truncates the same way
  const k = (x < 0 ? LOG2_E * x - 0.5 : LOG2_E * x + 0.5) | 0;
  const hi = x - k * LN2_HI;
  const lo = k * LN2_LO;
  const r = hi - lo;
  const t = r * r;
  const c = r - t * polyvalP(t);
  const y = 1.0 - (lo - (r * c) / (2.0 - c) - hi);
  if (k >= -1022 && k <= 1023) return y * POW2[k + 1022];
  SLOT[0] = ldexp(y, k);
  return SLOT[0];
}

export default exp;
