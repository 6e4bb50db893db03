/** Pareto type I(shape alpha, scale beta) cdf at x. (`@stdlib/stats-base-dists-pareto-type1-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-pareto-type1-cdf/lib/main.js';

/** Pareto type I(shape alpha, scale beta) cdf at x. @internal */
export const paretoType1Cdf: (x: number, alpha: number, beta: number) => number = impl;
