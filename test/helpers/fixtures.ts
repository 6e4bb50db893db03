/**
 * Targets used across the test suite.
 */
import type { Target } from '../../src/core/types.js';

/**
 * Worked example: f(x) = exp(−x²/2)·(sin²(6x) + 3·cos²(x)·sin²(4x) + 1), a
 * multimodal unnormalized density (invented for the tests). Values computed
 * by quadrature independently of this code (test/reference/README.md;
 * regenerate with `node test/reference/multimodal-quadrature.mjs`):
 * Z on the line 5.894340, Z on [−3, 3] 5.879611, sup f = 4.149073,
 * sup f / (U(−3, 3) density) = 24.8944, sup f / φ = 10.9403.
 */
export function multimodalLogDensity(x: number): number {
  const s6 = Math.sin(6 * x);
  const c1 = Math.cos(x);
  const s4 = Math.sin(4 * x);
  return -0.5 * x * x + Math.log(s6 * s6 + 3 * c1 * c1 * s4 * s4 + 1);
}

/** Derivative of {@link multimodalLogDensity}. */
export function multimodalDLogDensity(x: number): number {
  const s6 = Math.sin(6 * x);
  const c6 = Math.cos(6 * x);
  const c1 = Math.cos(x);
  const s1 = Math.sin(x);
  const s4 = Math.sin(4 * x);
  const c4 = Math.cos(4 * x);
  const g = s6 * s6 + 3 * c1 * c1 * s4 * s4 + 1;
  const dg = 12 * s6 * c6 + 3 * (-2 * c1 * s1 * s4 * s4 + c1 * c1 * 8 * s4 * c4);
  return -x + dg / g;
}

/** The worked example on the whole line (no cdf: tests build one by quadrature). */
export function multimodalTarget(): Target {
  return { logDensity: multimodalLogDensity, dLogDensity: multimodalDLogDensity };
}

/** The worked example truncated to [−3, 3]. */
export function multimodalTruncated(): Target {
  return {
    logDensity: (x: number) => (x >= -3 && x <= 3 ? multimodalLogDensity(x) : -Infinity),
    dLogDensity: multimodalDLogDensity,
    support: [-3, 3],
  };
}

/** Published/quadrature constants for the worked example (see {@link multimodalLogDensity}). */
export const MULTIMODAL = {
  zLine: 5.89434, // quadrature, test/reference/README.md
  zTruncated: 5.879611, // quadrature, test/reference/README.md
  supF: 4.149073, // quadrature, test/reference/README.md
  cUniform: 24.8944, // quadrature, test/reference/README.md
  cNormal: 10.9403, // quadrature, test/reference/README.md
} as const;
