/** Negative binomial(r, p) cdf at k. (`@stdlib/stats-base-dists-negative-binomial-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-negative-binomial-cdf/lib/main.js';

/** Negative binomial(r, p) cdf at k. @internal */
export const negativeBinomialCdf: (k: number, r: number, p: number) => number = impl;
