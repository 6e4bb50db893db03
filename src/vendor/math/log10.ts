/** Base-ten logarithm log10 x: `@stdlib/math-base-special-log10` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-log10';

/** Base-ten logarithm log10 x, the same bits on every engine. @internal */
export const log10: (x: number) => number = impl;
