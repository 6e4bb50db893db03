/** Poisson(λ) cdf at k. (`@stdlib/stats-base-dists-poisson-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-poisson-cdf/lib/main.js';

/** Poisson(λ) cdf at k. @internal */
export const poissonCdf: (k: number, lambda: number) => number = impl;
