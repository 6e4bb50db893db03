/**
 * Input validation shared by all methods. @internal
 *
 * @packageDocumentation
 */
import { InvalidOptionError, InvalidTargetError } from './errors.js';
import { DEFAULT_MAX_REJECTIONS } from './counters.js';
import { checkLogDensity } from './evaluate.js';
import type { Target } from './types.js';

/** A target whose optional members have been checked. @internal */
export interface CheckedTarget {
  readonly logDensity: (x: number) => number;
  readonly dLogDensity: ((x: number) => number) | undefined;
  readonly lower: number;
  readonly upper: number;
  readonly mode: number | undefined;
}

/** A {@link CheckedTarget} being written (the validation's output). */
type MutableCheckedTarget = { -readonly [K in keyof CheckedTarget]: CheckedTarget[K] };

/** The optional bound members a target may carry, each checked to be a function when given. */
const BOUND_MEMBERS = ['logDensityBounds', 'dLogDensityBounds', 'd2LogDensityBounds'] as const;

/** Placeholder of a checked target's logDensity before it is bound. */
const unbound = (): number => NaN;

/**
 * Validates a target: `logDensity` is a function, `dLogDensity` (if any) is a
 * function, the support is `[lower, upper]` with `lower < upper` and no NaN,
 * and the mode hint (if any) is a finite number inside the support.
 * @internal
 */
export function checkTarget(api: string, target: Target): CheckedTarget {
  const out: MutableCheckedTarget = { logDensity: unbound, dLogDensity: undefined, lower: -Infinity, upper: Infinity, mode: undefined };
  validateTarget(api, target, out);
  out.logDensity = target.logDensity.bind(target);
  out.dLogDensity = target.dLogDensity !== undefined ? target.dLogDensity.bind(target) : undefined;
  return out;
}

/**
 * {@link checkTarget} for a sampler that is given one target after another
 * (a Gibbs sampler's full conditionals, often the same object whose
 * closures read the chain's state): the same checks and errors on every
 * call, written into one object that the next call overwrites, and the
 * bound functions kept while the target object and its functions are the
 * same as last time (binding anew would allocate two functions per step).
 * @internal
 */
export class CheckedTargetCache {
  private readonly out: MutableCheckedTarget = { logDensity: unbound, dLogDensity: undefined, lower: -Infinity, upper: Infinity, mode: undefined };
  private owner: Target | undefined = undefined;
  private rawLogDensity: unknown = undefined;
  private rawDLogDensity: unknown = undefined;

  /**
   * Checks `target` as {@link checkTarget} does; the object returned is
   * valid until the next call.
   */
  check(api: string, target: Target): CheckedTarget {
    const out = this.out;
    validateTarget(api, target, out);
    if (target !== this.owner || target.logDensity !== this.rawLogDensity || target.dLogDensity !== this.rawDLogDensity) {
      out.logDensity = target.logDensity.bind(target);
      out.dLogDensity = target.dLogDensity !== undefined ? target.dLogDensity.bind(target) : undefined;
      this.owner = target;
      this.rawLogDensity = target.logDensity;
      this.rawDLogDensity = target.dLogDensity;
    }
    return out;
  }
}

/** The checks of {@link checkTarget}; writes the support ends and the mode hint into `out`. */
function validateTarget(api: string, target: Target, out: MutableCheckedTarget): void {
  if (target === null || typeof target !== 'object') {
    throw new InvalidTargetError(`${api}: target must be an object with a logDensity function, got ${target === null ? 'null' : typeof target}`);
  }
  if (typeof target.logDensity !== 'function') {
    throw new InvalidTargetError(`${api}: target.logDensity must be a function, got ${typeof target.logDensity}`);
  }
  if (target.dLogDensity !== undefined && typeof target.dLogDensity !== 'function') {
    throw new InvalidTargetError(`${api}: target.dLogDensity must be a function when given, got ${typeof target.dLogDensity}`);
  }
  for (let i = 0; i < BOUND_MEMBERS.length; i++) {
    const name = BOUND_MEMBERS[i];
    if (target[name] !== undefined && typeof target[name] !== 'function') {
      throw new InvalidTargetError(`${api}: target.${name} must be a function when given, got ${typeof target[name]}`);
    }
  }
  checkSupportInto(api, 'target.support', target.support, out);
  const lower = out.lower;
  const upper = out.upper;
  if (target.modes !== undefined) {
    if (!Array.isArray(target.modes)) {
      throw new InvalidTargetError(`${api}: target.modes must be an array of numbers when given, got ${typeof target.modes}`);
    }
    for (const m of target.modes as readonly unknown[]) {
      if (typeof m !== 'number' || !Number.isFinite(m) || m < lower || m > upper) {
        throw new InvalidTargetError(`${api}: every entry of target.modes must be a finite number inside the support [${lower}, ${upper}], got ${typeof m === 'string' ? `'${m}'` : String(m)}`);
      }
    }
  }
  const mode = target.mode;
  if (mode !== undefined) {
    if (typeof mode !== 'number' || !Number.isFinite(mode)) {
      throw new InvalidTargetError(`${api}: target.mode must be a finite number when given, got ${showValue(mode)}`);
    }
    if (mode < lower || mode > upper) {
      throw new InvalidTargetError(`${api}: target.mode = ${mode} lies outside the support [${lower}, ${upper}]`);
    }
  }
  out.mode = mode;
}

/** Validates a support pair. @internal */
export function checkSupport(api: string, name: string, support: readonly [number, number] | undefined): [number, number] {
  const ends = { lower: -Infinity, upper: Infinity };
  checkSupportInto(api, name, support, ends);
  return [ends.lower, ends.upper];
}

/** {@link checkSupport} writing the ends into `out` (no allocation). */
function checkSupportInto(api: string, name: string, support: readonly [number, number] | undefined, out: { lower: number; upper: number }): void {
  if (support === undefined) {
    out.lower = -Infinity;
    out.upper = Infinity;
    return;
  }
  if (!Array.isArray(support) || support.length !== 2) {
    throw badValue(name, `${api}: ${name} must be a pair [lower, upper], got ${showValue(support)}`);
  }
  const lower = support[0] as unknown;
  const upper = support[1] as unknown;
  if (typeof lower !== 'number' || typeof upper !== 'number' || Number.isNaN(lower) || Number.isNaN(upper)) {
    throw badValue(name, `${api}: ${name} bounds must be numbers (not NaN), got [${showValue(lower)}, ${showValue(upper)}]`);
  }
  if (!(lower < upper)) {
    throw badValue(name, `${api}: ${name} must have lower < upper, got [${lower}, ${upper}]`);
  }
  if (lower === Infinity || upper === -Infinity) {
    throw badValue(name, `${api}: ${name} is empty, got [${lower}, ${upper}]`);
  }
  out.lower = lower;
  out.upper = upper;
}

/**
 * Evaluates `logDensity(x)` and checks it with {@link checkLogDensity}
 * (the one check every method uses). @internal
 */
export function evalLog(api: string, logDensity: (x: number) => number, x: number): number {
  return checkLogDensity(api, x, logDensity(x));
}

/**
 * A value as messages show it: strings quoted (`'42'`), everything else as
 * `String(v)` (arrays in brackets, objects by their tag).
 * @internal
 */
export function showValue(v: unknown): string {
  if (typeof v === 'string') return `'${v}'`;
  if (Array.isArray(v)) return `[${v.map(showValue).join(', ')}]`;
  if (v !== null && typeof v === 'object') return Object.prototype.toString.call(v);
  return String(v);
}

/**
 * The error class for a bad value of the parameter `name`: an option
 * (`name` starts with `options.`) gets {@link InvalidOptionError}
 * (`'INVALID_OPTION'`), a target or family parameter {@link InvalidTargetError}.
 * @internal
 */
export function badValue(name: string, message: string): InvalidTargetError | InvalidOptionError {
  return name.startsWith('options.') ? new InvalidOptionError(message) : new InvalidTargetError(message);
}

/** Throws unless `v` is a finite number (`InvalidOptionError` when `name` is `options.…`). @internal */
export function checkFinite(api: string, name: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    throw badValue(name, `${api}: ${name} must be a finite number, got ${showValue(v)}`);
  }
  return v;
}

/** Throws unless `v` is a finite number > 0 (`InvalidOptionError` when `name` is `options.…`). @internal */
export function checkPositive(api: string, name: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) {
    throw badValue(name, `${api}: ${name} must be a finite number > 0, got ${showValue(v)}`);
  }
  return v;
}

/** Throws unless `v` is an integer in `[min, max]` (`InvalidOptionError` when `name` is `options.…`). @internal */
export function checkInteger(api: string, name: string, v: unknown, min: number, max: number): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < min || v > max) {
    throw badValue(name, `${api}: ${name} must be an integer in [${min}, ${max}], got ${showValue(v)}`);
  }
  return v;
}

/** Throws if the options object has keys the API does not know (catches typos). @internal */
export function checkOptionKeys(api: string, opts: object | undefined, known: readonly string[]): void {
  if (opts === undefined) return;
  if (opts === null || typeof opts !== 'object') {
    throw new InvalidOptionError(`${api}: options must be an object, got ${opts === null ? 'null' : typeof opts}`);
  }
  for (const k of Object.keys(opts)) {
    if (!known.includes(k)) {
      throw new InvalidOptionError(`${api}: unknown option '${k}' (known: ${known.map((n) => `'${n}'`).join(', ')})`);
    }
  }
}

/** Throws unless `out` is a Float64Array (the argument of every `fill`). @internal */
export function checkFillArray(api: string, out: unknown): void {
  if (!(out instanceof Float64Array)) {
    throw new InvalidTargetError(`${api}.fill: out must be a Float64Array, got ${Object.prototype.toString.call(out)}`);
  }
}

/**
 * Resolves `options.maxRejections` of every sampler: the default
 * ({@link DEFAULT_MAX_REJECTIONS}) when undefined, else an integer in
 * [1, 2^53 − 1]. @internal
 */
export function resolveMaxRejections(api: string, v: unknown): number {
  return v === undefined ? DEFAULT_MAX_REJECTIONS : checkInteger(api, 'options.maxRejections', v, 1, Number.MAX_SAFE_INTEGER);
}

/** Resolves a boolean option `name` (as written in messages, e.g. `options.fast`): `dflt` when undefined. @internal */
export function resolveBoolean(api: string, name: string, v: unknown, dflt: boolean): boolean {
  if (v === undefined) return dflt;
  if (typeof v !== 'boolean') throw badValue(name, `${api}: ${name} must be a boolean, got ${showValue(v)}`);
  return v;
}
