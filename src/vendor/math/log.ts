/** Natural logarithm ln x: `@stdlib/math-base-special-ln` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-ln';

/** Natural logarithm ln x, the same bits on every engine. @internal */
export const log: (x: number) => number = impl;
