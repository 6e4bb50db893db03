/** e^x − 1, accurate near 0: `@stdlib/math-base-special-expm1` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-expm1';

/** e^x − 1, accurate near 0, the same bits on every engine. @internal */
export const expm1: (x: number) => number = impl;
