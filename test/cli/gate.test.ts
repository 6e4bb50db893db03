/**
 * The statistics of `exactdraw bench` on made-up timings (no clock): per-round
 * ratios and their noise, the regression gate, the harness self-check.
 */
import { describe, expect, it } from 'vitest';
import { GATE_Z, gate, median, roundRatios, selfCheck } from '../../src/cli/gate.js';
import type { GateOptions, GateRow } from '../../src/cli/gate.js';

const row = (name: string, ratioToGate: number | null, gateLogNoise: number | null, extra: Partial<GateRow> = {}): GateRow => ({
  name,
  ratioToGate,
  gateLogNoise,
  nsPerDraw: 10 * (ratioToGate ?? 1),
  evaluationsPerDraw: null,
  uniformsPerDraw: null,
  ...extra,
});
const opts = (o: Partial<GateOptions> = {}): GateOptions => ({ tolerance: 0.2, countTolerance: 0.2, gateTimes: false, gateReference: 'ref', skipped: new Set(), ...o });

describe('per-round ratios', () => {
  it('median and the ratio of rounds cancel a load that slows both a case and its reference in the same round', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 2, 3])).toBe(2.5);
    // the machine gets 2x slower in rounds 3-4; case = 3x the reference in every round
    const ref = [10, 10, 20, 20, 10];
    const cas = ref.map((x) => 3 * x);
    const r = roundRatios(cas, ref);
    expect(r.ratio).toBeCloseTo(3, 12);
    expect(r.logNoise).toBe(0);
    // twin: the raw times alone would show the slowdown (median of the case moves from 30 to 60 when 3 of 5 rounds are slow)
    expect(median([30, 30, 60, 60, 60])).toBe(60);
  });

  it('the noise is the robust standard error of the log ratio: 1.2533 · 1.4826 · MAD / sqrt(rounds)', () => {
    // log ratios ±0.1 around log 2 in alternate rounds: MAD = 0.1 (hand computation)
    const ref = [1, 1, 1, 1, 1, 1, 1];
    const cas = [2, 2 * Math.exp(0.1), 2 * Math.exp(-0.1), 2 * Math.exp(0.1), 2 * Math.exp(-0.1), 2 * Math.exp(0.1), 2 * Math.exp(-0.1)];
    const r = roundRatios(cas, ref);
    expect(r.ratio).toBeCloseTo(2, 12);
    expect(r.logNoise).toBeCloseTo((1.2533 * 1.4826 * 0.1) / Math.sqrt(7), 12);
    expect(() => roundRatios([1], [1, 2])).toThrow(/1 case rounds vs 2/);
  });
});

describe('per-round ratios from several processes per case', () => {
  it('rounds timed in processes of different levels: the ratio is the median level and the noise sees the spread of the levels', () => {
    // 6 processes (round k in process k mod 6), each steady within itself, levels 2·e^{±0.15}
    // alternating (hand computation: levels ±0.15 around log 2, sd = 0.15·√(6/5), SE = 1.2533·sd/√6)
    const P = 6;
    const ref = new Array(12).fill(1);
    const cas = ref.map((_, k) => 2 * Math.exp((k % P) % 2 === 0 ? 0.15 : -0.15));
    const r = roundRatios(cas, ref, P);
    expect(r.ratio).toBeCloseTo(2, 12);
    expect(r.logNoise).toBeCloseTo((1.2533 * 0.15 * Math.sqrt(6 / 5)) / Math.sqrt(6), 12);
    // twin: read as independent rounds, the same timings report a noise that hides the disagreement of the processes
    const one = roundRatios(cas, ref, 1);
    expect(one.logNoise).toBeCloseTo((1.2533 * 1.4826 * 0.15) / Math.sqrt(12), 12);
    expect(one.logNoise).toBeLessThan(r.logNoise);
  });

  it('processes that agree keep the rounds\' own noise (the larger of the two estimates)', () => {
    const P = 3;
    const ref = [1, 1, 1, 1, 1, 1];
    // round noise ±0.1 inside every process, identical levels
    const cas = [2 * Math.exp(0.1), 2 * Math.exp(0.1), 2 * Math.exp(0.1), 2 * Math.exp(-0.1), 2 * Math.exp(-0.1), 2 * Math.exp(-0.1)];
    const r = roundRatios(cas, ref, P);
    expect(r.ratio).toBeCloseTo(2, 12);
    expect(r.logNoise).toBeCloseTo((1.2533 * 1.4826 * 0.1) / Math.sqrt(6), 12);
  });
});

describe('the regression gate', () => {
  it('passes unchanged ratios, fails a 1.5x slowdown, and the limit is the tolerance', () => {
    const base = [row('ref', 1, 0), row('a', 3, 0.01), row('b', 5, 0.01)];
    expect(gate([row('ref', 1, 0), row('a', 3.2, 0.01), row('b', 4.8, 0.01)], base, opts()).verdict).toBe('pass');
    const slow = gate([row('ref', 1, 0), row('a', 4.5, 0.01), row('b', 5, 0.01)], base, opts());
    expect(slow.verdict).toBe('regression');
    expect(slow.findings).toHaveLength(1);
    expect(slow.findings[0]).toMatchObject({ name: 'a', kind: 'regression', metric: 'ratioToGate', baseline: 3, current: 4.5 });
    expect(slow.findings[0].message).toMatch(/REGRESSION a: time ratio to 'ref' 4\.500 vs baseline 3\.000 \(\+50\.0 %, tolerance 20\.0 %/);
    // just inside and just outside a 20 % tolerance
    expect(gate([row('a', 3 * 1.19, 0.01)], [row('a', 3, 0.01)], opts()).verdict).toBe('pass');
    expect(gate([row('a', 3 * 1.21, 0.01)], [row('a', 3, 0.01)], opts()).verdict).toBe('regression');
  });

  it('reports too-noisy (not pass, not regression) when GATE_Z combined standard errors exceed the tolerance', () => {
    const limit = Math.log1p(0.2) / GATE_Z / Math.SQRT2; // per-run noise at which the combined noise equals the limit
    const quiet = gate([row('a', 3, limit * 0.9)], [row('a', 3, limit * 0.9)], opts());
    expect(quiet.verdict).toBe('pass');
    const noisy = gate([row('a', 3, limit * 1.1)], [row('a', 3, limit * 1.1)], opts());
    expect(noisy.verdict).toBe('too-noisy');
    expect(noisy.findings[0].message).toMatch(/TOO NOISY a: .* exceeds the tolerance 20\.0 %, so only a change beyond the noise is flagged/);
    // on a noisy row, a change beyond the tolerance but within the noise is not a regression; beyond the noise it is
    const n = limit * 2; // combined noise = 2 x the tolerance's log, i.e. exp(2 log 1.2) - 1 = 44 %
    expect(gate([row('a', 3 * 1.3, n)], [row('a', 3, n)], opts()).verdict).toBe('too-noisy');
    expect(gate([row('a', 3 * 1.5, n)], [row('a', 3, n)], opts()).verdict).toBe('regression');
    // a regression found on a quiet row wins over a noisy row elsewhere
    const both = gate([row('a', 3, limit * 1.1), row('b', 9, 0)], [row('a', 3, limit * 1.1), row('b', 3, 0)], opts());
    expect(both.verdict).toBe('regression');
  });

  it('a renamed or removed row is missing (a failure); a new row is reported, not gated; rows left out with --only are not missing', () => {
    const base = [row('ref', 1, 0), row('old name', 3, 0)];
    const renamed = gate([row('ref', 1, 0), row('new name', 3, 0)], base, opts());
    expect(renamed.verdict).toBe('regression');
    expect(renamed.findings.map((f) => [f.kind, f.name])).toEqual([
      ['missing', 'old name'],
      ['new', 'new name'],
    ]);
    expect(renamed.findings[0].message).toMatch(/MISSING old name: in the baseline but not in this run/);
    const only = gate([row('ref', 1, 0)], base, opts({ skipped: new Set(['old name']) }));
    expect(only.verdict).toBe('pass');
    expect(only.findings[0].kind).toBe('not-run');
  });

  it('raw times are gated only with gateTimes; counts always, with their own tolerance; the gate reference is not gated on itself', () => {
    const base = [row('ref', 1, 0, { nsPerDraw: 10 }), row('a', 3, 0, { nsPerDraw: 30, evaluationsPerDraw: 1.5, uniformsPerDraw: 2 })];
    const slower = [row('ref', 1, 0, { nsPerDraw: 20 }), row('a', 3, 0, { nsPerDraw: 60, evaluationsPerDraw: 1.5, uniformsPerDraw: 2 })];
    expect(gate(slower, base, opts()).verdict).toBe('pass'); // the whole machine is 2x slower: ratios unchanged
    const timed = gate(slower, base, opts({ gateTimes: true }));
    expect(timed.findings.map((f) => `${f.name}:${f.metric}`)).toEqual(['ref:nsPerDraw', 'a:nsPerDraw']);
    const counts = gate([row('a', 3, 0, { evaluationsPerDraw: 1.5, uniformsPerDraw: 2.5 })], base.slice(1), opts({ tolerance: 100, countTolerance: 0.1 }));
    expect(counts.findings.map((f) => f.metric)).toEqual(['uniformsPerDraw']);
  });
});

describe('the harness self-check', () => {
  it('agrees within 10 %, or says the harness distorts the timings', () => {
    const ok = selfCheck([10.2, 10.4, 10.1], [10, 9.9, 10.1]);
    expect(ok.ok).toBe(true);
    expect(ok.difference).toBeCloseTo(0.02, 12);
    expect(ok.message).toMatch(/^self-check ok: raw uniform 10\.20 ns\/draw in the harness vs 10\.00 alone in a fresh process \(\+2\.0 %\)/);
    const bad = selfCheck([22.6, 22.4, 23], [10.5, 11, 11.5]);
    expect(bad.ok).toBe(false);
    expect(bad.message).toMatch(/^SELF-CHECK FAILED: raw uniform 22\.60 ns\/draw in the harness vs 11\.00 alone .*\(\+105\.5 %\), beyond 10\.0 %/);
    // the boundary, both sides, and a harness that is faster than the fresh process
    expect(selfCheck([10.9], [10]).ok).toBe(true);
    expect(selfCheck([11.1], [10]).ok).toBe(false);
    expect(selfCheck([8.5], [10]).ok).toBe(false);
    expect(selfCheck([8.5], [10]).message).toContain('(-15.0 %)');
  });
});
