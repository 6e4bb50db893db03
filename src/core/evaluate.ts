/**
 * The one check of a log-density value, and the counted evaluator built on
 * it. Every method, the bound search and the scan evaluate the target
 * through these. @internal
 *
 * @packageDocumentation
 */
import { NonFiniteDensityError, ShapeViolationError } from './errors.js';

/**
 * Returns `v` when it is a valid value of a log-density (a number that is not
 * NaN and not +Infinity; −Infinity means density 0) and throws
 * {@link NonFiniteDensityError} otherwise, also for a value that is not a
 * number at all (`undefined` from a function that forgot to return, a
 * string, …). @internal
 */
export function checkLogDensity(api: string, x: number, v: unknown): number {
  if (typeof v !== 'number' || v !== v || v === Infinity) throw new NonFiniteDensityError(api, x, v as number);
  return v;
}

/**
 * Counted, checked access to the target: every call of `logDensity` (and of
 * `dLogDensity`) made through it is counted and checked, and the number of
 * `logDensity` calls is bounded by `budget`, so that the counts are exact
 * and every setup loop is bounded. @internal
 */
export class Evaluator {
  /** Calls of logDensity so far. */
  evaluations = 0;
  /** Calls of dLogDensity so far. */
  derivativeEvaluations = 0;

  /**
   * @param api - API name for messages
   * @param logf - the log-density
   * @param dlogf - its derivative, or undefined (secant construction)
   * @param budget - maximal number of logDensity calls
   */
  constructor(
    readonly api: string,
    readonly logf: (x: number) => number,
    readonly dlogf: ((x: number) => number) | undefined,
    readonly budget: number,
  ) {}

  /** logDensity(x), counted and checked ({@link checkLogDensity}); throws {@link ShapeViolationError} past the budget. */
  logDensity(x: number): number {
    if (++this.evaluations > this.budget) {
      throw new ShapeViolationError(
        `${this.api}: setup used ${this.budget} evaluations of logDensity without reaching a valid envelope; the target's shape could not be classified (a derivative inconsistent with logDensity, or a density with features at every scale?)`,
      );
    }
    return checkLogDensity(this.api, x, this.logf(x));
  }

  /**
   * dLogDensity(x) at a point where logDensity is `l`; NaN when there is no
   * derivative, when l is -Infinity, or when the derivative is ±Infinity
   * (no usable tangent there). A derivative that is NaN or not a number at a
   * point of positive density throws {@link NonFiniteDensityError}.
   */
  derivative(x: number, l: number): number {
    const d = this.dlogf;
    if (d === undefined || l === -Infinity) return NaN;
    this.derivativeEvaluations++;
    const v = d(x);
    if (typeof v !== 'number' || v !== v) throw new NonFiniteDensityError(`${this.api} (dLogDensity)`, x, v as number);
    return v === Infinity || v === -Infinity ? NaN : v;
  }
}
