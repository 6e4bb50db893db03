/**
 * ln(1 + x) with the common middle range inlinable: the same bits as
 * {@link log1p} (`@stdlib/math-base-special-log1p`, FDLIBM's s_log1p.c)
 * for every x. @internal @packageDocumentation
 */
import { log1p } from './log1p.js';
import polyval from '@stdlib/math-base-special-log1p/lib/polyval_lp.js';

/**
 * ln(1 + x), bit for bit FDLIBM's log1p, with the branch that needs no
 * argument reduction written out so that an engine can inline it into a
 * sampling kernel.
 *
 * @remarks
 * For 2^-29 ≤ |x| and −0.2929 < x < √2 − 1 FDLIBM takes k = 0 and f = x
 * exactly, and returns f − (f²/2 − s·(f²/2 + R)) with s = f/(2 + f) and
 * R = z·P(z), z = s², P its degree-6 polynomial (@stdlib's own evaluator
 * of it, so the coefficients are bundled once); this function evaluates
 * exactly those operations in the same order (so the same bits), and
 * calls {@link log1p} for every other x (argument reduction, tiny |x|,
 * NaN and the ends). Why: the full function is too large for V8 to inline,
 * and a call that returns a double allocates a box for it; the hull kernel
 * spent a quarter of its time in log1p calls. Checked bit for bit against
 * the vendored function in test/vendor/log1p-fast.test.ts. The slow
 * path returns through a Float64Array slot (see the body).
 * @internal
 */
export function log1pFast(x: number): number {
  if (x > -2.928932188134524755992e-1 && x < 4.142135623730950488017e-1 && (x >= 1.862645149230957e-9 || x <= -1.862645149230957e-9)) {
    const hfsq = 0.5 * x * x;
    const s = x / (2.0 + x);
    const z = s * s;
    const R = z * polyval(z);
    return x - (hfsq - s * (hfsq + R));
  }
  // through a float64 slot: returned directly, the call's (boxed) result would make the engine box
  // every result of this function, the inlined fast branch included (16 bytes per hull draw)
  SLOT[0] = log1p(x);
  return SLOT[0];
}

/** Scratch slot of {@link log1pFast}'s slow path. */
const SLOT = /* @__PURE__ */ new Float64Array(1);
