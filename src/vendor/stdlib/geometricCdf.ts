/** Geometric(p) cdf at k. (`@stdlib/stats-base-dists-geometric-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-geometric-cdf/lib/main.js';

/** Geometric(p) cdf at k. @internal */
export const geometricCdf: (k: number, p: number) => number = impl;
