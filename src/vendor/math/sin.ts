/** sin x: `@stdlib/math-base-special-sin` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-sin';

/** sin x, the same bits on every engine. @internal */
export const sin: (x: number) => number = impl;
