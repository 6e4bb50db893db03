/** Gumbel(mu, beta) cdf at x. (`@stdlib/stats-base-dists-gumbel-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-gumbel-cdf/lib/main.js';

/** Gumbel(mu, beta) cdf at x. @internal */
export const gumbelCdf: (x: number, mu: number, beta: number) => number = impl;
