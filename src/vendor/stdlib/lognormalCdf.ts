/** Lognormal(mu, sigma) cdf at x. (`@stdlib/stats-base-dists-lognormal-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-lognormal-cdf/lib/main.js';

/** Lognormal(mu, sigma) cdf at x. @internal */
export const lognormalCdf: (x: number, mu: number, sigma: number) => number = impl;
