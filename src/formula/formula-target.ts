/**
 * `formulaTarget`: a log-density written as ordinary infix mathematics.
 *
 * @packageDocumentation
 */
import { parseFormula } from './_internals/parser.js';
import { checkFormulaOptions, makeFormulaTarget, type FormulaTarget, type FormulaTargetOptions } from './_internals/make-target.js';
import { InvalidTargetError } from '../core/errors.js';

export type { FormulaTarget, FormulaTargetOptions };

/**
 * A target whose log-density is a formula in x: point values, exact first
 * and second derivatives (forward-mode automatic differentiation) and
 * guaranteed interval bounds of all three, from one definition, with no
 * `eval` or `Function`.
 *
 * @remarks
 * Grammar (see the README, section "Formulas"): `+ - * / ^`, unary minus,
 * parentheses, numbers such as `2`, `0.5`, `.5`, `1.5e-3`; the variable
 * `x`, the constants `pi` and `e`, named parameters; the functions `exp`,
 * `log`, `log1p`, `expm1`, `sqrt`, `abs`, `sin`, `cos`, `tan`, `atan`,
 * `tanh`, `sinh`, `cosh`, `lgamma`, `pow(a, b)`, `min(a, b, …)`,
 * `max(a, b, …)` and `logsumexp(a, b, …) = log(exp(a) + exp(b) + …)`,
 * which stays finite where the exponentials underflow (mixtures of narrow
 * components). A `log` of a sum whose terms are products or quotients of
 * `exp(…)` and positive constants (such as `log(0.7*exp(-x^2/2) +
 * 0.3*exp(-(x-6)^2/(2*s^2))/s)`) is compiled as the equivalent `logsumexp`
 * (values equal up to rounding), so that a mixture written either way stays
 * finite in its tails and {@link certifiedSampler} can prove that they
 * decay; a `log` of any other sum is evaluated as written, and where its
 * terms underflow on an infinite support the tails cannot be proven (an
 * {@link ImproperDensityError} naming the cell). `^` binds tighter than unary minus and is right-associative:
 * `-x^2` is `-(x^2)` and `2^3^2` is `2^9`. `lgamma` is defined for
 * arguments `>= 0` (`lgamma(0) = +Infinity`); a negative argument is NaN.
 *
 * The formula is parsed once and compiled into a flat instruction array
 * over typed-array registers, so evaluations allocate nothing. The bounds
 * are interval arithmetic with outward rounding (every basic operation
 * rounded outward, elementary functions widened by a relative 2^-40) and
 * exact extrema (sin, cos, cosh, lgamma, even powers, tan's poles). They
 * contain every value the point evaluation returns inside the interval,
 * except where the formula is NaN; an interval on which the formula is NaN
 * everywhere throws.
 *
 * @param text - the log-density, a formula in x (unnormalized)
 * @param options - `support` (required), `parameters`, `mode`, `modes`
 * @returns a {@link FormulaTarget}
 * @throws {@link InvalidTargetError} on a parse error, an unknown function or
 *   name, a wrong number of arguments, a parameter that is not a finite
 *   number, or a bad support; the message quotes the formula and points at
 *   the offending character with a caret
 * @example
 * ```ts
 * import { formulaTarget } from 'exactdraw';
 * // invented scenario: repair times, a mixture of a broad and a very narrow normal
 * const t = formulaTarget('logsumexp(log(0.7) - x^2/2, log(0.3) - log(s) - (x - 6)^2 / (2*s^2))', {
 *   support: [-Infinity, Infinity],
 *   parameters: { s: 0.001 },
 * });
 * t.dLogDensity(0.5);            // exact derivative
 * t.logDensityBounds(5.9, 6.1);  // guaranteed [lo, hi] of the log-density there
 * ```
 */
export function formulaTarget(text: string, options: FormulaTargetOptions): FormulaTarget {
  const api = 'formulaTarget';
  if (typeof text !== 'string') throw new InvalidTargetError(`${api}: text must be a string, got ${typeof text}`);
  const { support, parameters } = checkFormulaOptions(api, options);
  const tree = parseFormula(api, text, (name) => Object.prototype.hasOwnProperty.call(parameters, name));
  return makeFormulaTarget(api, tree, text, options, support, parameters);
}
