/** Chi-square(k) cdf at x. (`@stdlib/stats-base-dists-chisquare-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-chisquare-cdf/lib/main.js';

/** Chi-square(k) cdf at x. @internal */
export const chisquareCdf: (x: number, k: number) => number = impl;
