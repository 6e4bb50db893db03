/**
 * Mutable counters behind {@link SamplerStats}. @internal
 *
 * @packageDocumentation
 */
import type { SamplerStats } from './types.js';

/** Default bound on consecutive rejections before {@link StalledSamplerError}. */
export const DEFAULT_MAX_REJECTIONS = 1_000_000;

/** Mutable counters of a sampler. @internal */
export class Counters {
  samples = 0;
  proposals = 0;
  densityEvaluations = 0;
  setupEvaluations = 0;

  /** A fresh snapshot. */
  snapshot(): SamplerStats {
    return {
      samples: this.samples,
      proposals: this.proposals,
      densityEvaluations: this.densityEvaluations,
      setupEvaluations: this.setupEvaluations,
      acceptanceRate: this.proposals > 0 ? this.samples / this.proposals : 0,
    };
  }
}
