/** asinh x (inverse hyperbolic sine): `@stdlib/math-base-special-asinh` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-asinh';

/** asinh x (inverse hyperbolic sine), the same bits on every engine. @internal */
export const asinh: (x: number) => number = impl;
