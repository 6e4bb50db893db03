/**
 * Round axis ticks (1-2-5 steps) for the SVG figures. @internal
 *
 * @packageDocumentation
 */
import { log10, pow } from '../vendor/math.js';

/** Ticks of an axis: positions and their labels. @internal */
export interface AxisTicks {
  /** The step between ticks: 1, 2 or 5 times a power of ten. */
  readonly step: number;
  /** Tick values, increasing, inside [lo, hi]. */
  readonly values: readonly number[];
  /** Labels of the values (no floating-point noise: 0.30000000000000004 is "0.3"). */
  readonly labels: readonly string[];
}

/**
 * Round ticks over [lo, hi]: the smallest step of the form 1, 2 or 5 × 10^k
 * that gives at most `maxTicks` ticks, and the multiples of it in [lo, hi]
 * (common practice for plot axes). @internal
 */
export function roundTicks(lo: number, hi: number, maxTicks = 7): AxisTicks {
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && hi > lo)) return { step: NaN, values: [], labels: [] };
  const raw = (hi - lo) / Math.max(1, maxTicks - 1);
  let p = pow(10, Math.floor(log10(raw)));
  let step = p;
  for (let guard = 0; guard < 8; guard++) {
    step = [1, 2, 5].map((m) => m * p).find((s) => Math.floor(hi / s) - Math.ceil(lo / s) + 1 <= maxTicks) ?? NaN;
    if (step === step) break;
    p *= 10;
  }
  const k0 = Math.ceil(lo / step - 1e-9);
  const k1 = Math.floor(hi / step + 1e-9);
  const decimals = Math.max(0, -Math.floor(log10(step) + 1e-9));
  const values: number[] = [];
  const labels: string[] = [];
  for (let k = k0; k <= k1 && values.length < 50; k++) {
    const v = Number((k * step).toFixed(decimals));
    values.push(v);
    labels.push(formatTick(v, step, decimals));
  }
  return { step, values, labels };
}

function formatTick(v: number, step: number, decimals: number): string {
  if (v === 0) return '0';
  if (step >= 1e-4 && Math.abs(v) < 1e6) return v.toFixed(decimals);
  // very small or very large values: a mantissa with as many digits as the step needs
  const digits = Math.max(0, Math.floor(log10(Math.abs(v))) - Math.floor(log10(step) + 1e-9));
  return v.toExponential(Math.min(digits, 6)).replace('e+', 'e');
}
