/**
 * Interval evaluation of a compiled formula: enclosures of the value, the
 * first and the second derivative over an interval of x (second-order
 * forward mode on intervals, "interval hyper-duals"). @internal
 *
 * @remarks
 * Every instruction computes its three enclosures from those of its
 * arguments with the same formulas, in the same order, as the point
 * evaluator in `program.ts`, each operation rounded outward
 * (`interval.ts`). So for every double x in the interval the point
 * evaluator's value and derivatives lie in the enclosures (the soundness
 * property tested in test/formula), and so do the exact real ones.
 *
 * Kinks: where `abs`, `min` or `max` may switch branches inside the
 * interval, the first-derivative enclosure is the hull of both branches'
 * and the second-derivative enclosure is extended to `+Infinity` (`abs`,
 * `max`: a convex kink) or `-Infinity` (`min`: a concave kink), so a
 * concavity proof from it is never fooled by a kink.
 *
 * @packageDocumentation
 */
import {
  absI,
  addI,
  copyI,
  cosI,
  coshI,
  digammaI,
  divI,
  expI,
  expm1I,
  hullI,
  isEmptyI,
  lgammaI,
  log1pI,
  logI,
  maxI,
  minI,
  mulI,
  negI,
  powConstI,
  powI,
  setI,
  sinI,
  sinhI,
  sqrI,
  sqrtI,
  subI,
  tanI,
  tanhI,
  trigammaI,
  atanI,
  widenI,
} from './interval.js';
import { addDn, addUp, divDn, divUp, subDn, subUp, widenDn, widenUp } from './rounding.js';
import { KSTRIDE, Op, type Program } from './program.js';
import { exp, log } from '../../vendor/math.js';

const NTEMP = 12;

/**
 * Interval evaluator of a program; slots allocated once.
 * @internal
 */
export class IntervalEvaluator {
  /** Slots: node r has value slot 3r, first-derivative slot 3r+1, second-derivative slot 3r+2. */
  readonly s: Float64Array;
  private readonly p: Program;
  private readonly t: number;
  private readonly one: number;
  private readonly two: number;
  private readonly zero: number;

  constructor(p: Program) {
    this.p = p;
    const n = 3 * p.nReg + NTEMP + 3;
    this.s = new Float64Array(2 * n);
    this.t = 3 * p.nReg;
    this.one = this.t + NTEMP;
    this.two = this.one + 1;
    this.zero = this.two + 1;
    const S = this.s;
    setI(S, this.one, 1, 1);
    setI(S, this.two, 2, 2);
    setI(S, this.zero, 0, 0);
    for (let r = 1; r < p.nLeaf; r++) {
      const v = p.leaves[r];
      setI(S, 3 * r, v, v);
      setI(S, 3 * r + 1, 0, 0);
      setI(S, 3 * r + 2, 0, 0);
    }
    setI(S, 1, 1, 1);
    setI(S, 2, 0, 0);
  }

  /** Evaluates over `[lo, hi]`; the enclosures of the result are in slots `3·result + 0..2`. */
  run(lo: number, hi: number): void {
    const p = this.p;
    const S = this.s;
    const code = p.code;
    const kdata = p.kdata;
    const args = p.args;
    const cst = p.constant;
    const T = this.t;
    const ONE = this.one;
    const TWO = this.two;
    const T0 = T;
    const T1 = T + 1;
    const T2 = T + 2;
    const T3 = T + 3;
    const T4 = T + 4;
    const T5 = T + 5;
    setI(S, 0, lo, hi);
    const m = code.length;
    for (let i = 0; i < m; i += 4) {
      const op = code[i];
      const dst = code[i + 1];
      const a = code[i + 2];
      const b = code[i + 3];
      const V = 3 * dst;
      const D = V + 1;
      const E = V + 2;
      const A = 3 * a;
      const DA = A + 1;
      const EA = A + 2;
      const B = 3 * b;
      const DB = B + 1;
      const EB = B + 2;
      const c = cst[i >> 2] === 1;
      switch (op) {
        case Op.Neg: negI(S, V, A); negI(S, D, DA); negI(S, E, EA); break;
        case Op.Add: addI(S, V, A, B); addI(S, D, DA, DB); addI(S, E, EA, EB); break;
        case Op.Sub: subI(S, V, A, B); subI(S, D, DA, DB); subI(S, E, EA, EB); break;
        case Op.Mul:
          mulI(S, V, A, B);
          if (!c) {
            // d = du*w + u*dw ; e = (eu*w + (2*du)*dw) + u*ew
            mulI(S, T0, DA, B);
            mulI(S, T1, A, DB);
            addI(S, D, T0, T1);
            mulI(S, T0, EA, B);
            mulI(S, T1, TWO, DA);
            mulI(S, T1, T1, DB);
            addI(S, T0, T0, T1);
            mulI(S, T1, A, EB);
            addI(S, E, T0, T1);
          }
          break;
        case Op.Div:
          divI(S, V, A, B);
          if (!c) {
            // d = (du - r*dw)/w ; e = ((eu - (2*d)*dw) - r*ew)/w
            mulI(S, T0, V, DB);
            subI(S, T0, DA, T0);
            divI(S, D, T0, B);
            mulI(S, T0, TWO, D);
            mulI(S, T0, T0, DB);
            subI(S, T0, EA, T0);
            mulI(S, T1, V, EB);
            subI(S, T0, T0, T1);
            divI(S, E, T0, B);
          }
          break;
        case Op.PowC: {
          const k = kdata[b * KSTRIDE];
          powConstI(S, V, A, k);
          if (!c) {
            if (k === 0) { setI(S, D, 0, 0); setI(S, E, 0, 0); }
            else if (k === 1) { copyI(S, D, DA); copyI(S, E, EA); }
            else {
              // p1 = k * u^(k-1); d = p1*du; e = p1*eu + (k(k-1) * u^(k-2)) * (du*du)
              powConstI(S, T0, A, kdata[b * KSTRIDE + 1]);
              setI(S, T1, k, k);
              mulI(S, T0, T1, T0);
              mulI(S, D, T0, DA);
              mulI(S, T2, T0, EA);
              powConstI(S, T3, A, kdata[b * KSTRIDE + 2]);
              setI(S, T4, kdata[b * KSTRIDE + 4], kdata[b * KSTRIDE + 5]);
              mulI(S, T3, T4, T3);
              sqrI(S, T4, DA);
              mulI(S, T3, T3, T4);
              addI(S, E, T2, T3);
            }
          }
          break;
        }
        case Op.PowK:
          powI(S, V, A, B, T4, T5);
          if (!c) {
            // km1 = k-1 ; p1 = k*u^km1 ; d = p1*du ; e = p1*eu + ((k*km1) * u^(k-2)) * (du*du)
            subI(S, T0, B, ONE);
            powI(S, T1, A, T0, T4, T5);
            mulI(S, T1, B, T1);
            mulI(S, D, T1, DA);
            mulI(S, T2, T1, EA);
            mulI(S, T0, B, T0);
            subI(S, T3, B, TWO);
            powI(S, T3, A, T3, T4, T5);
            mulI(S, T0, T0, T3);
            sqrI(S, T3, DA);
            mulI(S, T0, T0, T3);
            addI(S, E, T2, T0);
          }
          break;
        case Op.Pow:
          powI(S, V, A, B, T4, T5);
          if (!c) {
            // lu = log u ; q = du/u ; g1 = dw*lu + w*q ; d = r*g1
            // g2 = (ew*lu + (2*dw)*q) + w*(eu/u - q*q) ; e = r*(g2 + g1*g1)
            logI(S, T0, A);
            divI(S, T1, DA, A);
            mulI(S, T2, DB, T0);
            mulI(S, T3, B, T1);
            addI(S, T2, T2, T3);
            mulI(S, D, V, T2);
            mulI(S, T3, EB, T0);
            mulI(S, T0, TWO, DB);
            mulI(S, T0, T0, T1);
            addI(S, T3, T3, T0);
            divI(S, T0, EA, A);
            sqrI(S, T1, T1);
            subI(S, T0, T0, T1);
            mulI(S, T0, B, T0);
            addI(S, T3, T3, T0);
            sqrI(S, T2, T2);
            addI(S, T3, T3, T2);
            mulI(S, E, V, T3);
          }
          break;
        case Op.Exp:
          expI(S, V, A);
          if (!c) {
            mulI(S, D, V, DA);
            sqrI(S, T0, DA);
            addI(S, T0, EA, T0);
            mulI(S, E, V, T0);
          }
          break;
        case Op.Log:
          logI(S, V, A);
          if (!c) {
            divI(S, D, DA, A);
            divI(S, T0, EA, A);
            sqrI(S, T1, D);
            subI(S, E, T0, T1);
          }
          break;
        case Op.Log1p:
          log1pI(S, V, A);
          if (!c) {
            addI(S, T2, ONE, A);
            divI(S, D, DA, T2);
            divI(S, T0, EA, T2);
            sqrI(S, T1, D);
            subI(S, E, T0, T1);
          }
          break;
        case Op.Expm1:
          expm1I(S, V, A);
          if (!c) {
            expI(S, T2, A);
            mulI(S, D, T2, DA);
            sqrI(S, T0, DA);
            addI(S, T0, EA, T0);
            mulI(S, E, T2, T0);
          }
          break;
        case Op.Sqrt:
          sqrtI(S, V, A);
          if (!c) {
            // h = 2r ; d = du/h ; e = (eu - 2*(d*d))/h
            mulI(S, T2, TWO, V);
            divI(S, D, DA, T2);
            sqrI(S, T0, D);
            mulI(S, T0, TWO, T0);
            subI(S, T0, EA, T0);
            divI(S, E, T0, T2);
          }
          break;
        case Op.Abs: {
          const lo0 = S[2 * A];
          const hi0 = S[2 * A + 1];
          if (lo0 !== lo0) { absI(S, V, A); copyI(S, D, A); copyI(S, E, A); break; }
          if (lo0 >= 0) { copyI(S, V, A); copyI(S, D, DA); copyI(S, E, EA); }
          else if (hi0 < 0) { negI(S, V, A); negI(S, D, DA); negI(S, E, EA); }
          else {
            absI(S, V, A);
            negI(S, T0, DA);
            hullI(S, D, DA, T0);
            negI(S, T0, EA);
            hullI(S, E, EA, T0);
            if (!isEmptyI(S, E)) S[2 * E + 1] = Infinity;
          }
          break;
        }
        case Op.Sin:
          sinI(S, V, A);
          if (!c) {
            cosI(S, T2, A);
            mulI(S, D, T2, DA);
            mulI(S, T0, T2, EA);
            sqrI(S, T1, DA);
            mulI(S, T1, V, T1);
            subI(S, E, T0, T1);
          }
          break;
        case Op.Cos:
          cosI(S, V, A);
          if (!c) {
            sinI(S, T2, A);
            mulI(S, D, T2, DA);
            negI(S, D, D);
            mulI(S, T0, T2, EA);
            negI(S, T0, T0);
            sqrI(S, T1, DA);
            mulI(S, T1, V, T1);
            subI(S, E, T0, T1);
          }
          break;
        case Op.Tan:
          tanI(S, V, A);
          if (!c) {
            // q = 1 + r*r ; d = q*du ; e = q*(eu + (2*r)*(du*du))
            sqrI(S, T2, V);
            addI(S, T2, ONE, T2);
            mulI(S, D, T2, DA);
            mulI(S, T0, TWO, V);
            sqrI(S, T1, DA);
            mulI(S, T0, T0, T1);
            addI(S, T0, EA, T0);
            mulI(S, E, T2, T0);
          }
          break;
        case Op.Atan:
          atanI(S, V, A);
          if (!c) {
            // q = 1 + u*u ; d = du/q ; e = (eu - ((2*u)*du)*d)/q
            sqrI(S, T2, A);
            addI(S, T2, ONE, T2);
            divI(S, D, DA, T2);
            mulI(S, T0, TWO, A);
            mulI(S, T0, T0, DA);
            mulI(S, T0, T0, D);
            subI(S, T0, EA, T0);
            divI(S, E, T0, T2);
          }
          break;
        case Op.Tanh:
          tanhI(S, V, A);
          if (!c) {
            // q = 1 - r*r ; d = q*du ; e = q*(eu - (2*r)*(du*du))
            sqrI(S, T2, V);
            subI(S, T2, ONE, T2);
            mulI(S, D, T2, DA);
            mulI(S, T0, TWO, V);
            sqrI(S, T1, DA);
            mulI(S, T0, T0, T1);
            subI(S, T0, EA, T0);
            mulI(S, E, T2, T0);
          }
          break;
        case Op.Sinh:
        case Op.Cosh:
          if (op === Op.Sinh) { sinhI(S, V, A); if (!c) coshI(S, T2, A); }
          else { coshI(S, V, A); if (!c) sinhI(S, T2, A); }
          if (!c) {
            mulI(S, D, T2, DA);
            mulI(S, T0, T2, EA);
            sqrI(S, T1, DA);
            mulI(S, T1, V, T1);
            addI(S, E, T0, T1);
          }
          break;
        case Op.Lgamma:
          lgammaI(S, V, A);
          if (!c) {
            digammaI(S, T2, A);
            mulI(S, D, T2, DA);
            mulI(S, T0, T2, EA);
            trigammaI(S, T1, A);
            sqrI(S, T3, DA);
            mulI(S, T1, T1, T3);
            addI(S, E, T0, T1);
          }
          break;
        case Op.Min:
        case Op.Max: {
          const alo = S[2 * A];
          const ahi = S[2 * A + 1];
          const blo = S[2 * B];
          const bhi = S[2 * B + 1];
          if (alo !== alo || blo !== blo) { minI(S, V, A, B); copyI(S, D, V); copyI(S, E, V); break; }
          // the point evaluator picks a when a <= b (min) / a >= b (max)
          const canA = op === Op.Min ? alo <= bhi : ahi >= blo;
          const canB = op === Op.Min ? ahi > blo : alo < bhi;
          if (canA && !canB) { copyI(S, V, A); copyI(S, D, DA); copyI(S, E, EA); }
          else if (canB && !canA) { copyI(S, V, B); copyI(S, D, DB); copyI(S, E, EB); }
          else {
            if (op === Op.Min) minI(S, V, A, B);
            else maxI(S, V, A, B);
            hullI(S, D, DA, DB);
            hullI(S, E, EA, EB);
            if (!c && !isEmptyI(S, E)) {
              if (op === Op.Min) S[2 * E] = -Infinity;
              else S[2 * E + 1] = Infinity;
            }
          }
          break;
        }
        default:
          this.lse(V, a, b, c);
      }
      if (c) {
        setI(S, D, 0, 0);
        setI(S, E, 0, 0);
      }
    }
  }

  /** logsumexp over `count` argument registers starting at `args[start]`. */
  private lse(V: number, start: number, count: number, c: boolean): void {
    const S = this.s;
    const args = this.p.args;
    const D = V + 1;
    const E = V + 2;
    let mlo = -Infinity;
    let mhi = -Infinity;
    for (let j = 0; j < count; j++) {
      const r = 3 * args[start + j];
      const lo = S[2 * r];
      if (lo !== lo) {
        setI(S, V, NaN, NaN);
        setI(S, D, NaN, NaN);
        setI(S, E, NaN, NaN);
        return;
      }
      const hi = S[2 * r + 1];
      if (lo > mlo) mlo = lo;
      if (hi > mhi) mhi = hi;
    }
    setI(S, V, lseBound(S, args, start, count, mlo, false), lseBound(S, args, start, count, mhi, true));
    if (c) return;
    if (mhi === -Infinity || mlo === Infinity) {
      // every point value is ±Infinity; the point derivative is NaN there
      setI(S, D, NaN, NaN);
      setI(S, E, NaN, NaN);
      return;
    }
    const T = this.t;
    const T0 = T;
    const T1 = T + 1;
    const PJ = T + 6;
    const SUMD = T + 7;
    const SUME = T + 8;
    setI(S, SUMD, 0, 0);
    setI(S, SUME, 0, 0);
    for (let j = 0; j < count; j++) {
      const r = 3 * args[start + j];
      softmaxBound(S, args, start, count, j, PJ);
      // d1 += pj*du ; d2 += pj*(eu + du*du)
      mulI(S, T0, PJ, r + 1);
      addI(S, SUMD, SUMD, T0);
      sqrI(S, T0, r + 1);
      addI(S, T0, r + 2, T0);
      mulI(S, T0, PJ, T0);
      addI(S, SUME, SUME, T0);
    }
    copyI(S, D, SUMD);
    sqrI(S, T1, SUMD);
    subI(S, E, SUME, T1);
    // The weights form a convex combination (p_j >= 0, summing to 1), so the
    // derivative also lies in the hull of the arguments' derivatives; this
    // keeps a tail of a mixture provably decaying (added for certifiedSampler).
    let hlo = Infinity;
    let hhi = -Infinity;
    for (let j = 0; j < count; j++) {
      const r = 3 * args[start + j];
      if (S[2 * r + 1] === -Infinity) continue; // weight 0 on the whole interval
      const dlo = S[2 * (r + 1)];
      const dhi = S[2 * (r + 1) + 1];
      if (dlo !== dlo || dhi !== dhi) return;
      if (dlo < hlo) hlo = dlo;
      if (dhi > hhi) hhi = dhi;
    }
    const nlo = widenDn(hlo);
    const nhi = widenUp(hhi);
    if (nlo > S[2 * D]) S[2 * D] = nlo;
    if (nhi < S[2 * D + 1]) S[2 * D + 1] = nhi;
  }
}

/** Lower (`up = false`) or upper bound of logsumexp at the lower (upper) ends of the arguments; `m` is their maximum. */
function lseBound(S: Float64Array, args: Int32Array, start: number, count: number, m: number, up: boolean): number {
  if (m - m !== 0) return m;
  let s = 0;
  for (let j = 0; j < count; j++) {
    const t0 = S[2 * (3 * args[start + j]) + (up ? 1 : 0)];
    const t = up ? subUp(t0, m) : subDn(t0, m);
    let e: number;
    if (t === 0) e = 1;
    else if (t === -Infinity) e = 0;
    else {
      const ex = exp(t);
      e = up ? widenUp(ex) : widenDn(ex);
      if (e < 0) e = 0;
    }
    s = up ? addUp(s, e) : addDn(s, e);
  }
  const l = log(s);
  return up ? addUp(m, widenUp(l)) : addDn(m, widenDn(l));
}

/**
 * Enclosure of the softmax weight p_j = 1 / (1 + Σ_{i≠j} exp(a_i − a_j)),
 * which is increasing in a_j and decreasing in the others; widened to
 * cover the point evaluator's rounding of exp(a_j − m) / s.
 */
function softmaxBound(S: Float64Array, args: Int32Array, start: number, count: number, j: number, out: number): void {
  const rj = 3 * args[start + j];
  const ajlo = S[2 * rj];
  const ajhi = S[2 * rj + 1];
  let denUp = 1;
  let denDn = 1;
  for (let i = 0; i < count; i++) {
    if (i === j) continue;
    const ri = 3 * args[start + i];
    const tu = subUp(S[2 * ri + 1], ajlo);
    const td = subDn(S[2 * ri], ajhi);
    const eu = tu !== tu ? Infinity : tu === -Infinity ? 0 : widenUp(exp(tu));
    let ed = td !== td ? 0 : td === -Infinity ? 0 : widenDn(exp(td));
    if (ed < 0) ed = 0;
    denUp = addUp(denUp, eu);
    denDn = addDn(denDn, ed);
  }
  let lo = denUp === Infinity ? 0 : widenDn(divDn(1, denUp));
  let hi = widenUp(divUp(1, denDn));
  if (lo < 0) lo = 0;
  if (hi > 1) hi = 1;
  setI(S, out, lo, hi);
}

export { widenI };
