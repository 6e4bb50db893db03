/**
 * Validation of discrete targets and fill arrays. @internal
 *
 * @packageDocumentation
 */
import { checkLogDensity } from '../core/evaluate.js';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import type { DiscreteTarget } from '../core/types.js';

/** A discrete target whose members have been checked. @internal */
export interface CheckedDiscreteTarget {
  readonly logPmf: (k: number) => number;
  /** Integer or -Infinity. */
  readonly lower: number;
  /** Integer or Infinity. */
  readonly upper: number;
  readonly mode: number | undefined;
  /** The target's promises (false when not given). */
  readonly logConcave: boolean;
  readonly normalized: boolean;
}

function show(v: unknown): string {
  return typeof v === 'string' ? `'${v}'` : String(v);
}

/**
 * Validates a discrete target: `logPmf` is a function, the support is a pair
 * of integers (lower may be -Infinity, upper Infinity) with lower ≤ upper,
 * the mode hint (if any) is an integer inside the support, cdf a function.
 * @internal
 */
export function checkDiscreteTarget(api: string, target: DiscreteTarget): CheckedDiscreteTarget {
  if (target === null || typeof target !== 'object') {
    throw new InvalidTargetError(`${api}: target must be an object with a logPmf function, got ${target === null ? 'null' : typeof target}`);
  }
  if (typeof target.logPmf !== 'function') {
    throw new InvalidTargetError(`${api}: target.logPmf must be a function, got ${typeof target.logPmf}`);
  }
  if (target.cdf !== undefined && typeof target.cdf !== 'function') {
    throw new InvalidTargetError(`${api}: target.cdf must be a function when given, got ${typeof target.cdf}`);
  }
  let lower = 0;
  let upper = Infinity;
  const s = target.support as unknown;
  if (s !== undefined) {
    if (!Array.isArray(s) || s.length !== 2) {
      throw new InvalidTargetError(`${api}: target.support must be a pair [lower, upper] of integers, got ${show(s)}`);
    }
    const a = s[0] as unknown;
    const b = s[1] as unknown;
    if (typeof a !== 'number' || !(Number.isInteger(a) || a === -Infinity)) {
      throw new InvalidTargetError(`${api}: target.support[0] must be an integer or -Infinity, got ${show(a)}`);
    }
    if (typeof b !== 'number' || !(Number.isInteger(b) || b === Infinity)) {
      throw new InvalidTargetError(`${api}: target.support[1] must be an integer or Infinity, got ${show(b)}`);
    }
    if (!(a <= b)) throw new InvalidTargetError(`${api}: target.support must have lower <= upper, got [${a}, ${b}]`);
    if (Math.abs(a) > Number.MAX_SAFE_INTEGER && a !== -Infinity) {
      throw new InvalidTargetError(`${api}: target.support[0] must be a safe integer, got ${a}`);
    }
    if (Math.abs(b) > Number.MAX_SAFE_INTEGER && b !== Infinity) {
      throw new InvalidTargetError(`${api}: target.support[1] must be a safe integer, got ${b}`);
    }
    lower = a;
    upper = b;
  }
  const mode = target.mode as unknown;
  if (mode !== undefined) {
    if (typeof mode !== 'number' || !Number.isSafeInteger(mode)) {
      throw new InvalidTargetError(`${api}: target.mode must be an integer when given, got ${show(mode)}`);
    }
    if (mode < lower || mode > upper) {
      throw new InvalidTargetError(`${api}: target.mode = ${mode} lies outside the support [${lower}, ${upper}]`);
    }
  }
  const lc = target.logConcave as unknown;
  if (lc !== undefined && typeof lc !== 'boolean') throw new InvalidTargetError(`${api}: target.logConcave must be a boolean when given, got ${show(lc)}`);
  const nz = target.normalized as unknown;
  if (nz !== undefined && typeof nz !== 'boolean') throw new InvalidTargetError(`${api}: target.normalized must be a boolean when given, got ${show(nz)}`);
  return { logPmf: target.logPmf.bind(target), lower, upper, mode: mode as number | undefined, logConcave: lc === true, normalized: nz === true };
}

/** Evaluates logPmf(k) and throws NonFiniteDensityError (the one check, core/evaluate.ts) on NaN or +Infinity. @internal */
export function evalLogPmf(api: string, logPmf: (k: number) => number, k: number): number {
  return checkLogDensity(api, k, logPmf(k));
}

/** Throws unless `out` is a Float64Array or an Int32Array. @internal */
export function checkDiscreteFillArray(api: string, out: unknown): void {
  if (!(out instanceof Float64Array) && !(out instanceof Int32Array)) {
    throw new InvalidTargetError(`${api}.fill: out must be a Float64Array or an Int32Array, got ${Object.prototype.toString.call(out)}`);
  }
}

/** The error for a draw that does not fit an Int32Array. @internal */
export function int32RangeError(api: string, k: number): InvalidOptionError {
  return new InvalidOptionError(`${api}.fill: draw ${k} does not fit an Int32Array; fill a Float64Array instead`);
}
