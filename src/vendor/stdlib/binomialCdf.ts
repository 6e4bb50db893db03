/** Binomial(n, p) cdf at k. (`@stdlib/stats-base-dists-binomial-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-binomial-cdf/lib/main.js';

/** Binomial(n, p) cdf at k. @internal */
export const binomialCdf: (k: number, n: number, p: number) => number = impl;
