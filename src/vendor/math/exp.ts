/** e^x: `@stdlib/math-base-special-exp` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-exp';

/** e^x, the same bits on every engine. @internal */
export const exp: (x: number) => number = impl;
