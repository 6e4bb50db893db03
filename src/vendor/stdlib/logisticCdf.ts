/** Logistic(mu, s) cdf at x. (`@stdlib/stats-base-dists-logistic-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-logistic-cdf/lib/main.js';

/** Logistic(mu, s) cdf at x. @internal */
export const logisticCdf: (x: number, mu: number, s: number) => number = impl;
