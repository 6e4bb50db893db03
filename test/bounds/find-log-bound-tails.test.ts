import { describe, expect, it } from 'vitest';
import {
  ImproperDensityError,
  InvalidTargetError,
  cauchyProposal,
  exponentialProposal,
  findLogBound,
  logisticTarget,
  normalProposal,
  rejectionSampler,
  studentTTarget,
} from '../../src/index.js';

// A proposal whose tail is lighter than a proper target's is the proposal's fault (InvalidTargetError,
// with the advice to use a heavier-tailed proposal); only a target that does not decay is improper.
// Tail facts (common practice): the logistic log-density decays like −|x|, the normal like −x²/2σ²,
// the Student-t like −(ν+1)·log|x|; so logistic − normal(0, 2) and t − normal both rise without bound,
// and the logistic and the t densities are proper.
const LIGHT_TAIL_ADVICE = /proposal's tail is lighter than the target's: use a heavier-tailed proposal/;

describe('findLogBound: light-tailed proposal against a proper target', () => {
  it('rejectionSampler(logisticTarget(0, 1), { proposal: normalProposal(0, 2) }) throws InvalidTargetError with the Student-t advice', () => {
    const call = (): unknown => rejectionSampler(logisticTarget(0, 1), { proposal: normalProposal(0, 2) });
    expect(call).toThrow(InvalidTargetError);
    expect(call).toThrow(LIGHT_TAIL_ADVICE);
    expect(call).not.toThrow(ImproperDensityError);
  });

  it('findLogBound gives the logistic and the Student-t case the same error class and advice', () => {
    for (const t of [logisticTarget(0, 1), logisticTarget(3, 0.5), studentTTarget(3)]) {
      for (const p of [normalProposal(0, 2), normalProposal(1, 0.5)]) {
        expect(() => findLogBound(t, p)).toThrow(InvalidTargetError);
        expect(() => findLogBound(t, p)).toThrow(LIGHT_TAIL_ADVICE);
      }
    }
  });

  it('findLogBound still reports a target that rises in a tail as improper (twin: the check is not just never-improper)', () => {
    // symmetric and rising in both tails: logf = |x|/10, improper (common practice)
    expect(() => findLogBound({ logDensity: (x) => Math.abs(x) / 10 }, cauchyProposal(0, 1))).toThrow(ImproperDensityError);
    expect(() => findLogBound({ logDensity: (x) => x, support: [0, Infinity] }, exponentialProposal(1))).toThrow(ImproperDensityError);
    expect(() => findLogBound({ logDensity: (x) => -x, support: [-Infinity, 5] }, normalProposal(0, 1))).toThrow(ImproperDensityError);
  });

  it('findLogBound with a heavy-tailed proposal on the logistic target finds a finite constant', () => {
    const { logBound } = findLogBound(logisticTarget(0, 1), cauchyProposal(0, 1));
    // sup of logistic/cauchy densities is finite (the Cauchy tail is heavier; common practice)
    expect(Number.isFinite(logBound)).toBe(true);
  });
});
