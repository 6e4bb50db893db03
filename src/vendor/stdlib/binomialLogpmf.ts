/** Binomial(n, p) log-pmf at k. (`@stdlib/stats-base-dists-binomial-logpmf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-binomial-logpmf';

/** Binomial(n, p) log-pmf at k. @internal */
export const binomialLogpmf: (k: number, n: number, p: number) => number = impl;
