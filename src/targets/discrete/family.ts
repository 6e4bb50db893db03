/**
 * Type of the ready-made discrete targets.
 *
 * @packageDocumentation
 */
import type { DiscreteTarget } from '../../core/types.js';

/**
 * A {@link DiscreteTarget} built by one of the ready-made discrete factories
 * ({@link poissonTarget}, {@link binomialTarget},
 * {@link negativeBinomialTarget}, {@link geometricTarget}): normalized
 * logPmf, support, mode and cdf are all present, with the shape promises
 * `logConcave` and `normalized`.
 *
 * @example
 * ```ts
 * import { poissonTarget } from 'exactdraw';
 * const t = poissonTarget(2.5);
 * Math.exp(t.logPmf(2)); // 0.2565...
 * t.mode; // 2
 * ```
 */
export interface DiscreteFamilyTarget extends DiscreteTarget {
  /** Normalized log-pmf; `-Infinity` at integers outside the support. */
  logPmf(k: number): number;
  /** Support `[lower, upper]` (upper may be Infinity). */
  readonly support: readonly [number, number];
  /** A mode of the pmf. */
  readonly mode: number;
  /** Whether the pmf is log-concave (all four families are, the negative binomial for r ≥ 1). */
  readonly logConcave: boolean;
  /** Always true: logPmf is normalized. */
  readonly normalized: true;
  /** Normalized cdf P(X ≤ k) (from `@stdlib`; see each factory for its accuracy). */
  cdf(k: number): number;
}
