/**
 * The `stream` option (a sampler owning substream(seed, stream)) and the
 * second factory argument of partitionedFill: same draws as the injected
 * substream, for every sampler kind; typed refusals of bad values.
 */
import { describe, expect, it } from 'vitest';
import {
  InvalidOptionError,
  InvalidTargetError,
  adaptiveRejectionSampler,
  cauchyProposal,
  exactSampler,
  gammaTarget,
  normalTarget,
  partitionedFill,
  piecewiseSampler,
  ratioOfUniformsSampler,
  rejectionSampler,
  substream,
  tableSampler,
} from '../../src/index.js';
import type { OwnedStream, Sampler, Uniform } from '../../src/index.js';
import { draw } from '../helpers/statistical.js';

const normal = normalTarget(0, 1);
type Make = (o: { seed?: number; stream?: number; uniform?: Uniform }) => Sampler;
const MAKERS: [string, Make][] = [
  ['rejectionSampler', (o) => rejectionSampler(normal, { proposal: cauchyProposal(0, 1), ...o })],
  ['adaptiveRejectionSampler', (o) => adaptiveRejectionSampler(gammaTarget(2.5), o)],
  ['tableSampler', (o) => tableSampler(normal, o)],
  ['ratioOfUniformsSampler', (o) => ratioOfUniformsSampler(normal, o)],
  ['piecewiseSampler', (o) => piecewiseSampler(normal, o)],
  ['exactSampler', (o) => exactSampler(normal, o)],
];

describe('options.stream', () => {
  for (const [name, make] of MAKERS) {
    it(`${name}({ seed, stream }) draws what ${name}({ uniform: substream(seed, stream) }) draws, and differs across streams`, () => {
      for (const [seed, stream] of [[2026, 0], [2026, 7], [1, 2 ** 40]] as const) {
        const own = draw(make({ seed, stream }), 3000);
        const injected = draw(make({ uniform: substream(seed, stream) }), 3000);
        expect(Array.from(own)).toEqual(Array.from(injected));
      }
      expect(Array.from(draw(make({ seed: 3, stream: 0 }), 100))).not.toEqual(Array.from(draw(make({ seed: 3, stream: 1 }), 100)));
      // the default seed applies when only the stream is given
      expect(Array.from(draw(make({ stream: 4 }), 100))).toEqual(Array.from(draw(make({ uniform: substream(5489, 4) }), 100)));
    });
  }

  it('a bad stream, or stream with uniform, throws InvalidOptionError naming the API, options.stream and the value', () => {
    for (const bad of [-1, 1.5, NaN, 2 ** 53, '3' as unknown as number]) {
      expect(() => tableSampler(normal, { seed: 1, stream: bad })).toThrow(InvalidOptionError);
      expect(() => rejectionSampler(normal, { proposal: cauchyProposal(0, 1), stream: bad })).toThrow(/rejectionSampler: options\.stream must be an integer/);
    }
    expect(() => tableSampler(normal, { stream: -3 })).toThrow(/tableSampler: options\.stream .*-3/);
    expect(() => adaptiveRejectionSampler(normal, { stream: 1, uniform: substream(1, 1) })).toThrow(/either options\.stream or options\.uniform/);
  });
});

describe('partitionedFill factory arguments', () => {
  it('partitionedFill calls create(substream(seed, k), { seed, stream: k }); a factory using own gives the same array as one using uniform', () => {
    const seen: OwnedStream[] = [];
    const viaUniform = partitionedFill((u) => tableSampler(normal, { uniform: u }), new Float64Array(10_001), 3, 77);
    const viaOwn = partitionedFill(
      (_u, own) => {
        seen.push(own);
        return tableSampler(normal, { ...own });
      },
      new Float64Array(10_001),
      3,
      77,
    );
    expect(seen).toEqual([
      { seed: 77, stream: 0 },
      { seed: 77, stream: 1 },
      { seed: 77, stream: 2 },
    ]);
    expect(Array.from(viaOwn)).toEqual(Array.from(viaUniform));
    // part 1 is substream(77, 1) drawn from the start
    const part1 = draw(tableSampler(normal, { uniform: substream(77, 1) }), 6667 - 3333);
    expect(Array.from(viaOwn.subarray(3333, 6667))).toEqual(Array.from(part1));
  });
});
