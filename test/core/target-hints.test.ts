import { describe, expect, it } from 'vitest';
import { adaptiveRejectionSampler, normalTarget, type Target } from '../../src/index.js';

// The optional hints `modes`, `logDensityBounds`, `dLogDensityBounds` and
// `d2LogDensityBounds` are validated by every factory through checkTarget.
describe('checkTarget validates the optional hints', () => {
  const base = normalTarget(0, 1);
  const bad: Array<[string, Partial<Target> & Record<string, unknown>]> = [
    ['modes not an array', { modes: 3 as unknown as number[] }],
    ['a mode outside the support', { modes: [0, 2], support: [-1, 1] }],
    ['a NaN mode', { modes: [Number.NaN] }],
    ['a string mode', { modes: ['0'] as unknown as number[] }],
    ['logDensityBounds not a function', { logDensityBounds: 1 as unknown as Target['logDensityBounds'] }],
    ['dLogDensityBounds not a function', { dLogDensityBounds: 'x' as unknown as Target['dLogDensityBounds'] }],
    ['d2LogDensityBounds not a function', { d2LogDensityBounds: {} as unknown as Target['d2LogDensityBounds'] }],
  ];
  for (const [what, extra] of bad) {
    it(`adaptiveRejectionSampler refuses ${what} with INVALID_TARGET`, () => {
      const t = { ...base, ...extra } as Target;
      let code = '';
      let message = '';
      try {
        adaptiveRejectionSampler(t, { seed: 1 });
      } catch (e) {
        code = (e as { code: string }).code;
        message = (e as Error).message;
      }
      expect(code).toBe('INVALID_TARGET');
      expect(message).toContain('adaptiveRejectionSampler');
    });
  }
  it('adaptiveRejectionSampler accepts well-formed hints', () => {
    const t: Target = {
      ...base,
      modes: [0],
      logDensityBounds: () => [-Infinity, 0],
    };
    expect(Number.isFinite(adaptiveRejectionSampler(t, { seed: 1 }).sample())).toBe(true);
  });
});
