/**
 * Recursive-descent parser of the formula grammar (see README, "Formulas").
 * @internal
 *
 * @remarks
 * ```
 * sum     := product (('+' | '-') product)*
 * product := unary (('*' | '/') unary)*
 * unary   := ('-' | '+') unary | power
 * power   := primary ('^' unary)?          right-associative, binds tighter than unary minus
 * primary := number | name | name '(' sum (',' sum)* ')' | '(' sum ')'
 * number  := digits ['.' digits] [('e' | 'E') ['+' | '-'] digits]  |  '.' digits [...]
 * name    := letter (letter | digit | '_')*
 * ```
 * So `-x^2` is `-(x^2)`, `2^3^2` is `2^(3^2)`, `2^-x` is `2^(-x)` and
 * `a - b - c` is `(a - b) - c`. Whitespace is ignored between tokens.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { CONSTANTS, FUNCTIONS, isFunctionName, type Node } from './ast.js';

/** Maximum nesting depth (keeps the recursion bounded). @internal */
export const MAX_DEPTH = 200;
/** Maximum formula length in characters. @internal */
export const MAX_LENGTH = 100000;

/** A formula error with a caret excerpt pointing at character `pos`. @internal */
export function formulaError(api: string, text: string, pos: number, what: string): InvalidTargetError {
  const p = Math.max(0, Math.min(pos, text.length));
  // excerpt of at most 60 characters around pos, on one line
  const start = Math.max(0, p - 30);
  const end = Math.min(text.length, p + 30);
  const excerpt = text.slice(start, end).replace(/[\r\n\t]/g, ' ');
  const caret = ' '.repeat(p - start) + '^';
  return new InvalidTargetError(
    `${api}: ${what} at position ${p + 1} of formula '${text.length > 200 ? text.slice(0, 200) + '…' : text}'\n  ${start > 0 ? '…' : ''}${excerpt}${end < text.length ? '…' : ''}\n  ${start > 0 ? ' ' : ''}${caret}`,
  );
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}
function isLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 95;
}

/** Parses `text`; parameters are checked against `isParameter`. @internal */
export function parseFormula(api: string, text: string, isParameter: (name: string) => boolean): Node {
  if (text.length > MAX_LENGTH) throw new InvalidTargetError(`${api}: formula is longer than ${MAX_LENGTH} characters (${text.length})`);
  let i = 0;
  let depth = 0;
  const n = text.length;

  const fail = (pos: number, what: string): never => {
    throw formulaError(api, text, pos, what);
  };
  const skip = (): void => {
    while (i < n) {
      const c = text.charCodeAt(i);
      if (c === 32 || c === 9 || c === 10 || c === 13) i++;
      else break;
    }
  };
  const describe = (pos: number): string => (pos >= n ? 'end of formula' : `'${text[pos]}'`);
  const enter = (): void => {
    if (++depth > MAX_DEPTH) fail(i, `nesting deeper than ${MAX_DEPTH}`);
  };

  const parseNumber = (): Node => {
    const start = i;
    while (i < n && isDigit(text.charCodeAt(i))) i++;
    if (i < n && text[i] === '.') {
      i++;
      const fracStart = i;
      while (i < n && isDigit(text.charCodeAt(i))) i++;
      if (i === fracStart && i - 1 === start) fail(start, "a number needs a digit before or after '.'");
    }
    if (i < n && (text[i] === 'e' || text[i] === 'E')) {
      const save = i;
      i++;
      if (i < n && (text[i] === '+' || text[i] === '-')) i++;
      const expStart = i;
      while (i < n && isDigit(text.charCodeAt(i))) i++;
      if (i === expStart) {
        // "2e" followed by a name is an error (no implicit multiplication)
        i = save;
        fail(save, 'exponent of a number needs digits');
      }
    }
    if (i < n && (isLetter(text.charCodeAt(i)) || text[i] === '.')) {
      fail(i, `unexpected ${describe(i)} after the number '${text.slice(start, i)}' (write '*' for multiplication)`);
    }
    const value = Number(text.slice(start, i));
    if (!Number.isFinite(value)) fail(start, `number '${text.slice(start, i)}' is not finite as a double`);
    return { kind: 'num', value, pos: start };
  };

  const parsePrimary = (): Node => {
    skip();
    if (i >= n) return fail(i, 'expected a number, a name or \'(\' but found end of formula');
    const c = text.charCodeAt(i);
    if (isDigit(c) || (text[i] === '.' && i + 1 < n && isDigit(text.charCodeAt(i + 1)))) return parseNumber();
    if (text[i] === '(') {
      const open = i;
      i++;
      const inner = parseSum();
      skip();
      if (i >= n || text[i] !== ')') fail(i >= n ? open : i, i >= n ? "unclosed '('" : `expected ')' but found ${describe(i)}`);
      i++;
      return inner;
    }
    if (isLetter(c)) {
      const start = i;
      while (i < n && (isLetter(text.charCodeAt(i)) || isDigit(text.charCodeAt(i)))) i++;
      const name = text.slice(start, i);
      skip();
      if (i < n && text[i] === '(') {
        if (!isFunctionName(name)) return fail(start, `unknown function '${name}'`);
        i++;
        const args: Node[] = [];
        skip();
        if (i < n && text[i] === ')') i++;
        else {
          for (;;) {
            args.push(parseSum());
            skip();
            if (i < n && text[i] === ',') {
              i++;
              continue;
            }
            if (i < n && text[i] === ')') {
              i++;
              break;
            }
            fail(i, `expected ',' or ')' in the arguments of '${name}' but found ${describe(i)}`);
          }
        }
        const [lo, hi] = FUNCTIONS[name];
        if (args.length < lo || args.length > hi) {
          const want = lo === hi ? `${lo}` : hi >= 64 ? `at least ${lo}` : `${lo} to ${hi}`;
          fail(start, `function '${name}' takes ${want} argument${lo === 1 && hi === 1 ? '' : 's'}, got ${args.length}`);
        }
        return { kind: 'call', name, args, pos: start };
      }
      if (name === 'x') return { kind: 'x', pos: start };
      if (name === 'pi' || name === 'e') return { kind: 'const', name, pos: start };
      if (isFunctionName(name)) return fail(start, `function '${name}' needs arguments in parentheses`);
      if (!isParameter(name)) return fail(start, `unknown name '${name}' (not x, pi, e or a parameter)`);
      return { kind: 'param', name, pos: start };
    }
    return fail(i, `unexpected ${describe(i)}`);
  };

  const parsePower = (): Node => {
    const base = parsePrimary();
    skip();
    if (i < n && text[i] === '^') {
      const pos = i;
      i++;
      enter();
      const exponent = parseUnary();
      depth--;
      return { kind: 'bin', op: '^', left: base, right: exponent, pos };
    }
    return base;
  };

  const parseUnary = (): Node => {
    skip();
    if (i < n && (text[i] === '-' || text[i] === '+')) {
      const pos = i;
      const minus = text[i] === '-';
      i++;
      enter();
      const arg = parseUnary();
      depth--;
      return minus ? { kind: 'neg', arg, pos } : arg;
    }
    return parsePower();
  };

  const parseProduct = (): Node => {
    let left = parseUnary();
    for (;;) {
      skip();
      if (i < n && (text[i] === '*' || text[i] === '/')) {
        const op = text[i] as '*' | '/';
        const pos = i;
        i++;
        if (i < n && text[i] === '*' && op === '*') fail(pos, "'**' is not an operator; write '^' for powers");
        left = { kind: 'bin', op, left, right: parseUnary(), pos };
      } else return left;
    }
  };

  function parseSum(): Node {
    enter();
    let left = parseProduct();
    for (;;) {
      skip();
      if (i < n && (text[i] === '+' || text[i] === '-')) {
        const op = text[i] as '+' | '-';
        const pos = i;
        i++;
        left = { kind: 'bin', op, left, right: parseProduct(), pos };
      } else break;
    }
    depth--;
    return left;
  }

  skip();
  if (i >= n) fail(0, 'formula is empty');
  const tree = parseSum();
  skip();
  if (i < n) fail(i, `unexpected ${describe(i)}${text[i] === ')' ? " (no matching '(')" : ''}`);
  void CONSTANTS;
  return tree;
}
