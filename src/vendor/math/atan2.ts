/** atan2(y, x) (the angle of the point (x, y); first argument y): `@stdlib/math-base-special-atan2` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-atan2';

/** atan2(y, x) (the angle of the point (x, y); first argument y), the same bits on every engine. @internal */
export const atan2: (x: number, y: number) => number = impl;
