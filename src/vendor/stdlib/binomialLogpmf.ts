/** Binomial(n, p) log-pmf at k. (`@stdlib/stats-base-dists-binomial-logpmf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-binomial-logpmf/lib/main.js';

/** Binomial(n, p) log-pmf at k. @internal */
export const binomialLogpmf: (k: number, n: number, p: number) => number = impl;
