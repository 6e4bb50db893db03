/**
 * The ESM build for bundlers and browsers (dist/index.js) holds the vendored
 * @stdlib code rewritten from CommonJS to ES modules by the build
 * (scripts/esbuild-stdlib.mjs). Its functions must be those of the packages
 * as Node loads them from node_modules: checked here value for value on the
 * targets' cdfs and densities (which call every vendored function) and on draws.
 */
import { describe, expect, it } from 'vitest';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import * as src from '../../src/index.js';
import { esmify } from '../../scripts/esbuild-stdlib.mjs';

type Lib = typeof src;

/** cdf and log-density values of every built-in target at 200 points, and 300 draws of three samplers. */
function fingerprint(m: Lib): number[] {
  const targets = [m.normalTarget(0.5, 2), m.gammaTarget(2.5, 1.5), m.gammaTarget(0.3, 1), m.betaTarget(2, 5), m.betaTarget(0.5, 0.7), m.studentTTarget(3), m.logisticTarget(1, 2)];
  const out: number[] = [];
  for (const t of targets) {
    for (let i = 0; i < 200; i++) {
      const x = t.support[0] === 0 && t.support[1] === 1 ? (i + 0.5) / 200 : -8 + i * 0.09;
      out.push((t.cdf as (x: number) => number)(x), t.logDensity(x));
    }
  }
  out.push(...m.tableSampler(m.normalTarget(0, 1), { seed: 3 }).fill(new Float64Array(100)));
  out.push(...m.adaptiveRejectionSampler(m.gammaTarget(3, 1), { seed: 3 }).fill(new Float64Array(100)));
  const s = new Float64Array(400);
  for (let i = 0; i < 400; i++) s[i] = m.substream(7, 1)() - 0.5;
  out.push(m.ksCheck(s, (x) => Math.min(1, Math.max(0, x + 0.5))).pValue);
  return out;
}

describe('ESM build (dist/index.js)', () => {
  it('the rewritten @stdlib code gives the values of the packages in node_modules, bit for bit (2,800 cdf and density values, 200 draws, a KS p-value)', async () => {
    const dist = (await import(pathToFileURL(resolve('dist/index.js')).href)) as Lib;
    const a = fingerprint(dist);
    const b = fingerprint(src);
    expect(a.length).toBe(b.length);
    expect(a.filter((v, i) => !Object.is(v, b[i])).length).toBe(0);
  });

  it('esmify rewrites the regular CommonJS style and refuses any other (twin: a file it cannot rewrite stays CommonJS)', () => {
    const regular = "'use strict';\nvar a = require( './a.js' );\nvar b = require( '@stdlib/b' ).isPrimitive;\nfunction f( x ) { return a( x ) + b( x ); }\nmodule.exports = f;\n";
    expect(esmify(regular)).toBe("'use strict';\nimport a from './a.js';\nimport b$ns from '@stdlib/b';\nvar b = b$ns.isPrimitive;\nfunction f( x ) { return a( x ) + b( x ); }\nexport default f;\n");
    expect(esmify("var a = require( './a.js' );\nfunction f() { return require( './late.js' ); }\nmodule.exports = f;\n")).toBeNull();
    expect(esmify("var a = require( './a.js' );\nexports.f = a;\n")).toBeNull();
  });
});
