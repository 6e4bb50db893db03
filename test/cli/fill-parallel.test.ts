import { describe, expect, it } from 'vitest';
import { resolve } from 'node:path';

// Uses the build (worker threads load compiled JavaScript).
const dist = (p: string): string => resolve('dist', p);
const TINY = 'test/fixtures/tiny-suite.mjs';

describe('fillParallel', () => {
  it('fillParallel is deterministic for a seed and worker count and equals partitionedFill in one thread', async () => {
    const { fillParallel } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { partitionedFill } = (await import(dist('index.js'))) as typeof import('../../src/index.js');
    const { samplers } = (await import(resolve(TINY))) as { samplers: import('../../src/node/index.js').SuiteEntry[] };
    const n = 50_001;
    const a = await fillParallel({ module: TINY, name: 'tiny normal' }, new Float64Array(n), { workers: 2, seed: 9 });
    const b = await fillParallel({ module: TINY, name: 'tiny normal' }, new Float64Array(n), { workers: 2, seed: 9 });
    const c = await fillParallel({ module: TINY, name: 'tiny normal' }, new Float64Array(n), { workers: 2, seed: 10 });
    const one = partitionedFill(samplers[0].create, new Float64Array(n), 2, 9);
    expect(a).toEqual(b);
    expect(a).toEqual(one);
    expect(a).not.toEqual(c);
    expect(a.every((x) => Number.isFinite(x))).toBe(true);
    const shared = new Float64Array(new SharedArrayBuffer(8 * 1000));
    await fillParallel({ module: TINY, name: 'tiny truncated normal' }, shared, { workers: 3, seed: 1 });
    expect(Array.from(shared)).toEqual(Array.from(partitionedFill(samplers[1].create, new Float64Array(1000), 3, 1)));
  });

  it('fillParallel rejects unknown sampler names and bad options', async () => {
    const { fillParallel } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    await expect(fillParallel({ module: TINY, name: 'nope' }, new Float64Array(10), { workers: 1 })).rejects.toThrow(/no sampler named 'nope'/);
    await expect(fillParallel({ module: TINY, name: 'tiny normal' }, new Float64Array(10), { workers: 0 })).rejects.toThrow(/workers/);
  });
});
