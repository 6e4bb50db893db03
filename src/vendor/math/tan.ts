/** tan x: `@stdlib/math-base-special-tan` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-tan';

/** tan x, the same bits on every engine. @internal */
export const tan: (x: number) => number = impl;
