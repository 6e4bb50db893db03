#!/usr/bin/env node
// Rewrites the library core to the deterministic elementary functions of src/vendor/math.ts:
//   Math.exp(…) → exp(…), Math.log → log, … (every function that module exports; calls and references), and
//   a ** b → pow(a, b) (operands: a number, a name, a member chain, or one parenthesised group),
// and adds or extends the `import { … } from '<relative>/vendor/math.js';` line of each file.
// A one-line top-level declaration whose initialiser calls those functions is marked pure
// (`const X = /* @__PURE__ */ (() => 1 - pow(2, -53))();`), so that bundlers can still drop the
// constant when unused (a call of an imported function is otherwise kept: it might have side effects).
// Scope: src/**/*.ts except src/cli/, src/node/ (Node-only tools) and src/vendor/ (the
// implementations). Idempotent: a second run changes nothing. Refuses (exit 1, no file written)
// a file that declares a name it would import, or a `**` it cannot rewrite.
//   node scripts/deterministic-math.mjs          rewrite in place, list the files changed
//   node scripts/deterministic-math.mjs --check  only report what would change (exit 1 if anything)
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, sep } from 'node:path';
import { segments } from './source-segments.mjs';

const ROOT = join(dirname(new URL(import.meta.url).pathname), '..');
const SRC = join(ROOT, 'src');
const MATH = join(SRC, 'vendor', 'math.ts');
const SKIP = [join(SRC, 'cli') + sep, join(SRC, 'node') + sep, join(SRC, 'vendor') + sep];

// the functions src/vendor/math.ts exports
const NAMES = [...readFileSync(MATH, 'utf8').matchAll(/^export \{ (\w+) \} from/gm)].map((m) => m[1]);
if (!NAMES.includes('pow')) throw new Error('src/vendor/math.ts must export pow');

function files(dir) {
  const out = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (SKIP.some((s) => (p + sep).startsWith(s))) continue;
    if (statSync(p).isDirectory()) out.push(...files(p));
    else if (p.endsWith('.ts') && !p.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

const OPERAND = String.raw`(?:\d+(?:\.\d+)?(?:e[+-]?\d+)?|[A-Za-z_$][\w$]*(?:\.[A-Za-z_$][\w$]*)*|\([^()]*\))`;
// not part of a longer operand on either side (f(x) ** 2, 2 ** a[i], 2 ** f(x) are left alone, then refused)
const POW_RE = new RegExp(String.raw`(?<![\w$.)\]])(${OPERAND})\s*\*\*\s*(-?${OPERAND})(?![\w$.(\[])`, 'g');
// calls and bare references (a table { exp: Math.exp } becomes { exp: exp })
const MATH_RE = new RegExp(String.raw`\bMath\.(${NAMES.join('|')})\b`, 'g');

function rewrite(file) {
  const src = readFileSync(file, 'utf8');
  const used = new Set();
  const problems = [];
  const body = segments(src)
    .map((s) => {
      if (!s.code) return s.text;
      let t = s.text.replace(MATH_RE, (m, name) => {
        used.add(name);
        return name;
      });
      t = t.replace(POW_RE, (m, a, b) => {
        used.add('pow');
        return `pow(${a}, ${b})`;
      });
      if (/\*\*/.test(t)) problems.push(`a ** the script cannot rewrite: ${t.trim().split('\n').find((l) => l.includes('**'))}`);
      return t;
    })
    .join('');
  // top-level declaration lines: mark initialisers that call the vendored functions as pure
  const importsMath = used.size > 0 || /from '[^']*vendor\/math\.js';/.test(src);
  let annotated = body;
  if (importsMath) {
    const call = new RegExp(String.raw`(?<![\w$.])(?:${NAMES.join('|')})\(`);
    const single = new RegExp(String.raw`^(?:${NAMES.join('|')})\([^;]*\)$`);
    annotated = body.replace(/^((?:export )?(?:const|let|var) [\w$]+(?:\s*:\s*[^=]+)?\s*=\s*)(.+);([ \t]*\/\/.*)?$/gm, (line, head, rhs, tail = '') => {
      const bare = rhs.replaceAll('/* @__PURE__ */ ', '');
      if (bare.startsWith('(() => ') || !call.test(bare)) return line;
      // a lone call is annotated; any other expression (1 - pow(2, -53)) is wrapped, since
      // bundlers keep an operator applied to a call (it might call valueOf)
      return `${head}/* @__PURE__ */ ${single.test(bare) ? bare : `(() => ${bare})()`};${tail}`;
    });
  }
  if (used.size === 0 && problems.length === 0) return annotated === src ? null : { out: annotated, used: new Set(['@__PURE__']) };
  const bodyAnnotated = annotated;
  // a name the file declares itself would be shadowed by (or shadow) the import
  for (const name of used) {
    const decl = new RegExp(
      [
        String.raw`\b(?:const|let|var|function|class)\s+${name}\b`, // const log = …
        String.raw`\b(?:const|let|var)\s*[{[][^}\]]*\b${name}\b[^}\]]*[}\]]\s*=`, // const { log } = …
        String.raw`\bfunction\s*[\w$]*\s*\([^)]*\b${name}\b[^)]*\)`, // function f(log) …
        String.raw`\(([^()]*[(,]\s*)?${name}\s*[:?,)=][^()]*\)\s*(?::\s*[^=>{]+)?=>`, // (a, log) => …
        String.raw`\b${name}\s*=>`, // log => …
      ].join('|'),
    );
    const code = segments(src).filter((s) => s.code).map((s) => s.text).join('');
    if (decl.test(code)) problems.push(`declares its own '${name}'`);
  }
  if (problems.length > 0) return { problems };
  let spec = relative(dirname(file), join(SRC, 'vendor', 'math.js')).split(sep).join('/');
  if (!spec.startsWith('.')) spec = './' + spec;
  const importRe = new RegExp(String.raw`^import \{ ([^}]*) \} from '${spec.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}';\n`, 'm');
  let out;
  const existing = importRe.exec(bodyAnnotated);
  if (existing) {
    const names = new Set(existing[1].split(',').map((s) => s.trim()).filter(Boolean));
    for (const n of used) names.add(n);
    out = bodyAnnotated.replace(importRe, `import { ${[...names].sort().join(', ')} } from '${spec}';\n`);
  } else {
    // after the last top-level import (imports are single-line or end with `from '…';`)
    const line = `import { ${[...used].sort().join(', ')} } from '${spec}';\n`;
    const re = /^import[\s\S]*?from '[^']+';\n|^import '[^']+';\n/gm;
    let last = -1;
    for (let m = re.exec(bodyAnnotated); m !== null; m = re.exec(bodyAnnotated)) last = m.index + m[0].length;
    if (last >= 0) out = bodyAnnotated.slice(0, last) + line + bodyAnnotated.slice(last);
    else {
      // after the leading doc comment, if any
      const doc = /^\/\*\*[\s\S]*?\*\/\n/.exec(bodyAnnotated);
      const at = doc ? doc[0].length : 0;
      out = bodyAnnotated.slice(0, at) + line + bodyAnnotated.slice(at);
    }
  }
  return out === src ? null : { out, used };
}

const check = process.argv.includes('--check');
const changes = [];
const refused = [];
for (const f of files(SRC)) {
  const r = rewrite(f);
  if (r === null) continue;
  if (r.problems) refused.push(`${relative(ROOT, f)}: ${r.problems.join('; ')}`);
  else changes.push([f, r]);
}
if (refused.length > 0) {
  console.error(`deterministic-math: refused (nothing written):\n  ${refused.join('\n  ')}`);
  process.exit(1);
}
for (const [f, r] of changes) {
  if (!check) writeFileSync(f, r.out);
  console.log(`${check ? 'would rewrite' : 'rewrote'} ${relative(ROOT, f)} (${[...r.used].sort().join(', ')})`);
}
console.log(`deterministic-math: ${changes.length} file(s) ${check ? 'to change' : 'changed'}`);
if (check && changes.length > 0) process.exit(1);
