/**
 * The `sample`/`fill`/`stats` face shared by the discrete rejection methods:
 * one draw function, counted, filled into a Float64Array or an Int32Array.
 * @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import type { DiscreteSampler } from '../types.js';
import { checkDiscreteFillArray, int32RangeError } from '../validate.js';

/** Wraps `draw` (one exact draw per call) as a {@link DiscreteSampler}. @internal */
export function discreteDraws(api: string, draw: () => number, counters: Counters): DiscreteSampler {
  return {
    sample(): number {
      const k = draw();
      counters.samples++;
      return k;
    },
    fill<T extends Float64Array | Int32Array>(out: T): T {
      checkDiscreteFillArray(api, out);
      const n = out.length;
      if (out instanceof Int32Array) {
        for (let i = 0; i < n; i++) {
          const k = draw();
          if (k > 2147483647 || k < -2147483648) throw int32RangeError(api, k);
          out[i] = k;
          counters.samples++;
        }
      } else {
        for (let i = 0; i < n; i++) {
          out[i] = draw();
          counters.samples++;
        }
      }
      return out;
    },
    get stats() {
      return counters.snapshot();
    },
  };
}
