/** Weibull(shape k, scale lambda) cdf at x. (`@stdlib/stats-base-dists-weibull-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-weibull-cdf/lib/main.js';

/** Weibull(shape k, scale lambda) cdf at x. @internal */
export const weibullCdf: (x: number, k: number, lambda: number) => number = impl;
