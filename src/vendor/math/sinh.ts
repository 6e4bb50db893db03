/** sinh x: `@stdlib/math-base-special-sinh` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-sinh';

/** sinh x, the same bits on every engine. @internal */
export const sinh: (x: number) => number = impl;
