/** Inverse-gamma(shape alpha, scale beta) cdf at x. (`@stdlib/stats-base-dists-invgamma-cdf`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/stats-base-dists-invgamma-cdf/lib/main.js';

/** Inverse-gamma(shape alpha, scale beta) cdf at x. @internal */
export const invgammaCdf: (x: number, alpha: number, beta: number) => number = impl;
