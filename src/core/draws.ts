/**
 * The one sampler wrapper: `sample` and `fill` over a method's fill kernel,
 * with the after-failure behaviour every method shares. @internal
 *
 * @packageDocumentation
 */
import { InvalidOptionError, InvalidTargetError, StalledSamplerError } from './errors.js';
import { checkFillArray } from './validate.js';

/** A method's draw loop: writes draws to `out[0..n)` in order, or throws. @internal */
export type FillKernel = (out: Float64Array, n: number) => void;

/** `sample` and `fill` of a sampler. @internal */
export interface Draws {
  sample(): number;
  fill(out: Float64Array): Float64Array;
  /** True once the kernel threw an error after which the sampler is unusable. */
  failed(): boolean;
  /** Forgets that error: for a sampler whose target is replaced (`conditionalSampler.retarget`). */
  clearFailure(): void;
}

/**
 * True for the errors after which a sampler stays usable: a stall
 * ({@link StalledSamplerError}: a run of rejections, no wrong draw) and an
 * invalid value from an injected uniform source. Every other error thrown
 * while drawing (a non-finite density, an envelope or shape violation, an
 * exception from the target itself) shows that the sampler cannot draw
 * correctly from this target. @internal
 */
export function leavesSamplerUsable(e: unknown): boolean {
  return e instanceof StalledSamplerError || e instanceof InvalidTargetError || e instanceof InvalidOptionError;
}

/**
 * Wraps a fill kernel into `sample` and `fill` with the behaviour every
 * method documents (see DEVELOPERS.md, "After a failure"):
 *
 * - `fill(out)` checks `out`, then runs the kernel over all of it.
 * - When the kernel throws an error after which the sampler is unusable
 *   (see {@link leavesSamplerUsable}), the error is kept and every later
 *   `sample` or `fill` throws the same error object without drawing.
 * - After `fill` throws (any error), `out[0..k)` hold the draws completed
 *   before the failure (`k` is the increase of `stats.samples`) and the rest
 *   of `out` is unchanged. Draws made before an envelope or shape violation
 *   was found came from the envelope that was proved wrong: discard them.
 * @internal
 */
export function wrapDraws(api: string, kernel: FillKernel): Draws {
  let failure: unknown;
  const scratch = new Float64Array(1);
  const run = (out: Float64Array, n: number): void => {
    if (failure !== undefined) throw failure;
    try {
      kernel(out, n);
    } catch (e) {
      if (!leavesSamplerUsable(e)) failure = e;
      throw e;
    }
  };
  return {
    sample(): number {
      run(scratch, 1);
      return scratch[0];
    },
    fill(out: Float64Array): Float64Array {
      checkFillArray(api, out);
      run(out, out.length);
      return out;
    },
    failed: () => failure !== undefined,
    clearFailure(): void {
      failure = undefined;
    },
  };
}
