import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { containmentProperty, differenceProperty, type DifferenceCounts } from './properties.js';

describe('formulaTarget bounds (fast-check, fixed seeds)', () => {
  it('formulaTarget(...).logDensityBounds/dLogDensityBounds/d2LogDensityBounds contain every point value, first and second derivative', () => {
    const r = fc.check(containmentProperty(), { seed: 20261202, numRuns: 3000 });
    if (r.failed) throw new Error(fc.defaultReportMessage(r) ?? 'failed');
  });
  it('formulaTarget(...).dLogDensity and d2LogDensity agree with central differences where smooth', () => {
    const counts: DifferenceCounts = { checked: 0, skipped: 0 };
    const r = fc.check(differenceProperty(counts), { seed: 4242, numRuns: 3000 });
    if (r.failed) throw new Error(fc.defaultReportMessage(r) ?? 'failed');
    console.log('difference property counts', counts);
    // the precondition must leave most cases checked, or the test says little
    expect(counts.checked).toBeGreaterThan(1000);
  });
});
