// The benchmark harness's self-check (bench/lib/self-check.mjs) on fake timings: no clock is read,
// nothing is timed. Rule (DEVELOPERS.md, benchmark policy): the raw-uniform case in the harness must
// agree within 10 % with the same loop alone in a fresh process, or the run says it does not.
import { describe, expect, it } from 'vitest';
import { SELF_CHECK_TOLERANCE, median, selfCheck } from '../../bench/lib/self-check.mjs';

describe('bench self-check', () => {
  it('selfCheck passes when the harness and the fresh process agree within 10 %', () => {
    const r = selfCheck([12, 12.5, 11.8, 12.2, 12.1], [12.4, 12.6, 12.0, 12.3, 12.2]);
    expect(r.ok).toBe(true);
    expect(r.paired).toBe(true);
    expect(r.line).toMatch(/^# self-check passed/);
    expect(SELF_CHECK_TOLERANCE).toBe(0.1);
  });

  it('selfCheck fails and says so when the harness is slower than a user loop (the megamorphic call site: 22.6 vs 11 ns)', () => {
    // figures of the old harness, from the issue: 22.6 ns per uniform through a shared loop, 10-12 ns alone
    const r = selfCheck([22.6, 22.4, 23.0], [11.2, 10.9, 11.6]);
    expect(r.ok).toBe(false);
    expect(r.ratio).toBeGreaterThan(1.9);
    expect(r.line).toMatch(/SELF-CHECK FAILED/);
    expect(r.line).toMatch(/do not quote these figures/);
  });

  it('selfCheck also fails when the harness is faster than the fresh process by more than 10 %', () => {
    expect(selfCheck([10, 10, 10], [11.5, 11.5, 11.5]).ok).toBe(false); // ratio 0.87
    expect(selfCheck([10, 10, 10], [11.0, 11.0, 11.0]).ok).toBe(true); // ratio 0.909
  });

  it('selfCheck boundary: ratio 1.10 passes, 1.11 fails (tolerance inclusive)', () => {
    expect(selfCheck([11], [10]).ok).toBe(true);
    expect(selfCheck([11.1], [10]).ok).toBe(false);
    expect(selfCheck([11.1], [10], 0.2).ok).toBe(true);
  });

  it('selfCheck pairs back-to-back runs: a machine that slows down between rounds does not fail a fair harness', () => {
    // the machine runs at 12 ns, then 18 ns per uniform; each pair is measured in the same phase
    const harness = [12.0, 12.1, 18.2, 18.0, 18.1];
    const alone = [12.1, 12.0, 18.0, 18.3, 17.9];
    const r = selfCheck(harness, alone);
    expect(r.ok).toBe(true);
    expect(r.ratio).toBeCloseTo(1, 1);
    // unpaired (different lengths): ratio of medians, which sees the phase mix
    const u = selfCheck(harness, [12.1, 12.0, 12.2, 18.0]);
    expect(u.paired).toBe(false);
    expect(u.ratio).toBeCloseTo(18.0 / ((12.1 + 12.2) / 2), 6);
    expect(u.ok).toBe(false);
  });

  it('selfCheck and median refuse empty, non-finite or non-positive timings', () => {
    expect(() => selfCheck([], [1])).toThrow(RangeError);
    expect(() => selfCheck([NaN], [1])).toThrow(RangeError);
    expect(() => selfCheck([1], [0])).toThrow(RangeError);
    expect(() => selfCheck([1], [1], 1.5)).toThrow(RangeError);
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
  });
});
