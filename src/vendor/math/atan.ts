/** arctan x: `@stdlib/math-base-special-atan` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-atan';

/** arctan x, the same bits on every engine. @internal */
export const atan: (x: number) => number = impl;
