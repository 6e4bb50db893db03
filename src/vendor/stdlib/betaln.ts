/** ln B(a, b). (`@stdlib/math-base-special-betaln`, bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-betaln';

/** ln B(a, b). @internal */
export const betaln: (a: number, b: number) => number = impl;
