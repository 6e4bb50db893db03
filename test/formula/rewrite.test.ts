/**
 * The log of a sum of exponentials is compiled as a logsumexp
 * (src/formula/_internals/rewrite.ts): which formulas are rewritten, that
 * the values agree with the literal formula where it does not underflow,
 * and that the tails of a mixture on the whole line are then proven to
 * decay (certifiedSampler fits the mixture cdf, with a biased twin).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import { certifiedSampler, exactSampler, formulaTarget } from '../../src/index.js';
import { printNode } from '../../src/formula/_internals/ast.js';
import { parseFormula } from '../../src/formula/_internals/parser.js';
import { logsOfSums } from '../../src/formula/_internals/rewrite.js';
import { methodSuite } from '../helpers/method-suite.js';

const rewritten = (text: string, params: Record<string, number> = {}): string =>
  printNode(logsOfSums(parseFormula('test', text, (n) => n in params), params));

describe('logsOfSums: which logs of sums become logsumexp', () => {
  it('a sum of exponentials times positive constants is rewritten in log space', () => {
    expect(rewritten('log(exp(x) + exp(-x))')).toBe('logsumexp(x, -x)');
    expect(rewritten('log(2 * exp(x) + exp(-x) / 3)')).toBe('logsumexp(log(2) + x, -x - log(3))');
    expect(rewritten('log(w * exp(x) + exp(-x))', { w: 0.5 })).toBe('logsumexp(log(w) + x, -x)');
    expect(rewritten('-x + log(exp(x) + 1)')).toBe('-x + logsumexp(x, log(1))');
    // a constant factor without x, accepted by the sign of its value
    expect(rewritten('log((1 - w) * exp(x) + w * exp(-x))', { w: 0.3 })).toBe('logsumexp(log(1 - w) + x, log(w) + -x)');
    expect(rewritten('log((1 - w) * exp(x) + w * exp(-x))', { w: 1.5 })).toBe('log((1 - w) * exp(x) + w * exp(-x))');
  });

  it('anything else is left as written: a difference, a non-positive or unknown factor, no exponential, a single term', () => {
    for (const f of ['log(exp(x) - exp(-x))', 'log(1 + x ^ 2)', 'log(x * exp(x) + 1)', 'log(2 + 3)', 'log(exp(x))', 'log(-2 * exp(x) + exp(x))']) {
      expect(rewritten(f)).toBe(printNode(parseFormula('test', f, () => false)));
    }
    expect(rewritten('log(w * exp(x) + exp(-x))', { w: -0.5 })).toBe('log(w * exp(x) + exp(-x))');
  });
});

describe('a mixture written as log(a + b) on the whole line', () => {
  // invented mixture 0.7·N(0, 1) + 0.3·N(2, 0.3²), up to a constant: log(0.7·e^(−x²/2) + 0.3·e^(−(x−2)²/(2·0.3²))/0.3)
  const text = 'log(0.7 * exp(-0.5 * x^2) + 0.3 * exp(-0.5 * ((x - 2) / 0.3)^2) / 0.3)';
  const literal = (x: number): number => Math.log(0.7 * Math.exp(-0.5 * x * x) + (0.3 * Math.exp(-0.5 * ((x - 2) / 0.3) ** 2)) / 0.3);
  const cdf = (x: number): number => 0.7 * normalCdf(x, 0, 1) + 0.3 * normalCdf(x, 2, 0.3); // @stdlib normal cdf
  const target = (w = 0.3) =>
    formulaTarget(`log((1 - w) * exp(-0.5 * x^2) + w * exp(-0.5 * ((x - 2) / 0.3)^2) / 0.3)`, { support: [-Infinity, Infinity], parameters: { w } });

  it('agrees with the literal formula where it does not underflow, and stays finite where it does', () => {
    const t = formulaTarget(text, { support: [-Infinity, Infinity] });
    for (let x = -8; x <= 10; x += 0.037) expect(Math.abs(t.logDensity(x) - literal(x))).toBeLessThan(1e-13 * (1 + Math.abs(literal(x))));
    // at x = −40 both exponentials underflow in the literal form (e^−800 and e^−9800): it gives −Infinity
    expect(literal(-40)).toBe(-Infinity);
    expect(t.logDensity(-40)).toBeCloseTo(Math.log(0.7) - 800, 9); // the broad component alone (common practice)
  });

  it('its tails are proven to decay: certifiedSampler builds cells on the whole line and exactSampler picks it', () => {
    const t = formulaTarget(text, { support: [-Infinity, Infinity] });
    expect(t.dLogDensityBounds(-Infinity, -10)[0]).toBeGreaterThan(0);
    expect(t.dLogDensityBounds(10, Infinity)[1]).toBeLessThan(0);
    expect(exactSampler(t, { seed: 1 }).choice.method).toBe('certified');
  });

  methodSuite({
    name: 'certifiedSampler(log(0.7·e^(−x²/2) + 0.3·e^(−(x−2)²/0.18)/0.3)) fits the mixture cdf (twin: weight 0.27)',
    make: (seed) => certifiedSampler(target(), { seed }),
    biased: (seed) => certifiedSampler(target(0.27), { seed }),
    cdf,
    n: 20_000,
    seed: 20261204,
  });
});
