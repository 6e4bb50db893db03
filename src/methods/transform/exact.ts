/**
 * exactSampler across a pole: the change of variables chosen automatically.
 * @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError, NonFiniteDensityError } from '../../core/errors.js';
import type { SamplerStats, Target } from '../../core/types.js';
import type { CheckedTarget } from '../../core/validate.js';
import type { PoleSide, PoleTarget } from '../../targets/end-distance.js';
import type { ExactChoice, ExactSampler } from '../auto/types.js';
import { buildPoleTransform } from './change-of-variables.js';
import { checkRepresentable, detectPoles } from './detect.js';
import { mapDraws } from './sampler.js';

/** Transformed targets built here: they are never transformed again. */
const transformed = new WeakSet<object>();

/**
 * For {@link exactSampler}: when the target declares poles or has a pole
 * at a finite end other than 0 (`error` undefined: before the scan), or when the shape scan refused it (`error`, an
 * InvalidTargetError or a +Infinity at an end) and a pole is found at a
 * finite end, the exact sampler of the transformed variable (built by
 * `build`) with its draws mapped back; else undefined (the caller goes on,
 * or rethrows). `spent` are the logDensity calls the caller's scan made.
 * @internal
 */
export function exactAcrossPoles(
  api: string,
  target: Target,
  t: CheckedTarget,
  error: unknown,
  build: (y: Target) => ExactSampler,
  spent: number,
): ExactSampler | undefined {
  if (transformed.has(target)) return undefined;
  const pt = target as PoleTarget;
  let side: PoleSide | undefined;
  let how: string;
  let evaluations = spent;
  if (error === undefined && pt.poles !== undefined) {
    side = pt.poles;
    how = 'declared by target.poles';
  } else if (error === undefined) {
    // The scan sees a pole at an end e only down to distances of a few hundred
    // spacings of the doubles at e: at e ≠ 0 that is far too coarse, so probe such ends first.
    const nonzeroEnd = (e: number): boolean => Number.isFinite(e) && e !== 0;
    if (!nonzeroEnd(t.lower) && !nonzeroEnd(t.upper)) return undefined;
    const found = detectPoles(pt, t);
    evaluations += found.evaluations;
    side = found.side;
    if (side === undefined) return undefined;
    how = found.notes.join('; ');
  } else {
    const endInfinity = error instanceof NonFiniteDensityError && error.value === Infinity && (error.x === t.lower || error.x === t.upper);
    if (!(error instanceof InvalidTargetError) && !endInfinity) return undefined;
    const found = detectPoles(pt, t);
    evaluations += found.evaluations;
    side = found.side;
    if (side === undefined) return undefined;
    how = found.notes.join('; ');
  }
  const tr = buildPoleTransform(api, pt, side);
  const seen = checkRepresentable(api, tr);
  evaluations += seen.evaluations;
  const yTarget: Target = { ...tr.target, mode: seen.mode };
  transformed.add(yTarget);
  const inner = build(yTarget);
  const s = mapDraws(inner, tr, evaluations);
  const where = side === 'both' ? `at both ends ${t.lower} and ${t.upper}` : `at the ${side} end ${side === 'lower' ? t.lower : t.upper}`;
  const smallest = side === 'both' ? Math.min(tr.minDistanceLower, tr.minDistanceUpper) : side === 'lower' ? tr.minDistanceLower : tr.minDistanceUpper;
  const c = inner.choice;
  const choice: ExactChoice = Object.freeze({
    method: c.method,
    table: c.table,
    assumption: c.assumption,
    proof: c.proof,
    transform: c.transform,
    power: c.power,
    reason: `the density is unbounded ${where} (${how}): the change of variables ${tr.description} removes the pole (distances to the end down to ${smallest.toPrecision(3)} represented), and the draws of Y are mapped back; for Y: ${c.reason}`,
    rejected: c.rejected,
    scan: c.scan,
  });
  const sampler = mapDraws(inner.sampler, tr, 0);
  return {
    choice,
    sampler,
    sample: s.sample,
    fill: s.fill,
    get stats(): SamplerStats {
      return s.stats;
    },
  };
}
