// The JavaScript/TypeScript source splitter shared by scripts/deterministic-math.mjs (which
// rewrites only code) and test/architecture/no-engine-math.test.ts (which scans only code):
// comments, string literals, template-literal text and regular-expression literals are non-code.

/** True when a `/` at `i` starts a regular-expression literal (an operand is expected there). */
function regexAllowed(src, i) {
  let j = i - 1;
  while (j >= 0 && /\s/.test(src[j])) j--;
  if (j < 0) return true;
  if ('(,=:[!&|?{};~^%*+-<>'.includes(src[j])) return true;
  const word = /(?:^|[^\w$])(return|typeof|case|void|in|of)$/.exec(src.slice(Math.max(0, j - 7), j + 1));
  return word !== null;
}

/** Index just after the regular-expression literal that starts at `i` (flags included). */
function regexEnd(src, i) {
  let k = i + 1;
  let cls = false;
  while (k < src.length && src[k] !== '\n') {
    const c = src[k];
    if (c === '\\') k += 2;
    else if (cls) {
      if (c === ']') cls = false;
      k++;
    } else if (c === '[') {
      cls = true;
      k++;
    } else if (c === '/') break;
    else k++;
  }
  k++;
  while (k < src.length && /[a-z]/.test(src[k])) k++;
  return k;
}

/**
 * Splits source into code and non-code (comments, strings, template literal text) segments.
 * Template literals nest: a `${…}` part is code again and may hold strings, comments and
 * templates of its own (a stack of open templates and the brace depth inside each `${`).
 * A `/` starts a regular-expression literal (non-code, so that a quote in it opens no string)
 * where an operand is expected: after an operator or punctuator other than `)` and `]`, at the
 * start, or after `return`/`typeof`.
 */
export function segments(src) {
  const out = [];
  let i = 0;
  let start = 0;
  const push = (end, code) => {
    if (end > start) out.push({ text: src.slice(start, end), code });
    start = end;
  };
  const depth = []; // brace depth of each open `${…}`, innermost last
  let inTemplate = false;
  while (i < src.length) {
    const c = src[i];
    const d = src[i + 1];
    if (!inTemplate && c === '/' && d !== '/' && d !== '*' && regexAllowed(src, i)) {
      push(i, true);
      i = regexEnd(src, i);
      push(i, false);
    } else if (inTemplate) {
      if (c === '\\') i += 2;
      else if (c === '`') {
        i++;
        push(i, false);
        inTemplate = false;
      } else if (c === '$' && d === '{') {
        i += 2;
        push(i, false);
        depth.push(0);
        inTemplate = false;
      } else i++;
    } else if (c === '/' && d === '/') {
      push(i, true);
      const e = src.indexOf('\n', i);
      i = e < 0 ? src.length : e;
      push(i, false);
    } else if (c === '/' && d === '*') {
      push(i, true);
      const e = src.indexOf('*/', i + 2);
      i = e < 0 ? src.length : e + 2;
      push(i, false);
    } else if (c === "'" || c === '"') {
      push(i, true);
      i++;
      while (i < src.length && src[i] !== c) i += src[i] === '\\' ? 2 : 1;
      i++;
      push(i, false);
    } else if (c === '`') {
      push(i, true);
      i++;
      inTemplate = true;
    } else if (c === '{' && depth.length > 0) {
      depth[depth.length - 1]++;
      i++;
    } else if (c === '}' && depth.length > 0) {
      if (depth[depth.length - 1] === 0) {
        // end of a `${…}`: back in the enclosing template's text
        depth.pop();
        push(i, true);
        i++;
        inTemplate = true;
      } else {
        depth[depth.length - 1]--;
        i++;
      }
    } else i++;
  }
  push(src.length, !inTemplate);
  return out;
}
