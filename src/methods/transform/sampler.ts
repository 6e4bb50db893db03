/**
 * Samplers across a pole: draw Y from a sampler of the transformed target
 * and map each draw back to x. @internal
 *
 * @packageDocumentation
 */
import { ExactDrawError, ImproperDensityError, InvalidOptionError, InvalidTargetError, ShapeViolationError } from '../../core/errors.js';
import type { Sampler, SamplerStats, Target } from '../../core/types.js';
import { checkTarget } from '../../core/validate.js';
import type { PoleSide, PoleTarget } from '../../targets/end-distance.js';
import { buildPoleTransform } from './change-of-variables.js';
import type { PoleTransform } from './change-of-variables.js';
import { checkRepresentable, detectPoles } from './detect.js';

/**
 * Values of the `poleAt` option of {@link adaptiveRejectionSampler} and
 * {@link ratioOfUniformsSampler}: the end(s) where the density has a pole,
 * or `'auto'` to use the target's declared `poles` or to search for them.
 *
 * @example
 * ```ts
 * const where: PoleOption = 'auto';
 * adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: where, seed: 1 });
 * ```
 */
export type PoleOption = PoleSide | 'auto';

/**
 * A sampler that draws a transformed variable Y and returns x(Y).
 *
 * @example
 * ```ts
 * const s = exactSampler(gammaTarget(0.5), { seed: 1 }).sampler as TransformedSampler;
 * s.transform.description; // 'Y = log(X − 0)'
 * ```
 */
export interface TransformedSampler extends Sampler {
  /** The change of variables (its `target` is the density of Y, `toX` the map back). */
  readonly transform: PoleTransform;
  /** The sampler of Y (its draws, envelope and region are in y). */
  readonly inner: Sampler;
}

/**
 * Wraps a sampler of Y into a sampler of x = tr.toX(Y): `fill` fills with
 * y and maps in place (no allocation per draw); stats are the inner ones,
 * with `extraSetup` added to `setupEvaluations`. Read-only members named in
 * `passThrough` are forwarded (they describe Y). @internal
 */
export function mapDraws<S extends Sampler>(inner: S, tr: PoleTransform, extraSetup: number, passThrough: readonly string[] = []): TransformedSampler & S {
  const toX = tr.toX;
  const out = {
    transform: tr,
    inner,
    sample(): number {
      return toX(inner.sample());
    },
    fill(buffer: Float64Array): Float64Array {
      inner.fill(buffer);
      for (let i = 0; i < buffer.length; i++) buffer[i] = toX(buffer[i]);
      return buffer;
    },
    get stats(): SamplerStats {
      const s = inner.stats;
      return { ...s, setupEvaluations: s.setupEvaluations + extraSetup };
    },
  };
  for (const key of passThrough) {
    Object.defineProperty(out, key, {
      enumerable: true,
      get: () => {
        const v = (inner as unknown as Record<string, unknown>)[key];
        return typeof v === 'function' ? (v as (...args: unknown[]) => unknown).bind(inner) : v;
      },
    });
  }
  return out as unknown as TransformedSampler & S;
}

/** Reads and validates `options.poleAt`. @internal */
export function readPoleOption(api: string, options: unknown): PoleOption | undefined {
  if (options === null || typeof options !== 'object') return undefined;
  const v = (options as { poleAt?: unknown }).poleAt;
  if (v === undefined) return undefined;
  if (v === 'lower' || v === 'upper' || v === 'both' || v === 'auto') return v;
  throw new InvalidOptionError(
    `${api}: options.poleAt must be 'lower', 'upper', 'both' or 'auto', got ${typeof v === 'string' ? `'${v}'` : String(v)}`,
  );
}

/**
 * Builds the sampler `build` on the transformed target for the pole option
 * (on the target itself when `'auto'` finds no pole) and maps its draws back.
 * `options` are passed on without `poleAt`. @internal
 */
export function samplerAcrossPole<S extends Sampler, O extends object>(
  api: string,
  target: Target,
  option: PoleOption,
  options: O,
  build: (t: Target, options: O) => S,
  passThrough: readonly string[],
): S {
  const rest = { ...options } as O & { poleAt?: unknown };
  delete rest.poleAt;
  const pt = target as PoleTarget;
  let side: PoleSide | undefined;
  let evaluations = 0;
  if (option === 'auto') {
    side = pt.poles;
    if (side === undefined) {
      const found = detectPoles(pt, checkTarget(api, target));
      evaluations += found.evaluations;
      side = found.side;
    }
    if (side === undefined) return build(target, rest);
  } else {
    side = option;
  }
  const tr = buildPoleTransform(api, pt, side);
  const seen = checkRepresentable(api, tr);
  evaluations += seen.evaluations;
  return mapDraws(build({ ...tr.target, mode: seen.mode }, rest), tr, evaluations, passThrough);
}

/**
 * When a method refused `target` with `error` and the target has a pole at a
 * finite end, an error of the same class whose message says so and suggests
 * `poleAt`; else `error` itself. @internal
 */
export function explainPole(api: string, target: Target, error: unknown): unknown {
  if (!(error instanceof InvalidTargetError || error instanceof ImproperDensityError || error instanceof ShapeViolationError)) return error;
  let side: PoleSide | undefined;
  let notes: readonly string[] = [];
  let t;
  try {
    t = checkTarget(api, target);
    const found = detectPoles(target as PoleTarget, t);
    side = found.side;
    notes = found.notes;
  } catch (e) {
    if (e instanceof ExactDrawError) return error;
    throw e;
  }
  if (side === undefined) return error;
  const where =
    side === 'both'
      ? `at the ends ${t.lower} and ${t.upper} of the support`
      : `at the end ${side === 'lower' ? t.lower : t.upper} (the ${side} end of the support)`;
  const map =
    side === 'lower' ? `Y = log(X − ${t.lower})` : side === 'upper' ? `Y = log(${t.upper} − X)` : `Y = logit((X − ${t.lower})/${t.upper - t.lower})`;
  const msg = `${api}: the density is unbounded ${where}: ${notes.join('; ')}. Pass { poleAt: '${side}' } to sample ${map}, whose density is bounded, and map the draws back (the method's own message: ${error.message})`;
  if (error instanceof ShapeViolationError) return new ShapeViolationError(msg, error.interval);
  if (error instanceof ImproperDensityError) return new ImproperDensityError(msg);
  return new InvalidTargetError(msg);
}
