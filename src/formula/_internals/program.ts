/**
 * Compiled form of a formula: a flat instruction array over Float64Array
 * registers, and its point evaluation (value, first and second derivative
 * by second-order forward-mode automatic differentiation). @internal
 *
 * @remarks
 * Register 0 holds x; the next registers hold the constants (numbers,
 * parameters, pi, e); each instruction writes one new register (static
 * single assignment), so an evaluation only overwrites the instruction
 * registers and allocates nothing. Instruction `i` is the four integers
 * `code[4i .. 4i+3] = [op, dst, a, b]`; `b` indexes `kdata` for a constant
 * exponent and the argument list `args` for `logsumexp`.
 *
 * Conventions of the point evaluator (mirrored by the interval evaluator):
 * denominators and the bases of `^` are `+0`-normalized (`b + 0`), so a
 * zero denominator gives `numerator · (+Infinity)` whatever the sign of the
 * zero; `abs` has derivative `+1` at 0 and `min`/`max` take the first
 * argument's derivatives at ties; `lgamma` is defined for `x >= 0` only.
 * An instruction that does not depend on x has zero derivatives by
 * construction (so `log(0)` in a constant does not poison the derivative).
 *
 * @packageDocumentation
 */
import type { Node } from './ast.js';
import { CONSTANTS } from './ast.js';
import { lgammaValue } from './interval.js';
import { digammaValue, trigammaValue } from './special.js';
import { mulDn, mulUp, subDn, subUp } from './rounding.js';
import { atan, cos, cosh, exp, expm1, log, log1p, pow, sin, sinh, tan, tanh } from '../../vendor/math.js';

/** Opcodes. @internal */
export const enum Op {
  Neg = 0,
  Add,
  Sub,
  Mul,
  Div,
  /** constant exponent known at compile time: kdata index in b */
  PowC,
  /** exponent independent of x but not a literal */
  PowK,
  /** general power, exponent depends on x */
  Pow,
  Exp,
  Log,
  Log1p,
  Expm1,
  Sqrt,
  Abs,
  Sin,
  Cos,
  Tan,
  Atan,
  Tanh,
  Sinh,
  Cosh,
  Lgamma,
  Min,
  Max,
  Lse,
}

/** Number of doubles per constant exponent in `kdata`: k, k−1, k−2, k·(k−1), and an interval of k·(k−1). @internal */
export const KSTRIDE = 6;

/** A compiled formula. @internal */
export interface Program {
  /** `[op, dst, a, b]` per instruction. */
  readonly code: Int32Array;
  /** 1 where an instruction's result does not depend on x. */
  readonly constant: Uint8Array;
  /** Number of registers. */
  readonly nReg: number;
  /** Number of leading registers that are x and constants (never overwritten). */
  readonly nLeaf: number;
  /** Values of the leaf registers (index 0, x, is a placeholder). */
  readonly leaves: Float64Array;
  /** Constant exponent data, {@link KSTRIDE} per entry. */
  readonly kdata: Float64Array;
  /** Argument registers of variadic instructions. */
  readonly args: Int32Array;
  /** Register holding the result. */
  readonly result: number;
}

/** Compiles a tree; parameter values come from `params`. @internal */
export function compile(tree: Node, params: Readonly<Record<string, number>>): Program {
  const leaves: number[] = [NaN];
  const leafIndex = new Map<string, number>();
  const code: number[] = [];
  const constant: number[] = [];
  const kdata: number[] = [];
  const args: number[] = [];
  const isConst: boolean[] = [false];
  // first pass: collect leaves so that they occupy the leading registers
  const leafKey = (v: number): string => (Object.is(v, -0) ? '-0' : String(v));
  const collect = (n: Node): void => {
    switch (n.kind) {
      case 'num':
      case 'param':
      case 'const': {
        const v = n.kind === 'num' ? n.value : n.kind === 'param' ? params[n.name] : CONSTANTS[n.name];
        const key = leafKey(v);
        if (!leafIndex.has(key)) {
          leafIndex.set(key, leaves.length);
          leaves.push(v);
          isConst.push(true);
        }
        return;
      }
      case 'x':
        return;
      case 'neg':
        return collect(n.arg);
      case 'bin':
        collect(n.left);
        collect(n.right);
        return;
      case 'call':
        for (const a of n.args) collect(a);
    }
  };
  collect(tree);
  const nLeaf = leaves.length;
  let nReg = nLeaf;
  const emit = (op: Op, a: number, b: number, c: boolean): number => {
    const dst = nReg++;
    code.push(op, dst, a, b);
    constant.push(c ? 1 : 0);
    isConst.push(c);
    return dst;
  };
  const constExponent = (n: Node): number | undefined => {
    if (n.kind === 'num') return n.value;
    if (n.kind === 'param') return params[n.name];
    if (n.kind === 'const') return CONSTANTS[n.name];
    if (n.kind === 'neg') {
      const v = constExponent(n.arg);
      return v === undefined ? undefined : -v;
    }
    return undefined;
  };
  const addK = (k: number): number => {
    const idx = kdata.length / KSTRIDE;
    const km1 = k - 1;
    const lo = Math.min(mulDn(k, subDn(k, 1)), mulDn(k, subUp(k, 1)));
    const hi = Math.max(mulUp(k, subDn(k, 1)), mulUp(k, subUp(k, 1)));
    kdata.push(k, km1, k - 2, k * km1, lo, hi);
    return idx;
  };
  const gen = (n: Node): number => {
    switch (n.kind) {
      case 'num':
      case 'param':
      case 'const': {
        const v = n.kind === 'num' ? n.value : n.kind === 'param' ? params[n.name] : CONSTANTS[n.name];
        return leafIndex.get(leafKey(v)) as number;
      }
      case 'x':
        return 0;
      case 'neg': {
        const a = gen(n.arg);
        return emit(Op.Neg, a, 0, isConst[a]);
      }
      case 'bin': {
        const a = gen(n.left);
        if (n.op === '^') {
          const k = constExponent(n.right);
          if (k !== undefined) return emit(Op.PowC, a, addK(k), isConst[a]);
          const b = gen(n.right);
          return emit(isConst[b] ? Op.PowK : Op.Pow, a, b, isConst[a] && isConst[b]);
        }
        const b = gen(n.right);
        const op = n.op === '+' ? Op.Add : n.op === '-' ? Op.Sub : n.op === '*' ? Op.Mul : Op.Div;
        return emit(op, a, b, isConst[a] && isConst[b]);
      }
      case 'call': {
        const name = n.name;
        if (name === 'pow') {
          const a = gen(n.args[0]);
          const k = constExponent(n.args[1]);
          if (k !== undefined) return emit(Op.PowC, a, addK(k), isConst[a]);
          const b = gen(n.args[1]);
          return emit(isConst[b] ? Op.PowK : Op.Pow, a, b, isConst[a] && isConst[b]);
        }
        if (name === 'min' || name === 'max') {
          let acc = gen(n.args[0]);
          for (let j = 1; j < n.args.length; j++) {
            const b = gen(n.args[j]);
            acc = emit(name === 'min' ? Op.Min : Op.Max, acc, b, isConst[acc] && isConst[b]);
          }
          return acc;
        }
        if (name === 'logsumexp') {
          const regs = n.args.map(gen);
          const start = args.length;
          for (const r of regs) args.push(r);
          // a = start in args, b = count; the count is also stored so the interval code can find it
          return emit(Op.Lse, start, regs.length, regs.every((r) => isConst[r]));
        }
        const a = gen(n.args[0]);
        const op = UNARY[name];
        return emit(op, a, 0, isConst[a]);
      }
    }
  };
  const result = gen(tree);
  return {
    code: Int32Array.from(code),
    constant: Uint8Array.from(constant),
    nReg,
    nLeaf,
    leaves: Float64Array.from(leaves),
    kdata: Float64Array.from(kdata),
    args: Int32Array.from(args),
    result,
  };
}

const UNARY: Record<string, Op> = {
  exp: Op.Exp,
  log: Op.Log,
  log1p: Op.Log1p,
  expm1: Op.Expm1,
  sqrt: Op.Sqrt,
  abs: Op.Abs,
  sin: Op.Sin,
  cos: Op.Cos,
  tan: Op.Tan,
  atan: Op.Atan,
  tanh: Op.Tanh,
  sinh: Op.Sinh,
  cosh: Op.Cosh,
  lgamma: Op.Lgamma,
};

/** digamma and trigamma point values on lgamma's domain (NaN for x < 0, ±Infinity at 0). @internal */
export function digammaPoint(u: number): number {
  return u > 0 ? digammaValue(u) : u === 0 ? -Infinity : NaN;
}
/** @internal */
export function trigammaPoint(u: number): number {
  return u > 0 ? trigammaValue(u) : u === 0 ? Infinity : NaN;
}

/**
 * Point evaluator of a program: registers allocated once.
 * @internal
 */
export class PointEvaluator {
  /** Values. */
  readonly v: Float64Array;
  /** First derivatives. */
  readonly d: Float64Array;
  /** Second derivatives. */
  readonly e: Float64Array;
  private readonly p: Program;

  constructor(p: Program) {
    this.p = p;
    this.v = new Float64Array(p.nReg);
    this.d = new Float64Array(p.nReg);
    this.e = new Float64Array(p.nReg);
    this.v.set(p.leaves);
    this.d[0] = 1;
  }

  /** Value at x. */
  value(x: number): number {
    const p = this.p;
    const code = p.code;
    const kdata = p.kdata;
    const args = p.args;
    const V = this.v;
    V[0] = x;
    const m = code.length;
    for (let i = 0; i < m; i += 4) {
      const dst = code[i + 1];
      const a = code[i + 2];
      const b = code[i + 3];
      const u = V[a];
      let r: number;
      switch (code[i]) {
        case Op.Neg: r = -u; break;
        case Op.Add: r = u + V[b]; break;
        case Op.Sub: r = u - V[b]; break;
        case Op.Mul: r = u * V[b]; break;
        case Op.Div: r = u / (V[b] + 0); break;
        case Op.PowC: r = pow(u + 0, kdata[b * KSTRIDE]); break;
        case Op.PowK:
        case Op.Pow: r = pow(u + 0, V[b]); break;
        case Op.Exp: r = exp(u); break;
        case Op.Log: r = log(u); break;
        case Op.Log1p: r = log1p(u); break;
        case Op.Expm1: r = expm1(u); break;
        case Op.Sqrt: r = Math.sqrt(u); break;
        case Op.Abs: r = Math.abs(u); break;
        case Op.Sin: r = sin(u); break;
        case Op.Cos: r = cos(u); break;
        case Op.Tan: r = tan(u); break;
        case Op.Atan: r = atan(u); break;
        case Op.Tanh: r = tanh(u); break;
        case Op.Sinh: r = sinh(u); break;
        case Op.Cosh: r = cosh(u); break;
        case Op.Lgamma: r = lgammaValue(u); break;
        case Op.Min: {
          const w = V[b];
          r = u !== u || w !== w ? NaN : u <= w ? u : w;
          break;
        }
        case Op.Max: {
          const w = V[b];
          r = u !== u || w !== w ? NaN : u >= w ? u : w;
          break;
        }
        default: {
          // Lse: a = start, b = count
          let mx = -Infinity;
          for (let j = 0; j < b; j++) {
            const t = V[args[a + j]];
            if (t !== t) { mx = NaN; break; }
            if (t > mx) mx = t;
          }
          if (mx - mx !== 0) r = mx;
          else {
            let s = 0;
            for (let j = 0; j < b; j++) s += exp(V[args[a + j]] - mx);
            r = mx + log(s);
          }
        }
      }
      V[dst] = r;
    }
    return V[p.result];
  }

  /**
   * Value, first and second derivative at x (in `v`, `d`, `e` of the
   * result register); returns the first derivative. `second = false` skips
   * the second derivative.
   */
  derivatives(x: number, second: boolean): number {
    const p = this.p;
    const code = p.code;
    const kdata = p.kdata;
    const args = p.args;
    const cst = p.constant;
    const V = this.v;
    const D = this.d;
    const E = this.e;
    V[0] = x;
    const m = code.length;
    for (let i = 0; i < m; i += 4) {
      const op = code[i];
      const dst = code[i + 1];
      const a = code[i + 2];
      const b = code[i + 3];
      const u = V[a];
      const du = D[a];
      const eu = E[a];
      let r: number;
      let dr = 0;
      let er = 0;
      const c = cst[i >> 2] === 1;
      switch (op) {
        case Op.Neg: r = -u; dr = -du; er = -eu; break;
        case Op.Add: r = u + V[b]; dr = du + D[b]; er = eu + E[b]; break;
        case Op.Sub: r = u - V[b]; dr = du - D[b]; er = eu - E[b]; break;
        case Op.Mul: {
          const w = V[b];
          const dw = D[b];
          r = u * w;
          if (!c) {
            dr = du * w + u * dw;
            if (second) er = eu * w + 2 * du * dw + u * E[b];
          }
          break;
        }
        case Op.Div: {
          const w = V[b] + 0;
          const dw = D[b];
          r = u / w;
          if (!c) {
            dr = (du - r * dw) / w;
            if (second) er = (eu - 2 * dr * dw - r * E[b]) / w;
          }
          break;
        }
        case Op.PowC: {
          const k = kdata[b * KSTRIDE];
          const base = u + 0;
          r = pow(base, k);
          if (!c) {
            if (k === 0) { dr = 0; er = 0; }
            else if (k === 1) { dr = du; er = eu; }
            else {
              const p1 = k * pow(base, kdata[b * KSTRIDE + 1]);
              dr = p1 * du;
              if (second) er = p1 * eu + kdata[b * KSTRIDE + 3] * pow(base, kdata[b * KSTRIDE + 2]) * (du * du);
            }
          }
          break;
        }
        case Op.PowK: {
          const k = V[b];
          const base = u + 0;
          r = pow(base, k);
          if (!c) {
            const km1 = k - 1;
            const p1 = k * pow(base, km1);
            dr = p1 * du;
            if (second) er = p1 * eu + k * km1 * pow(base, k - 2) * (du * du);
          }
          break;
        }
        case Op.Pow: {
          // u^w = exp(g), g = w log u
          const w = V[b];
          const dw = D[b];
          const base = u + 0;
          r = pow(base, w);
          if (!c) {
            const lu = log(base);
            const q = du / base;
            const g1 = dw * lu + w * q;
            dr = r * g1;
            if (second) {
              const g2 = E[b] * lu + 2 * dw * q + w * (eu / base - q * q);
              er = r * (g2 + g1 * g1);
            }
          }
          break;
        }
        case Op.Exp:
          r = exp(u);
          if (!c) { dr = r * du; if (second) er = r * (eu + du * du); }
          break;
        case Op.Log: {
          r = log(u);
          if (!c) {
            const w = u + 0;
            const q = du / w;
            dr = q;
            if (second) er = eu / w - q * q;
          }
          break;
        }
        case Op.Log1p: {
          r = log1p(u);
          if (!c) {
            const w = 1 + u + 0;
            const q = du / w;
            dr = q;
            if (second) er = eu / w - q * q;
          }
          break;
        }
        case Op.Expm1: {
          r = expm1(u);
          if (!c) {
            const x1 = exp(u);
            dr = x1 * du;
            if (second) er = x1 * (eu + du * du);
          }
          break;
        }
        case Op.Sqrt: {
          r = Math.sqrt(u);
          if (!c) {
            const h = 2 * r + 0;
            dr = du / h;
            if (second) er = (eu - 2 * (dr * dr)) / h;
          }
          break;
        }
        case Op.Abs:
          if (u >= 0) { r = u; dr = du; er = eu; }
          else if (u < 0) { r = -u; dr = -du; er = -eu; }
          else { r = NaN; dr = NaN; er = NaN; }
          r = r + 0;
          break;
        case Op.Sin: {
          r = sin(u);
          if (!c) {
            const co = cos(u);
            dr = co * du;
            if (second) er = co * eu - r * (du * du);
          }
          break;
        }
        case Op.Cos: {
          r = cos(u);
          if (!c) {
            const si = sin(u);
            dr = -(si * du);
            if (second) er = -(si * eu) - r * (du * du);
          }
          break;
        }
        case Op.Tan: {
          r = tan(u);
          if (!c) {
            const q = 1 + r * r;
            dr = q * du;
            if (second) er = q * (eu + 2 * r * (du * du));
          }
          break;
        }
        case Op.Atan: {
          r = atan(u);
          if (!c) {
            const q = 1 + u * u;
            dr = du / q;
            if (second) er = (eu - 2 * u * du * dr) / q;
          }
          break;
        }
        case Op.Tanh: {
          r = tanh(u);
          if (!c) {
            const q = 1 - r * r;
            dr = q * du;
            if (second) er = q * (eu - 2 * r * (du * du));
          }
          break;
        }
        case Op.Sinh: {
          r = sinh(u);
          if (!c) {
            const ch = cosh(u);
            dr = ch * du;
            if (second) er = ch * eu + r * (du * du);
          }
          break;
        }
        case Op.Cosh: {
          r = cosh(u);
          if (!c) {
            const sh = sinh(u);
            dr = sh * du;
            if (second) er = sh * eu + r * (du * du);
          }
          break;
        }
        case Op.Lgamma: {
          r = lgammaValue(u);
          if (!c) {
            const ps = digammaPoint(u);
            dr = ps * du;
            if (second) er = ps * eu + trigammaPoint(u) * (du * du);
          }
          break;
        }
        case Op.Min:
        case Op.Max: {
          const w = V[b];
          const pickA = op === Op.Min ? u <= w : u >= w;
          if (u !== u || w !== w) { r = NaN; dr = NaN; er = NaN; }
          else if (pickA) { r = u; dr = du; er = eu; }
          else { r = w; dr = D[b]; er = E[b]; }
          break;
        }
        default: {
          // Lse
          let mx = -Infinity;
          for (let j = 0; j < b; j++) {
            const t = V[args[a + j]];
            if (t !== t) { mx = NaN; break; }
            if (t > mx) mx = t;
          }
          if (mx - mx !== 0) { r = mx; dr = NaN; er = NaN; }
          else {
            let s = 0;
            for (let j = 0; j < b; j++) s += exp(V[args[a + j]] - mx);
            r = mx + log(s);
            if (!c) {
              let d1 = 0;
              let d2 = 0;
              for (let j = 0; j < b; j++) {
                const k = args[a + j];
                const pj = exp(V[k] - mx) / s;
                d1 += pj * D[k];
                if (second) d2 += pj * (E[k] + D[k] * D[k]);
              }
              dr = d1;
              if (second) er = d2 - d1 * d1;
            }
          }
        }
      }
      V[dst] = r;
      D[dst] = c ? 0 : dr;
      E[dst] = c || !second ? 0 : er;
    }
    return D[p.result];
  }
}
