/** Beta(a, b) cdf at x. (`@stdlib/stats-base-dists-beta-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-beta-cdf/lib/main.js';

/** Beta(a, b) cdf at x. @internal */
export const betaCdf: (x: number, a: number, b: number) => number = impl;
