/**
 * Standard normal quantile by Wichura's algorithm AS 241 (PPND16).
 * @internal
 *
 * @packageDocumentation
 */
import { log } from '../../vendor/math.js';

// Coefficients of AS 241 PPND16 (Wichura 1988, Applied Statistics 37(3),
// 477–484), quoted from memory; the tests check the quantile against
// @stdlib/stats-base-dists-normal-cdf to ~1e-15 relative.
const A0 = 3.387132872796366608;
const A1 = 1.3314166789178437745e2;
const A2 = 1.9715909503065514427e3;
const A3 = 1.3731693765509461125e4;
const A4 = 4.5921953931549871457e4;
const A5 = 6.7265770927008700853e4;
const A6 = 3.3430575583588128105e4;
const A7 = 2.5090809287301226727e3;
const B1 = 4.2313330701600911252e1;
const B2 = 6.871870074920579083e2;
const B3 = 5.3941960214247511077e3;
const B4 = 2.1213794301586595867e4;
const B5 = 3.930789580009271061e4;
const B6 = 2.8729085735721942674e4;
const B7 = 5.226495278852854561e3;

const C0 = 1.42343711074968357734;
const C1 = 4.6303378461565452959;
const C2 = 5.7694972214606914055;
const C3 = 3.64784832476320460504;
const C4 = 1.27045825245236838258;
const C5 = 2.4178072517745061177e-1;
const C6 = 2.27238449892691845833e-2;
const C7 = 7.7454501427834140764e-4;
const D1 = 2.05319162663775882187;
const D2 = 1.6763848301838038494;
const D3 = 6.8976733498510000455e-1;
const D4 = 1.4810397642748007459e-1;
const D5 = 1.51986665636164571966e-2;
const D6 = 5.475938084995344946e-4;
const D7 = 1.05075007164441684324e-9;

const E0 = 6.6579046435011037772;
const E1 = 5.4637849111641143699;
const E2 = 1.7848265399172913358;
const E3 = 2.9656057182850489123e-1;
const E4 = 2.6532189526576123093e-2;
const E5 = 1.2426609473880784386e-3;
const E6 = 2.71155556874348757815e-5;
const E7 = 2.01033439929228813265e-7;
const F1 = 5.9983220655588793769e-1;
const F2 = 1.3692988092273580531e-1;
const F3 = 1.48753612908506148525e-2;
const F4 = 7.868691311456132591e-4;
const F5 = 1.8463183175100546818e-5;
const F6 = 1.4215117583164458887e-7;
const F7 = 2.04426310338993978564e-15;

const SPLIT1 = 0.425;
const SPLIT2 = 5;
const CONST1 = 0.180625;
const CONST2 = 1.6;

/**
 * Core of PPND16: the quantile z with Φ(z) = p, given `q = p − 1/2` and the
 * smaller tail area `r = min(p, 1 − p)` separately, so that callers can pass
 * an upper-tail area without the rounding of `1 − p`. Requires r > 0.
 * @internal
 */
export function ppnd16(q: number, r: number): number {
  if (Math.abs(q) <= SPLIT1) {
    const s = CONST1 - q * q;
    return (
      (q * (((((((A7 * s + A6) * s + A5) * s + A4) * s + A3) * s + A2) * s + A1) * s + A0)) /
      (((((((B7 * s + B6) * s + B5) * s + B4) * s + B3) * s + B2) * s + B1) * s + 1)
    );
  }
  let t = Math.sqrt(-log(r));
  let z: number;
  if (t <= SPLIT2) {
    t -= CONST2;
    z =
      (((((((C7 * t + C6) * t + C5) * t + C4) * t + C3) * t + C2) * t + C1) * t + C0) /
      (((((((D7 * t + D6) * t + D5) * t + D4) * t + D3) * t + D2) * t + D1) * t + 1);
  } else {
    t -= SPLIT2;
    z =
      (((((((E7 * t + E6) * t + E5) * t + E4) * t + E3) * t + E2) * t + E1) * t + E0) /
      (((((((F7 * t + F6) * t + F5) * t + F4) * t + F3) * t + F2) * t + F1) * t + 1);
  }
  return q < 0 ? -z : z;
}

/**
 * Standard normal quantile Φ⁻¹(p) for p in [0, 1] (±Infinity at the ends, NaN outside).
 * @internal
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const q = p - 0.5;
  return ppnd16(q, q < 0 ? p : 1 - p);
}

/** 2^-54: half the spacing of a 53-bit uniform grid. */
const HALF_GRID = 5.551115123125783e-17;

/**
 * Maps a uniform `v` in [0, 1) to a standard normal deviate by inversion at
 * `p = v + 2^-54` (the midpoint of v's cell of the 53-bit grid), so that
 * neither end of [0, 1) reaches the infinite quantiles and the map is
 * symmetric: v and 1 − 2^-53 − v give opposite deviates. The upper-tail area
 * is formed as `(1 − v) − 2^-54` (1 − v is exact), never as `1 − p`.
 * Result magnitude is at most about 8.3.
 * @internal
 */
export function normalFromUniform(v: number): number {
  const q = v - 0.5 + HALF_GRID;
  const r = q < 0 ? v + HALF_GRID : 1 - v - HALF_GRID;
  return ppnd16(q, r);
}
