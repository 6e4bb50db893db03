/**
 * The `@stdlib` functions the library core uses. @internal
 *
 * @remarks
 * Each function lives in a module of its own under `src/vendor/stdlib/`
 * (one `@stdlib` package per module), re-exported here. The build
 * (scripts/build.mjs) makes each of those modules an output file of its own,
 * so that a bundler that imports a part of exactdraw takes only the
 * `@stdlib` code that part reaches (the packages are CommonJS, which
 * bundlers cannot tree-shake inside one file). To add a function: a new
 * module `src/vendor/stdlib/<name>.ts` in the style of the others, and one
 * `export { name } from './stdlib/<name>.js';` line here. The signatures
 * are declared in those modules so that no emitted declaration refers to a
 * `@stdlib` type; the licenses of the bundled packages are collected in
 * `dist/THIRD_PARTY_LICENSES.md`.
 *
 * @packageDocumentation
 */
export { betaln } from './stdlib/betaln.js';
export { gammaln } from './stdlib/gammaln.js';
export { betaCdf } from './stdlib/betaCdf.js';
export { gammaCdf } from './stdlib/gammaCdf.js';
export { logisticCdf } from './stdlib/logisticCdf.js';
export { normalCdf } from './stdlib/normalCdf.js';
export { tCdf } from './stdlib/tCdf.js';
export { mt19937Factory } from './stdlib/mt19937.js';
export type { StdlibMt19937, StdlibMt19937Options } from './stdlib/mt19937.js';
export { kstest } from './stdlib/kstest.js';
export type { StdlibKsResult } from './stdlib/kstest.js';
// Discrete families (src/targets/discrete/).
export { poissonLogpmf } from './stdlib/poissonLogpmf.js';
export { poissonCdf } from './stdlib/poissonCdf.js';
export { binomialLogpmf } from './stdlib/binomialLogpmf.js';
export { binomialCdf } from './stdlib/binomialCdf.js';
export { negativeBinomialLogpmf } from './stdlib/negativeBinomialLogpmf.js';
export { negativeBinomialCdf } from './stdlib/negativeBinomialCdf.js';
export { geometricLogpmf } from './stdlib/geometricLogpmf.js';
export { geometricCdf } from './stdlib/geometricCdf.js';
// Families added with issue 11 (exponential … Gumbel).
export { exponentialCdf } from './stdlib/exponentialCdf.js';
export { laplaceCdf } from './stdlib/laplaceCdf.js';
export { weibullCdf } from './stdlib/weibullCdf.js';
export { lognormalCdf } from './stdlib/lognormalCdf.js';
export { chisquareCdf } from './stdlib/chisquareCdf.js';
export { invgammaCdf } from './stdlib/invgammaCdf.js';
export { paretoType1Cdf } from './stdlib/paretoType1Cdf.js';
export { gumbelCdf } from './stdlib/gumbelCdf.js';
