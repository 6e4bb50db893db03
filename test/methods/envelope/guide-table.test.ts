/**
 * Guide-table selection (Chen & Asau 1974): frequencies proportional to the
 * areas, zero areas never chosen.
 */
import { describe, expect, it } from 'vitest';
import { chiSquareCheck } from '../../../src/checks/chi-square.js';
import { GuideTable } from '../../../src/methods/envelope/guide-table.js';
import { mersenneTwister } from '../../../src/random/mersenne-twister.js';
import { ALPHA } from '../../helpers/statistical.js';

describe('GuideTable', () => {
  it('GuideTable.lookup selects pieces in proportion to their areas (chi-square at ALPHA), with a biased twin', () => {
    const areas = Float64Array.from([0.5, 0, 3, 1e-3, 0.25, 7, 0, 1.2, 0.04, 2]);
    const g = new GuideTable(areas.length);
    g.build(areas, areas.length);
    const u = mersenneTwister(42);
    const n = 200_000;
    const counts = new Float64Array(areas.length);
    for (let i = 0; i < n; i++) counts[g.lookup(u())]++;
    expect(counts[1]).toBe(0);
    expect(counts[6]).toBe(0);
    const total = areas.reduce((s, a) => s + a, 0);
    const keep = [0, 2, 3, 4, 5, 7, 8, 9];
    const p = keep.map((j) => areas[j] / total);
    const c = keep.map((j) => counts[j]);
    expect(chiSquareCheck(c, p).pValue).toBeGreaterThan(ALPHA);
    // twin: the same counts against probabilities with 5% moved from piece 5 to piece 2
    const q = p.slice();
    q[1] += 0.05;
    q[4] -= 0.05;
    expect(chiSquareCheck(c, q).pValue).toBeLessThan(ALPHA);
  });

  it('GuideTable.lookup never walks past the last piece of positive area', () => {
    const areas = Float64Array.from([1, 2, 3, 0, 0]);
    const g = new GuideTable(5);
    g.build(areas, 5);
    expect(g.lookup(1 - 2 ** -53)).toBe(2);
    expect(g.lookup(0)).toBe(0);
    expect(g.lookup(1 / 6)).toBe(1);
  });
});
