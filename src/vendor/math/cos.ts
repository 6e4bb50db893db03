/** cos x: `@stdlib/math-base-special-cos` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-cos';

/** cos x, the same bits on every engine. @internal */
export const cos: (x: number) => number = impl;
