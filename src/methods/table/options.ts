/**
 * The options of the table fast path, shared by its entrances
 * (`tableSampler`, `adaptiveRejectionSampler({ fast: true })`,
 * `piecewiseSampler({ fast: true })`): defaults, limits and the resolver.
 * @internal
 *
 * @packageDocumentation
 */
import { InvalidOptionError } from '../../core/errors.js';
import { checkInteger, showValue } from '../../core/validate.js';

/**
 * Default of {@link TableSamplerOptions.strips}.
 *
 * @remarks
 * With n strips (three quarters placed at equal mass of √f), the caps — the
 * part of the table that needs a second uniform — take about 7/n of the
 * area of a standard normal: 1.4 % at 500 strips; the target is evaluated at
 * a far smaller fraction of draws (about 8e-5 per draw for the normal, 8e-4
 * for gamma(2.5); see the fast-path count tests), since the caps have their
 * own chord squeeze and upper lines. 500 strips give at most 1,002 regions,
 * so the alias table has 1,024 cells of 40 bytes (40 KB). More strips lower
 * the cap share (1,000: 0.7 %) but cost about one logDensity call each at
 * setup (timings: CHANGELOG.md, "Measurements").
 *
 * @example
 * ```ts
 * tableSampler(normalTarget(0, 1), { strips: 2 * DEFAULT_TABLE_STRIPS });
 * ```
 */
export const DEFAULT_TABLE_STRIPS = 500;

/**
 * Largest accepted {@link TableSamplerOptions.strips}.
 *
 * @example
 * ```ts
 * MAX_TABLE_STRIPS; // 1048576
 * ```
 */
export const MAX_TABLE_STRIPS = 1 << 20;

/**
 * Default of {@link TableSamplerOptions.tailMass}: the body of the table
 * covers the target's mass but about 1e-6 on each side (estimated from a
 * coarse look at the target); draws beyond it come from the exact tails,
 * which evaluate the target.
 *
 * @example
 * ```ts
 * tableSampler(normalTarget(0, 1), { tailMass: DEFAULT_TABLE_TAIL_MASS / 10 });
 * ```
 */
export const DEFAULT_TABLE_TAIL_MASS = 1e-6;

/** The table options with their defaults applied and validated. @internal */
export interface ResolvedTableOptions {
  readonly strips: number;
  readonly tailMass: number;
}

/** Resolves `strips` and `tailMass` once (defaults, then validation). @internal */
export function resolveTableOptions(api: string, options: { readonly strips?: unknown; readonly tailMass?: unknown } | undefined): ResolvedTableOptions {
  const strips = options?.strips === undefined ? DEFAULT_TABLE_STRIPS : checkInteger(api, 'options.strips', options.strips, 2, MAX_TABLE_STRIPS);
  const tailMass = options?.tailMass ?? DEFAULT_TABLE_TAIL_MASS;
  if (typeof tailMass !== 'number' || !(tailMass > 0 && tailMass <= 0.01)) {
    throw new InvalidOptionError(`${api}: options.tailMass must be a number in (0, 0.01], got ${showValue(tailMass)}`);
  }
  return { strips, tailMass };
}
