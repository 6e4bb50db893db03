import { describe, expect, it } from 'vitest';
import { resolve } from 'node:path';

// Uses the build (worker threads load compiled JavaScript).
const dist = (p: string): string => resolve('dist', p);
const TINY = 'test/fixtures/tiny-suite.mjs'; // a relative module path resolves against the working directory

describe('fillParallel', () => {
  it('fillParallel is deterministic for a seed and worker count and equals partitionedFill in one thread', async () => {
    const { fillParallel } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { partitionedFill } = (await import(dist('index.node.js'))) /* what import 'exactdraw' loads in Node */ as typeof import('../../src/index.js');
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

  it('fillParallel with a factory that owns its stream equals partitionedFill; a worker error rejects the promise with its message', async () => {
    const { fillParallel } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { partitionedFill } = (await import(dist('index.node.js'))) /* what import 'exactdraw' loads in Node */ as typeof import('../../src/index.js');
    const { samplers } = (await import(resolve(TINY))) as { samplers: import('../../src/node/index.js').SuiteEntry[] };
    const fast = samplers.find((e) => e.name === 'tiny fast normal') as import('../../src/node/index.js').SuiteEntry;
    const a = await fillParallel({ module: TINY, name: 'tiny fast normal' }, new Float64Array(20_000), { workers: 2, seed: 4 });
    expect(Array.from(a)).toEqual(Array.from(partitionedFill(fast.create, new Float64Array(20_000), 2, 4)));
    await expect(fillParallel({ module: 'test/fixtures/tiny-broken.mjs', name: 'tiny broken' }, new Float64Array(10), { workers: 2, seed: 1 })).rejects.toThrow(/worker \d failed: tiny broken: refused on purpose/);
    await expect(fillParallel({ module: TINY, name: 'tiny normal' }, [1, 2] as unknown as Float64Array, { workers: 1 })).rejects.toThrow(/fillParallel: out must be a Float64Array/);
    await expect(fillParallel({ module: TINY, name: 'tiny normal' }, new Float64Array(1), { seed: -1 })).rejects.toThrow(/fillParallel: options.seed must be an integer .*-1/);
  });
});

describe('createParallelFiller', () => {
  it('repeated fills on one pool equal partitionedFill for each seed; plain and shared arrays; fewer draws than workers', async () => {
    const { createParallelFiller } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { partitionedFill } = (await import(dist('index.node.js'))) /* what import 'exactdraw' loads in Node */ as typeof import('../../src/index.js');
    const { samplers } = (await import(resolve(TINY))) as { samplers: import('../../src/node/index.js').SuiteEntry[] };
    const fast = samplers.find((e) => e.name === 'tiny fast normal') as import('../../src/node/index.js').SuiteEntry;
    const filler = await createParallelFiller({ module: TINY, name: 'tiny fast normal' }, { workers: 3 });
    try {
      expect(filler.workers).toBe(3);
      for (const seed of [1, 2, 1]) {
        const got = await filler.fill(new Float64Array(30_001), { seed });
        expect(Array.from(got)).toEqual(Array.from(partitionedFill(fast.create, new Float64Array(30_001), 3, seed)));
      }
      const shared = new Float64Array(new SharedArrayBuffer(8 * 5000), 8 * 1000, 3000);
      await filler.fill(shared, { seed: 8 });
      expect(Array.from(shared)).toEqual(Array.from(partitionedFill(fast.create, new Float64Array(3000), 3, 8)));
      const two = await filler.fill(new Float64Array(2), { seed: 8 });
      expect(Array.from(two)).toEqual(Array.from(partitionedFill(fast.create, new Float64Array(2), 3, 8)));
      // one fill at a time
      const first = filler.fill(new Float64Array(1000), { seed: 3 });
      await expect(filler.fill(new Float64Array(10), { seed: 3 })).rejects.toThrow(/already running/);
      await first;
    } finally {
      await filler.close();
    }
    await expect(filler.fill(new Float64Array(10))).rejects.toThrow(/closed/);
  });

  it('a fill that throws in a worker rejects with its message and the pool stays usable; a worker that exits rejects and the pool then refuses', async () => {
    const { createParallelFiller } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const BROKEN = 'test/fixtures/tiny-broken.mjs';
    const f = await createParallelFiller({ module: BROKEN, name: 'tiny throws on seed 13' }, { workers: 2 });
    try {
      await expect(f.fill(new Float64Array(100), { seed: 13 })).rejects.toThrow(/worker \d failed: tiny: refused seed 13 on purpose/);
      const ok = await f.fill(new Float64Array(100), { seed: 14 });
      expect(ok.every((x) => x >= 0 && x < 1)).toBe(true);
    } finally {
      await f.close();
    }
    const g = await createParallelFiller({ module: BROKEN, name: 'tiny exits' }, { workers: 1 });
    await expect(g.fill(new Float64Array(10), { seed: 1 })).rejects.toThrow(/worker 0 exited with code 3/);
    await expect(g.fill(new Float64Array(10), { seed: 1 })).rejects.toThrow(/exited with code 3/);
    await g.close();
  });

  it('createParallelFiller rejects an unknown entry, a failing module and bad worker counts', async () => {
    const { createParallelFiller } = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    await expect(createParallelFiller({ module: TINY, name: 'nope' }, { workers: 2 })).rejects.toThrow(/no sampler named 'nope'/);
    await expect(createParallelFiller({ module: 'test/fixtures/does-not-exist.mjs', name: 'x' }, { workers: 1 })).rejects.toThrow(/worker 0 failed/);
    await expect(createParallelFiller({ module: TINY, name: 'tiny normal' }, { workers: 1.5 })).rejects.toThrow(/createParallelFiller: options.workers must be an integer .*1\.5/);
    await expect(createParallelFiller({ module: 3 } as unknown as { module: string; name: string })).rejects.toThrow(/createParallelFiller: spec must be/);
  });
});

describe('exactdraw/node options and names', () => {
  it('option typos in every entry are InvalidOptionError listing the known keys; bad values name the option and quote strings', async () => {
    const node = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { InvalidOptionError, InvalidTargetError } = (await import(dist('index.node.js'))) /* what import 'exactdraw' loads in Node */ as typeof import('../../src/index.js');
    const spec = { module: TINY, name: 'tiny normal' };
    const refused = async (p: Promise<unknown>, cls: new (...a: never[]) => Error, text: string): Promise<void> => {
      const e = await p.then(
        () => undefined,
        (x: unknown) => x,
      );
      expect(e, text).toBeInstanceOf(cls);
      expect((e as Error).message).toContain(text);
    };
    await refused(node.fillParallel(spec, new Float64Array(10), { worker: 2 } as never), InvalidOptionError, "fillParallel: unknown option 'worker' (known: 'workers', 'seed')");
    await refused(node.createParallelFiller(spec, { workerz: 2 } as never), InvalidOptionError, "createParallelFiller: unknown option 'workerz' (known: 'workers')");
    await refused(node.fillParallel(spec, new Float64Array(10), { workers: '2' } as never), InvalidOptionError, "fillParallel: options.workers must be an integer in [1, 256], got '2'");
    await refused(node.fillParallel(spec, new Float64Array(10), { seed: null } as never), InvalidOptionError, 'fillParallel: options.seed must be an integer in [0, 2^53 - 1], got null');
    await refused(node.fillParallel({ ...spec, nmae: 'x' } as never, new Float64Array(10)), InvalidOptionError, "fillParallel: spec has an unknown key 'nmae'");
    const filler = await node.createParallelFiller(spec, { workers: 1 });
    try {
      // the README's replicate loop with a typo: refused instead of silently using the default seed
      await refused(filler.fill(new Float64Array(10), { sed: 5 } as never), InvalidOptionError, "createParallelFiller(...).fill: unknown option 'sed' (known: 'seed')");
      await refused(filler.fill(new Float64Array(10), { seed: '5' } as never), InvalidOptionError, "got '5'");
      // twin: the right key works, and different seeds give different draws
      const a = Array.from(await filler.fill(new Float64Array(10), { seed: 5 }));
      const b = Array.from(await filler.fill(new Float64Array(10), { seed: 6 }));
      expect(a).not.toEqual(b);
    } finally {
      await filler.close();
    }
    // unknown sampler names: typed, listing the known names
    await refused(node.fillParallel({ module: TINY, name: 'nope' }, new Float64Array(10), { workers: 1 }), InvalidTargetError, "fillParallel: no sampler named 'nope' in test/fixtures/tiny-suite.mjs (known: 'tiny normal', 'tiny truncated normal', 'tiny fast normal')");
    await refused(node.createParallelFiller({ module: TINY, name: 'nope' }, { workers: 1 }), InvalidTargetError, "createParallelFiller: no sampler named 'nope'");
  });

  it('validateSuite refuses entry typos (InvalidOptionError) and malformed suites (InvalidTargetError), naming the API; findSuiteEntry is typed', async () => {
    const node = (await import(dist('node/index.js'))) as typeof import('../../src/node/index.js');
    const { InvalidOptionError, InvalidTargetError } = (await import(dist('index.node.js'))) /* what import 'exactdraw' loads in Node */ as typeof import('../../src/index.js');
    const create = (): never => {
      throw new Error('not called');
    };
    expect(() => node.validateSuite('m.mjs', [{ name: 'a', create, refrence: 'x' }])).toThrow(InvalidOptionError);
    expect(() => node.validateSuite('m.mjs', [{ name: 'a', create, refrence: 'x' }])).toThrow("validateSuite: m.mjs samplers[0] has an unknown key 'refrence' (known: 'name', 'create', 'cdf', 'reference')");
    expect(() => node.validateSuite('m.mjs', { samplers: [] })).toThrow(InvalidTargetError);
    expect(() => node.validateSuite('m.mjs', [{ name: 'a', create }, { name: 'a', create }])).toThrow("two samplers named 'a'");
    expect(node.validateSuite('m.mjs', [{ name: 'a', create }])).toHaveLength(1); // twin: a correct entry passes
    expect(() => node.findSuiteEntry([{ name: 'a', create }], 'b', 'm.mjs')).toThrow(InvalidTargetError);
    expect(node.suiteModuleUrl('x/y.mjs', '/base')).toBe('file:///base/x/y.mjs');
    expect(node.suiteModuleUrl('file:///elsewhere/y.mjs', '/base')).toBe('file:///elsewhere/y.mjs');
  });
});
