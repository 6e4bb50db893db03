// esbuild plugins for the vendored @stdlib packages (used by scripts/build.mjs).
import { existsSync, readFileSync } from 'node:fs';

/**
 * The vendored @stdlib packages are CommonJS without a `sideEffects` field; declaring them
 * side-effect free lets esbuild drop a wrapper module whose export nothing uses.
 */
export const stdlibPure = {
  name: 'stdlib-pure',
  setup(b) {
    b.onResolve({ filter: /^@stdlib\// }, async (args) => {
      if (args.pluginData === 'stdlib-pure') return undefined;
      const r = await b.resolve(args.path, { kind: args.kind, resolveDir: args.resolveDir, importer: args.importer, pluginData: 'stdlib-pure' });
      return r.errors.length > 0 ? r : { ...r, sideEffects: false };
    });
  },
};

/**
 * Environment-support glue of the vendored @stdlib packages, replaced by the built-ins it
 * detects or wraps (every engine that runs ES2022 has them): typed-array constructors, the
 * feature checks for them, property definition and the message formatter of argument errors
 * (which the library never triggers: it validates before calling). Numerics are untouched.
 * The replaced packages are listed as such in dist/THIRD_PARTY_LICENSES.md.
 */
const TYPED = { float32: 'Float32Array', float64: 'Float64Array', int8: 'Int8Array', int16: 'Int16Array', int32: 'Int32Array', uint8: 'Uint8Array', uint8c: 'Uint8ClampedArray', uint16: 'Uint16Array', uint32: 'Uint32Array' };
const GLUE = {
  '@stdlib/string-format': "export default function format(s) { var a = arguments, i = 1; return String(s).replace(/%[a-z]/g, function () { return String(a[i++]); }); }",
  '@stdlib/utils-define-property': 'export default Object.defineProperty;',
  '@stdlib/utils-define-nonenumerable-read-only-property': 'export default function (o, p, v) { Object.defineProperty(o, p, { configurable: false, enumerable: false, writable: false, value: v }); }',
  '@stdlib/utils-native-class': 'export default function (v) { return Object.prototype.toString.call(v); }',
  '@stdlib/assert-has-symbol-support': 'export default function () { return true; }',
  '@stdlib/assert-has-tostringtag-support': 'export default function () { return true; }',
};
for (const [k, ctor] of Object.entries(TYPED)) {
  GLUE[`@stdlib/array-${k}`] = `export default ${ctor};`;
  GLUE[`@stdlib/assert-has-${k === 'uint8c' ? 'uint8clamped' : k}array-support`] = 'export default function () { return true; }';
}
/** Packages whose glue was replaced at least once (for the license file). */
export const replaced = new Set();
export const stdlibGlue = {
  name: 'stdlib-glue',
  setup(b) {
    b.onResolve({ filter: /^@stdlib\/[a-z0-9-]+$/ }, (args) => {
      if (!(args.path in GLUE)) return undefined;
      replaced.add(args.path);
      return { path: args.path, namespace: 'stdlib-glue', sideEffects: false };
    });
    b.onLoad({ filter: /.*/, namespace: 'stdlib-glue' }, (args) => ({ contents: GLUE[args.path], loader: 'js' }));
  },
};

/**
 * The vendored @stdlib packages are CommonJS, which a bundler wraps module by module and
 * cannot tree-shake. Their files are written in one regular style (top-level
 * `var x = require( 'p' )[.prop];` lines and one `module.exports = x;`), which this plugin
 * rewrites, line for line, to `import` / `export default`, so that the bundles hold them as
 * ES modules (no wrappers; unused modules dropped). A file in another style is left as it is;
 * since a CommonJS file requiring a rewritten one would get its namespace object, the
 * requires of such a file are given the default export.
 */
export function esmify(src) {
  let out = src.replace(/^var (\w+) = require\( ?('[^']+') ?\)(\.\w+)?;[ \t]*(\/\/.*)?$/gm, (m, name, spec, prop) =>
    prop ? `import ${name}$ns from ${spec};\nvar ${name} = ${name}$ns${prop};` : `import ${name} from ${spec};`,
  );
  out = out.replace(/^module\.exports = (\w+);[ \t]*(\/\/.*)?$/m, 'export default $1;');
  const code = out.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
  if (/\brequire\s*\(|\bmodule\.exports\b|\bexports\b/.test(code) || !/^export default/m.test(out)) return null;
  return out;
}
export const stdlibEsm = {
  name: 'stdlib-esm',
  setup(b) {
    b.onLoad({ filter: /node_modules[\\/]@stdlib[\\/].*\.js$/ }, (args) => {
      const src = readFileSync(args.path, 'utf8');
      const esm = esmify(src);
      if (esm !== null) return { contents: esm, loader: 'js' };
      const dflt = 'var __dflt = function (m) { return m && m.__esModule ? m.default : m; };\n';
      return { contents: dflt + src.replace(/\brequire\(\s*('[^']+')\s*\)/g, '__dflt(require($1))'), loader: 'js' };
    });
  },
};

/**
 * @stdlib packages that the bundled @stdlib functions import and that are given our own modules
 * instead, each the package's algorithm step for step (compared bit for bit with the package in
 * test/vendor/math.test.ts and test/vendor/exp.test.ts) and listed as replaced in
 * dist/THIRD_PARTY_LICENSES.md: `@stdlib/math-base-special-ldexp` (imported by exp, pow and the
 * argument reduction of sin/cos/tan) on one DataView, without the six word-helper packages it
 * needs; `@stdlib/math-base-special-exp` and `@stdlib/math-base-special-expm1` with their powers of
 * two from a table (so that a bundle holds one exp and one expm1, the fast ones).
 */
export const REPLACED = {
  '@stdlib/math-base-special-ldexp': new URL('../src/vendor/math/ldexp.ts', import.meta.url).pathname,
  '@stdlib/math-base-special-exp': new URL('../src/vendor/math/exp.ts', import.meta.url).pathname,
  '@stdlib/math-base-special-expm1': new URL('../src/vendor/math/expm1.ts', import.meta.url).pathname,
};
export const stdlibLdexp = {
  name: 'stdlib-ldexp',
  setup(b) {
    b.onResolve({ filter: /^@stdlib\/math-base-special-(ldexp|exp|expm1)$/ }, (args) => {
      const path = REPLACED[args.path];
      if (path === undefined) return undefined;
      replaced.add(args.path);
      return { path, sideEffects: false };
    });
  },
};

/**
 * @stdlib packages whose index attaches a property (`factory`) to the main function that no
 * bundled importer reads: their bare imports resolve to `lib/main.js`, so that bundles do not
 * take the attached function (for math-base-tools-evalpoly a code generator through the Function
 * constructor). An importer whose source reads the property keeps the index (checked per import).
 */
const MAIN_ONLY = { '@stdlib/math-base-tools-evalpoly': 'factory', '@stdlib/stats-base-dists-gamma-cdf': 'factory', '@stdlib/stats-base-dists-normal-cdf': 'factory' };
export const stdlibMainOnly = {
  name: 'stdlib-main-only',
  setup(b) {
    b.onResolve({ filter: /^@stdlib\/[a-z0-9-]+$/ }, async (args) => {
      const prop = MAIN_ONLY[args.path];
      if (prop === undefined || args.pluginData === 'stdlib-main-only') return undefined;
      const src = args.importer && existsSync(args.importer) ? readFileSync(args.importer, 'utf8') : '';
      const m = new RegExp(`(\\w+) = require\\( '${args.path}' \\)(\\.\\w+)?`).exec(src);
      if (m === null || m[2] !== undefined || new RegExp(`\\b${m[1]}\\.${prop}\\b`).test(src)) return undefined;
      const r = await b.resolve(`${args.path}/lib/main.js`, { kind: args.kind, resolveDir: args.resolveDir, importer: args.importer, pluginData: 'stdlib-main-only' });
      return r.errors.length > 0 ? undefined : { ...r, sideEffects: false };
    });
  },
};
