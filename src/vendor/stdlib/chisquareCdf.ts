/** Chi-square(k) cdf at x. (`@stdlib/stats-base-dists-chisquare-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-chisquare-cdf';

/** Chi-square(k) cdf at x. @internal */
export const chisquareCdf: (x: number, k: number) => number = impl;
