/** ln(1 + x), accurate near 0: `@stdlib/math-base-special-log1p` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-log1p';

/** ln(1 + x), accurate near 0, the same bits on every engine. @internal */
export const log1p: (x: number) => number = impl;
