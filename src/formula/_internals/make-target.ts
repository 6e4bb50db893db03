/**
 * Builds a {@link FormulaTarget} from an expression tree (shared by
 * `formulaTarget` and the builder). @internal
 *
 * @packageDocumentation
 */
import { InvalidOptionError, InvalidTargetError } from '../../core/errors.js';
import type { Target } from '../../core/types.js';
import { checkOptionKeys, checkSupport } from '../../core/validate.js';
import { printNode, type Node } from './ast.js';
import { IntervalEvaluator } from './interval-program.js';
import { compile, PointEvaluator } from './program.js';
import { logsOfSums } from './rewrite.js';

/**
 * A {@link Target} defined by a formula: point values, exact derivatives
 * (forward-mode automatic differentiation) and guaranteed interval bounds
 * of the value and of both derivatives, all from one definition.
 *
 * @remarks
 * Created by {@link formulaTarget} or `builderTarget`. Outside the
 * support `logDensity` is `-Infinity` and the derivatives are `NaN`. The
 * bound methods clip their interval to the support (a part outside it makes
 * the lower value bound `-Infinity`).
 */
export interface FormulaTarget extends Target {
  /** The formula as written (for `builderTarget`, the canonical text). */
  readonly text: string;
  /** Canonical printed form: minimal parentheses, one space around binary operators; it parses to the same formula. */
  readonly canonical: string;
  /** The support `[lower, upper]`. */
  readonly support: readonly [number, number];
  /** Log-density at x (`-Infinity` outside the support). */
  logDensity(x: number): number;
  /** First derivative of the log-density at x, by forward-mode automatic differentiation (`NaN` outside the support). */
  dLogDensity(x: number): number;
  /** Second derivative of the log-density at x (`NaN` outside the support). */
  d2LogDensity(x: number): number;
  /** Guaranteed `[lo, hi]` with `lo <= logDensity(x) <= hi` for every x in `[lower, upper]` where the formula is defined. */
  logDensityBounds(lower: number, upper: number): readonly [number, number];
  /** Guaranteed bounds of {@link FormulaTarget.dLogDensity} over `[lower, upper]` ∩ support. */
  dLogDensityBounds(lower: number, upper: number): readonly [number, number];
  /** Guaranteed bounds of {@link FormulaTarget.d2LogDensity} over `[lower, upper]` ∩ support. */
  d2LogDensityBounds(lower: number, upper: number): readonly [number, number];
}

/** Options shared by {@link formulaTarget} and `builderTarget`. */
export interface FormulaTargetOptions {
  /** Support `[lower, upper]` (ends may be infinite); required. */
  support: readonly [number, number];
  /** Values of the named parameters used in the formula (finite numbers). */
  parameters?: Readonly<Record<string, number>>;
  /** Optional mode hint (a finite number inside the support). */
  mode?: number;
  /** Optional known local maxima (finite numbers inside the support). */
  modes?: readonly number[];
}

const KNOWN = ['support', 'parameters', 'mode', 'modes'] as const;
const NAME_RE = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** Validates the options (not the parameters' use in the formula). @internal */
export function checkFormulaOptions(api: string, options: FormulaTargetOptions | undefined): {
  support: [number, number];
  parameters: Record<string, number>;
} {
  if (options === undefined || options === null || typeof options !== 'object') {
    throw new InvalidTargetError(`${api}: options { support } are required, got ${options === null ? 'null' : typeof options}`);
  }
  checkOptionKeys(api, options, KNOWN);
  if (options.support === undefined) throw new InvalidTargetError(`${api}: support is required (use [-Infinity, Infinity] for the whole line)`);
  const support = checkSupport(api, 'support', options.support);
  const parameters: Record<string, number> = Object.create(null) as Record<string, number>;
  const given = options.parameters;
  if (given !== undefined) {
    if (given === null || typeof given !== 'object' || Array.isArray(given)) {
      throw new InvalidTargetError(`${api}: parameters must be an object of numbers, got ${given === null ? 'null' : typeof given}`);
    }
    for (const name of Object.keys(given)) {
      const v = (given as Record<string, unknown>)[name];
      if (!NAME_RE.test(name)) throw new InvalidTargetError(`${api}: parameter name '${name}' must be a letter or '_' followed by letters, digits or '_'`);
      if (name === 'x' || name === 'pi' || name === 'e') throw new InvalidTargetError(`${api}: parameter name '${name}' is reserved (x, pi and e are built in)`);
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        throw new InvalidTargetError(`${api}: parameter '${name}' must be a finite number, got ${typeof v === 'string' ? `'${v}'` : String(v)}`);
      }
      parameters[name] = v;
    }
  }
  const [lo, hi] = support;
  const inSupport = (m: unknown): boolean => typeof m === 'number' && Number.isFinite(m) && m >= lo && m <= hi;
  if (options.mode !== undefined && !inSupport(options.mode)) {
    throw new InvalidTargetError(`${api}: mode must be a finite number inside the support [${lo}, ${hi}], got ${String(options.mode)}`);
  }
  if (options.modes !== undefined) {
    if (!Array.isArray(options.modes)) throw new InvalidTargetError(`${api}: modes must be an array of numbers, got ${typeof options.modes}`);
    for (const m of options.modes as readonly unknown[]) {
      if (!inSupport(m)) throw new InvalidTargetError(`${api}: every entry of modes must be a finite number inside the support [${lo}, ${hi}], got ${typeof m === 'string' ? `'${m}'` : String(m)}`);
    }
  }
  return { support, parameters };
}

/** Builds the target from a checked tree. @internal */
export function makeFormulaTarget(
  api: string,
  tree: Node,
  text: string,
  options: FormulaTargetOptions,
  support: [number, number],
  parameters: Readonly<Record<string, number>>,
): FormulaTarget {
  // a log of a sum of exponentials is evaluated as a logsumexp (rewrite.ts): finite, and provable, in the tails
  const program = compile(logsOfSums(tree, parameters), parameters);
  const point = new PointEvaluator(program);
  const box = new IntervalEvaluator(program);
  const canonical = printNode(tree);
  const [slo, shi] = support;
  const res = 3 * program.result;
  const S = box.s;
  // cache of the last interval evaluation
  let cLo = NaN;
  let cHi = NaN;
  const evaluate = (method: string, lower: number, upper: number): boolean => {
    if (typeof lower !== 'number' || typeof upper !== 'number' || lower !== lower || upper !== upper || lower > upper) {
      throw new InvalidOptionError(
        `${api}(...).${method}: lower and upper must be numbers with lower <= upper, got [${String(lower)}, ${String(upper)}]`,
      );
    }
    const lo = lower < slo ? slo : lower;
    const hi = upper > shi ? shi : upper;
    if (lo > hi) return false;
    if (lo !== cLo || hi !== cHi) {
      cLo = NaN;
      box.run(lo, hi);
      cLo = lo;
      cHi = hi;
    }
    if (S[2 * res] !== S[2 * res]) {
      throw new InvalidTargetError(
        `${api}: formula '${text}' is undefined (NaN) at every x in [${lo}, ${hi}] (for example log or sqrt of a negative number)`,
      );
    }
    return true;
  };
  const pick = (slot: number): readonly [number, number] => {
    const l = S[2 * slot];
    const h = S[2 * slot + 1];
    if (l !== l) return [-Infinity, Infinity];
    return [l, h];
  };
  const target: FormulaTarget = {
    text,
    canonical,
    support: [slo, shi] as const,
    logDensity(x: number): number {
      if (x >= slo && x <= shi) return point.value(x);
      return x !== x ? NaN : -Infinity;
    },
    dLogDensity(x: number): number {
      if (x >= slo && x <= shi) return point.derivatives(x, false);
      return NaN;
    },
    d2LogDensity(x: number): number {
      if (x >= slo && x <= shi) {
        point.derivatives(x, true);
        return point.e[program.result];
      }
      return NaN;
    },
    logDensityBounds(lower: number, upper: number): readonly [number, number] {
      if (!evaluate('logDensityBounds', lower, upper)) return [-Infinity, -Infinity];
      const b = pick(res);
      if (lower < slo || upper > shi) return [-Infinity, b[1]];
      return b;
    },
    dLogDensityBounds(lower: number, upper: number): readonly [number, number] {
      if (!evaluate('dLogDensityBounds', lower, upper)) return [-Infinity, Infinity];
      return pick(res + 1);
    },
    d2LogDensityBounds(lower: number, upper: number): readonly [number, number] {
      if (!evaluate('d2LogDensityBounds', lower, upper)) return [-Infinity, Infinity];
      return pick(res + 2);
    },
  };
  if (options.mode !== undefined) (target as { mode?: number }).mode = options.mode;
  if (options.modes !== undefined) (target as { modes?: readonly number[] }).modes = options.modes.slice();
  return target;
}
