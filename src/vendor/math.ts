/**
 * The elementary functions the library evaluates, from deterministic
 * implementations: ports of FDLIBM / FreeBSD msun in pure JavaScript
 * (`@stdlib/math-base-special-*`) that use only IEEE 754 basic arithmetic
 * (+ − × ÷, and √ through `Math.sqrt`, which IEEE 754 requires to be
 * correctly rounded). So they return the same bits on every engine and in
 * every Node version, unlike `Math.exp`, `Math.log`, `Math.pow`, … whose
 * last bit the ECMAScript specification leaves to the engine. @internal
 *
 * @remarks
 * Every module of the core imports these instead of `Math.*`
 * (test/architecture/no-engine-math.test.ts enforces it;
 * scripts/deterministic-math.mjs rewrites `Math.exp(…)` and `a ** b`).
 * One module per function under `src/vendor/math/`, so a bundle takes only
 * those it uses.
 *
 * @packageDocumentation
 */
export { exp } from './math/exp.js';
export { log } from './math/log.js';
export { log1p } from './math/log1p.js';
export { log1pFast } from './math/log1p-fast.js';
export { expm1 } from './math/expm1.js';
export { pow } from './math/pow.js';
export { twoTo } from './math/two-to.js';
export { sin } from './math/sin.js';
export { cos } from './math/cos.js';
export { tan } from './math/tan.js';
export { atan } from './math/atan.js';
export { atan2 } from './math/atan2.js';
export { tanh } from './math/tanh.js';
export { sinh } from './math/sinh.js';
export { cosh } from './math/cosh.js';
export { asinh } from './math/asinh.js';
export { log10 } from './math/log10.js';
