/** x^y: `@stdlib/math-base-special-pow` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-pow';

/** x^y, the same bits on every engine. @internal */
export const pow: (x: number, y: number) => number = impl;
