/** Student-t(v) cdf at x. (`@stdlib/stats-base-dists-t-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-t-cdf/lib/main.js';

/** Student-t(v) cdf at x. @internal */
export const tCdf: (x: number, v: number) => number = impl;
