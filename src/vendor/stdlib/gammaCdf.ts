/** Gamma(shape, rate) cdf at x. (`@stdlib/stats-base-dists-gamma-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-gamma-cdf/lib/main.js';

/** Gamma(shape, rate) cdf at x. @internal */
export const gammaCdf: (x: number, shape: number, rate: number) => number = impl;
