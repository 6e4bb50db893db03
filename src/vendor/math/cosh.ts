/** cosh x: `@stdlib/math-base-special-cosh` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-cosh';

/** cosh x, the same bits on every engine. @internal */
export const cosh: (x: number) => number = impl;
