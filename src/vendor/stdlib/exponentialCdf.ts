/** Exponential(rate) cdf at x. (`@stdlib/stats-base-dists-exponential-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-exponential-cdf/lib/main.js';

/** Exponential(rate) cdf at x. @internal */
export const exponentialCdf: (x: number, rate: number) => number = impl;
