/** ln Γ(x). (`@stdlib/math-base-special-gammaln`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-gammaln';

/** ln Γ(x). @internal */
export const gammaln: (x: number) => number = impl;
