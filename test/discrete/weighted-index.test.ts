import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InvalidOptionError, InvalidTargetError, mersenneTwister } from '../../src/index.js';
import { weightedIndexSampler } from '../../src/discrete/weighted-index.js';
import { chiSquareCheck } from '../../src/checks/chi-square.js';
import { ALPHA } from '../helpers/statistical.js';

/** Normalized weights computed by the test: Neumaier sum in long form, independent of the table code. */
function normalized(w: ArrayLike<number>): number[] {
  const xs = Array.from(w);
  const max = Math.max(...xs.slice(0, 200_000).map((x) => x));
  let s = 0;
  let c = 0;
  for (const x0 of xs) {
    const x = x0 / max;
    const t = s + x;
    c += Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s;
    s = t;
  }
  s += c;
  return xs.map((x) => x / max / s);
}

/**
 * The rounding contract of the tables (documented in weightedIndexSampler):
 * |p_i − w_i/Σw| < 2^-52 + 3·2^-53·w_i/Σw, plus the rounding of the test's own
 * normalization (a few ulps of w_i/Σw): tolerance 2^-52 + 8·2^-53·q.
 */
function expectWithinRounding(implied: Float64Array, w: ArrayLike<number>): void {
  const q = normalized(w);
  let sum = 0;
  for (let i = 0; i < q.length; i++) {
    const tol = 2 ** -52 + 8 * 2 ** -53 * q[i];
    if (!(Math.abs(implied[i] - q[i]) <= tol)) expect.fail(`index ${i}: implied ${implied[i]} vs ${q[i]} (tol ${tol})`);
    if (w[i] === 0 && implied[i] !== 0) expect.fail(`index ${i}: zero weight got probability ${implied[i]}`);
    if (q[i] >= 2 ** -52 && !(implied[i] > 0)) expect.fail(`index ${i}: weight above one unit got probability 0`);
    sum += implied[i];
  }
  // units sum to 2^52 exactly; the division and the float sum lose at most n ulps
  expect(Math.abs(sum - 1)).toBeLessThanOrEqual(q.length * 2 ** -52);
}

const weightVector = fc.array(fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e6, noNaN: true }), fc.double({ min: 1e-300, max: 1e-200, noNaN: true })), { minLength: 1, maxLength: 300 });

describe('weightedIndexSampler', () => {
  it('weightedIndexSampler tables imply the normalized weights within rounding (random vectors with zeros and tiny weights)', () => {
    fc.assert(
      fc.property(weightVector, fc.constantFrom<'alias' | 'inversion'>('alias', 'inversion'), (w0, method) => {
        const w = w0.some((x) => x > 0) ? w0 : [...w0, 1];
        expectWithinRounding(weightedIndexSampler(w, { method }).probabilities(), w);
      }),
      { seed: 1201, numRuns: 300 },
    );
  });

  it('weightedIndexSampler tables imply the normalized weights within rounding with one huge weight', () => {
    fc.assert(
      fc.property(weightVector, fc.nat(), fc.constantFrom(1e15, 1e100, 1e300, Number.MAX_VALUE), fc.constantFrom<'alias' | 'inversion'>('alias', 'inversion'), (w0, at, huge, method) => {
        const w = [...w0];
        w.splice(at % (w.length + 1), 0, huge);
        expectWithinRounding(weightedIndexSampler(w, { method }).probabilities(), w);
      }),
      { seed: 1202, numRuns: 200 },
    );
  });

  it('weightedIndexSampler tables imply the normalized weights within rounding with 1e5 entries', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 31 - 1 }), fc.constantFrom<'alias' | 'inversion'>('alias', 'inversion'), (seed, method) => {
        const u = mersenneTwister(seed);
        const w = new Float64Array(100_000);
        for (let i = 0; i < w.length; i++) {
          const v = u();
          w[i] = v < 0.2 ? 0 : v < 0.25 ? 1e-250 * u() : Math.exp(40 * u());
        }
        expectWithinRounding(weightedIndexSampler(w, { method }).probabilities(), w);
      }),
      { seed: 1203, numRuns: 4 },
    );
  });

  it('weightedIndexSampler draws pass chi-square at ALPHA, and (twin) a table of slightly wrong weights is rejected at the same n', () => {
    const w = [5, 0, 1, 2, 0.5, 8, 3, 0, 0.25, 4]; // invented weights
    const tot = w.reduce((a, b) => a + b, 0);
    const p = w.map((x) => x / tot);
    for (const method of ['alias', 'inversion'] as const) {
      const n = 200_000;
      const good = weightedIndexSampler(w, { seed: 77, method }).fill(new Int32Array(n));
      const bad = weightedIndexSampler(w.map((x, i) => (i === 2 ? x * 1.1 : x)), { seed: 77, method }).fill(new Int32Array(n));
      const count = (d: Int32Array): number[] => {
        const c = new Array<number>(w.length).fill(0);
        for (const k of d) c[k]++;
        return c;
      };
      const cg = count(good);
      expect(cg[1] + cg[7]).toBe(0); // zero weights never drawn
      expect(chiSquareCheck(cg, p).pValue).toBeGreaterThan(ALPHA);
      expect(chiSquareCheck(count(bad), p).pValue).toBeLessThan(ALPHA);
    }
  });

  it("weightedIndexSampler 'inversion' is monotone in the uniform", () => {
    const w = [0, 3, 1, 0, 0, 2, 7, 0.001, 5];
    const grid = Array.from({ length: 4001 }, (_, i) => (i / 4001) ** 1.7);
    let i = 0;
    const s = weightedIndexSampler(w, { method: 'inversion', uniform: () => grid[i++] });
    const out = s.fill(new Float64Array(grid.length));
    for (let j = 1; j < out.length; j++) expect(out[j]).toBeGreaterThanOrEqual(out[j - 1]);
    expect(out[0]).toBe(1); // u = 0 selects the first positive weight
    expect(out[out.length - 1]).toBe(8);
  });

  it('weightedIndexSampler stream snapshots (regression guard, seed 2026)', () => {
    const w = [1, 2, 3, 0, 4];
    const a = Array.from(weightedIndexSampler(w, { seed: 2026 }).fill(new Int32Array(16)));
    const g = Array.from(weightedIndexSampler(w, { seed: 2026, method: 'inversion' }).fill(new Int32Array(16)));
    expect({ a, g }).toMatchInlineSnapshot(`
      {
        "a": [
          1,
          2,
          4,
          0,
          2,
          4,
          1,
          4,
          2,
          4,
          2,
          2,
          2,
          4,
          0,
          2,
        ],
        "g": [
          1,
          2,
          4,
          0,
          2,
          4,
          1,
          4,
          2,
          4,
          2,
          2,
          1,
          4,
          0,
          2,
        ],
      }
    `);
  });

  it('weightedIndexSampler gives typed errors for bad weights and options, never a draw', () => {
    expect(() => weightedIndexSampler([])).toThrow(InvalidTargetError);
    expect(() => weightedIndexSampler([0, 0])).toThrow(/every weight is 0/);
    expect(() => weightedIndexSampler([1, -1])).toThrow(/weights\[1\] must be a finite number >= 0, got -1/);
    expect(() => weightedIndexSampler([1, NaN])).toThrow(InvalidTargetError);
    expect(() => weightedIndexSampler([1, Infinity])).toThrow(InvalidTargetError);
    expect(() => weightedIndexSampler(['1' as unknown as number])).toThrow(/got '1'/);
    expect(() => weightedIndexSampler([1], { method: 'walker' as never })).toThrow(InvalidOptionError);
    expect(() => weightedIndexSampler([1], { sed: 1 } as never)).toThrow(/unknown option 'sed'/);
    expect(() => weightedIndexSampler([1, 2]).fill([] as never)).toThrow(InvalidTargetError) // an argument, not an option: INVALID_TARGET like tableSampler.fill;
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.double(), fc.constant(-0.5)), { minLength: 1, maxLength: 20 }), (w) => {
        const bad = w.some((x) => !(x >= 0) || x === Infinity) || w.every((x) => x === 0);
        if (!bad) return;
        expect(() => weightedIndexSampler(w)).toThrow(InvalidTargetError);
      }),
      { seed: 1204, numRuns: 300 },
    );
  });
});
