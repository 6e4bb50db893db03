/**
 * A rewrite of the expression tree before compilation: the log of a sum of
 * exponentials becomes a `logsumexp`. @internal
 *
 * @remarks
 * `log(w1·exp(g1) + w2·exp(g2)/s)` and `logsumexp(log(w1) + g1, log(w2) +
 * g2 − log(s))` are the same function, but not the same computation: where
 * the exponentials underflow (the tails of a mixture on an infinite
 * support) the sum is 0 and its interval derivative u′/u has no finite
 * enclosure, so no decay can be proven there; `logsumexp` works in log
 * space and stays finite. The rewrite applies only where every term of the
 * sum is a product or quotient of exponentials and positive constants
 * (subtrees without `x` of numbers, parameters, `pi`, `e`, negation and
 * `+ − * /` whose value is positive), with at least
 * one exponential; anything else is left as written. The point values of a
 * rewritten formula can differ from the literal ones in the last bits.
 *
 * @packageDocumentation
 */
import type { Node } from './ast.js';

/**
 * The value of a subtree without `x` built from numbers, parameters, `pi`,
 * `e`, negation and `+ − * /` (NaN otherwise): only its sign is used, to
 * accept a constant factor such as `(1 - w)`.
 */
function constant(n: Node, params: Readonly<Record<string, number>>): number {
  switch (n.kind) {
    case 'num':
      return n.value;
    case 'param':
      return params[n.name];
    case 'const':
      return n.name === 'pi' ? Math.PI : Math.E;
    case 'neg':
      return -constant(n.arg, params);
    case 'bin': {
      const a = constant(n.left, params);
      const b = constant(n.right, params);
      return n.op === '+' ? a + b : n.op === '-' ? a - b : n.op === '*' ? a * b : n.op === '/' ? a / b : NaN;
    }
    default:
      return NaN;
  }
}

/** The log of a positive factor, in log space, or null when `n` is not a product or quotient of exponentials and positive constants. */
function logOf(n: Node, params: Readonly<Record<string, number>>): Node | null {
  const v = constant(n, params);
  if (v > 0 && v < Infinity) return { kind: 'call', name: 'log', args: [n], pos: -1 };
  switch (n.kind) {
    case 'call':
      return n.name === 'exp' ? n.args[0] : null;
    case 'bin': {
      if (n.op !== '*' && n.op !== '/') return null;
      const a = logOf(n.left, params);
      const b = a === null ? null : logOf(n.right, params);
      return a === null || b === null ? null : { kind: 'bin', op: n.op === '*' ? '+' : '-', left: a, right: b, pos: -1 };
    }
    default:
      return null;
  }
}

/** True when the factor `n` (accepted by {@link logOf}) contains an exponential. */
function hasExp(n: Node): boolean {
  if (n.kind === 'call') return n.name === 'exp';
  return n.kind === 'bin' && (hasExp(n.left) || hasExp(n.right));
}

/** The terms of a chain of `+`. */
function terms(n: Node, out: Node[]): Node[] {
  if (n.kind === 'bin' && n.op === '+') {
    terms(n.left, out);
    terms(n.right, out);
  } else {
    out.push(n);
  }
  return out;
}

/**
 * `tree` with every `log(t1 + t2 + …)` whose terms are products or
 * quotients of exponentials and positive constants (at least one
 * exponential among them) written as `logsumexp(log t1, log t2, …)` in log
 * space; the rest unchanged. @internal
 */
export function logsOfSums(tree: Node, params: Readonly<Record<string, number>>): Node {
  switch (tree.kind) {
    case 'neg':
      return { ...tree, arg: logsOfSums(tree.arg, params) };
    case 'bin':
      return { ...tree, left: logsOfSums(tree.left, params), right: logsOfSums(tree.right, params) };
    case 'call': {
      const args = tree.args.map((a) => logsOfSums(a, params));
      if (tree.name === 'log') {
        const ts = terms(args[0], []);
        if (ts.length > 1 && ts.length <= 64) {
          const logs: Node[] = [];
          let exps = false;
          for (const t of ts) {
            const l = logOf(t, params);
            if (l === null) break;
            exps ||= hasExp(t);
            logs.push(l);
          }
          if (logs.length === ts.length && exps) return { kind: 'call', name: 'logsumexp', args: logs, pos: tree.pos };
        }
      }
      return { ...tree, args };
    }
    default:
      return tree;
  }
}
