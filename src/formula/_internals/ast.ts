/**
 * Expression trees shared by the parser and the builder, and the table of
 * supported functions. @internal
 *
 * @packageDocumentation
 */

/** A node of an expression tree. `pos` is the 0-based character offset in the formula text (-1 for built nodes). @internal */
export type Node =
  | { readonly kind: 'num'; readonly value: number; readonly pos: number }
  | { readonly kind: 'x'; readonly pos: number }
  | { readonly kind: 'param'; readonly name: string; readonly pos: number }
  | { readonly kind: 'const'; readonly name: 'pi' | 'e'; readonly pos: number }
  | { readonly kind: 'neg'; readonly arg: Node; readonly pos: number }
  | { readonly kind: 'bin'; readonly op: BinaryOp; readonly left: Node; readonly right: Node; readonly pos: number }
  | { readonly kind: 'call'; readonly name: FunctionName; readonly args: readonly Node[]; readonly pos: number };

/** Binary operators. @internal */
export type BinaryOp = '+' | '-' | '*' | '/' | '^';

/** Names of the supported functions. @internal */
export type FunctionName =
  | 'exp'
  | 'log'
  | 'log1p'
  | 'expm1'
  | 'sqrt'
  | 'abs'
  | 'sin'
  | 'cos'
  | 'tan'
  | 'atan'
  | 'tanh'
  | 'sinh'
  | 'cosh'
  | 'lgamma'
  | 'pow'
  | 'min'
  | 'max'
  | 'logsumexp';

/** Arity of every function: `[min, max]` number of arguments. @internal */
export const FUNCTIONS: Readonly<Record<FunctionName, readonly [number, number]>> = {
  exp: [1, 1],
  log: [1, 1],
  log1p: [1, 1],
  expm1: [1, 1],
  sqrt: [1, 1],
  abs: [1, 1],
  sin: [1, 1],
  cos: [1, 1],
  tan: [1, 1],
  atan: [1, 1],
  tanh: [1, 1],
  sinh: [1, 1],
  cosh: [1, 1],
  lgamma: [1, 1],
  pow: [2, 2],
  min: [2, 64],
  max: [2, 64],
  logsumexp: [1, 64],
};

/** True when `name` is a supported function. @internal */
export function isFunctionName(name: string): name is FunctionName {
  return Object.prototype.hasOwnProperty.call(FUNCTIONS, name);
}

/** Names that cannot be parameters. @internal */
export function isReservedName(name: string): boolean {
  return name === 'x' || name === 'pi' || name === 'e' || isFunctionName(name);
}

/** Value of the named constants (the nearest doubles). @internal */
export const CONSTANTS: Readonly<Record<'pi' | 'e', number>> = { pi: Math.PI, e: Math.E };

const PREC: Record<BinaryOp, number> = { '+': 1, '-': 1, '*': 2, '/': 2, '^': 4 };

function numText(v: number): string {
  if (v === Infinity) return 'Infinity';
  return String(v);
}

/**
 * Canonical text of a tree: minimal parentheses under the grammar's
 * precedence (`+ -` < `* /` < unary minus < `^`, `^` right-associative),
 * one space around binary operators. Parsing the result gives the same tree.
 * @internal
 */
export function printNode(n: Node): string {
  return print(n, 0);
}

function print(n: Node, ctx: number): string {
  switch (n.kind) {
    case 'num': {
      const s = numText(n.value);
      return n.value < 0 || Object.is(n.value, -0) ? (ctx > 3 ? `(${s === '0' ? '-0' : s})` : s === '0' ? '-0' : s) : s;
    }
    case 'x':
      return 'x';
    case 'param':
      return n.name;
    case 'const':
      return n.name;
    case 'neg': {
      // unary minus binds looser than ^ and tighter than * /
      const s = '-' + print(n.arg, 3);
      return ctx > 3 ? `(${s})` : s;
    }
    case 'bin': {
      const p = PREC[n.op];
      let s: string;
      if (n.op === '^') s = `${print(n.left, 5)} ^ ${print(n.right, 3)}`;
      else s = `${print(n.left, p)} ${n.op} ${print(n.right, p + 1)}`;
      return p < ctx ? `(${s})` : s;
    }
    case 'call':
      return `${n.name}(${n.args.map((a) => print(a, 0)).join(', ')})`;
  }
}
