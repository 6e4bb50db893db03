/** Negative binomial(r, p) log-pmf at k (failures before the r-th success, success probability p). (`@stdlib/stats-base-dists-negative-binomial-logpmf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-negative-binomial-logpmf/lib/main.js';

/** Negative binomial(r, p) log-pmf at k (failures before the r-th success, success probability p). @internal */
export const negativeBinomialLogpmf: (k: number, r: number, p: number) => number = impl;
