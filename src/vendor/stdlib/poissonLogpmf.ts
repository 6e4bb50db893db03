/** Poisson(λ) log-pmf at k. (`@stdlib/stats-base-dists-poisson-logpmf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-poisson-logpmf/lib/main.js';

/** Poisson(λ) log-pmf at k. @internal */
export const poissonLogpmf: (k: number, lambda: number) => number = impl;
