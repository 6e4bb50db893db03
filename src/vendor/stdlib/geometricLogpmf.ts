/** Geometric(p) log-pmf at k (failures before the first success). (`@stdlib/stats-base-dists-geometric-logpmf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-geometric-logpmf/lib/main.js';

/** Geometric(p) log-pmf at k (failures before the first success). @internal */
export const geometricLogpmf: (k: number, p: number) => number = impl;
