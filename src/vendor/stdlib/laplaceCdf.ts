/** Laplace(mu, b) cdf at x. (`@stdlib/stats-base-dists-laplace-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-laplace-cdf/lib/main.js';

/** Laplace(mu, b) cdf at x. @internal */
export const laplaceCdf: (x: number, mu: number, b: number) => number = impl;
