/**
 * The library core evaluates no engine-dependent elementary function: the
 * ECMAScript specification leaves the last bit of Math.exp, Math.log,
 * Math.pow, Math.sin, … to the engine (they differ between V8 versions and
 * between V8 and SpiderMonkey), and `a ** b` is Math.pow. The core uses
 * src/vendor/math.ts instead (scripts/deterministic-math.mjs rewrites a call
 * that slipped in). Scope: src/ except src/cli/ and src/node/ (Node-only tools)
 * and src/vendor/math/ (the implementations, which use none either).
 *
 * Allowed, because IEEE 754 or the specification fixes their result exactly:
 * Math.sqrt (correctly rounded), Math.abs, Math.floor, Math.ceil, Math.round,
 * Math.trunc, Math.sign, Math.min, Math.max, Math.fround, Math.imul, Math.clz32,
 * and the constants (Math.PI, Math.E, Math.LN2, …).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { segments } from '../../scripts/source-segments.mjs';

const SRC = join(process.cwd(), 'src');
const EXCLUDED = [join(SRC, 'cli') + sep, join(SRC, 'node') + sep];
const FORBIDDEN = ['exp', 'log', 'log1p', 'log2', 'log10', 'expm1', 'pow', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan', 'atan2', 'sinh', 'cosh', 'tanh', 'asinh', 'acosh', 'atanh', 'cbrt', 'hypot'];

function files(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (EXCLUDED.some((e) => (p + sep).startsWith(e))) continue;
    if (statSync(p).isDirectory()) out.push(...files(p));
    else if (p.endsWith('.ts')) out.push(p);
  }
  return out;
}

/**
 * Source with comments, string literals, template-literal text and regular-expression literals
 * each replaced by `""` (newlines kept), code untouched: the splitter the rewrite script uses
 * (scripts/source-segments.mjs), so the scan and the rewrite agree on what is code. The twin
 * below checks the splitter on every form that once hid a call.
 */
function codeOnly(src: string): string {
  let out = '';
  for (const s of segments(src)) out += s.code ? s.text : `""${s.text.replace(/[^\n]/g, '')}`;
  return out;
}

/** Engine-dependent math in a piece of source: `Math.name` uses and `**`. */
export function engineMath(src: string): string[] {
  const code = codeOnly(src);
  const found: string[] = [];
  for (const m of code.matchAll(/\bMath\s*(?:\.\s*(\w+)|\[\s*""\s*\])/g)) {
    if (m[1] === undefined) found.push('Math[…]');
    else if (FORBIDDEN.includes(m[1])) found.push(`Math.${m[1]}`);
  }
  for (const line of code.split('\n')) if (/\*\*/.test(line)) found.push(`** in: ${line.trim()}`);
  // a destructured or aliased Math (const { exp } = Math; const M = Math)
  if (/=\s*Math\s*[;,\n)]/.test(code)) found.push('Math aliased');
  return found;
}

describe('no engine-dependent math in the library core', () => {
  it('no file of src/ (except src/cli, src/node) calls Math.exp/log/pow/sin/… or uses **', () => {
    const found: string[] = [];
    const all = files(SRC);
    for (const f of all) for (const hit of engineMath(readFileSync(f, 'utf8'))) found.push(`${relative(process.cwd(), f)}: ${hit}`);
    expect(all.length).toBeGreaterThan(40); // the walk saw the core
    expect(found).toEqual([]);
  });

  it('twin: the scan finds each forbidden form and ignores comments, strings and the allowed functions', () => {
    const sample = [
      'const a = Math.exp(x) + Math.sqrt(y) + Math.abs(z);',
      'const b = 2 ** k;',
      'const c = Math.pow(2, 3); // Math.log in a comment',
      "const d = 'Math.sin in a string' + `${Math.tanh(x)} and Math.cos as text`;",
      "const f = `a ${g ? `b ${Math.log10(y)} Math.acos` : ''} c ${Math.sinh(z)}`;",
      "const r = s.replace(/\"/g, '&quot;') + Math.cosh(x) / 2;",
      '/** x ** y in a doc comment */',
      'const { log1p } = Math;',
      'const e = Math["atan"](x);',
    ].join('\n');
    expect(engineMath(sample)).toEqual(['Math.exp', 'Math.pow', 'Math.tanh', 'Math.log10', 'Math.sinh', 'Math.cosh', 'Math[…]', '** in: const b = 2 ** k;', 'Math aliased']);
  });
});
