/** tanh x: `@stdlib/math-base-special-tanh` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-tanh';

/** tanh x, the same bits on every engine. @internal */
export const tanh: (x: number) => number = impl;
