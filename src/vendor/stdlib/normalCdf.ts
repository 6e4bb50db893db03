/** Normal(mu, sigma) cdf at x. (`@stdlib/stats-base-dists-normal-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-normal-cdf/lib/main.js';

/** Normal(mu, sigma) cdf at x. @internal */
export const normalCdf: (x: number, mu: number, sigma: number) => number = impl;
