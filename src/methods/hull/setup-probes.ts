/**
 * The probing strategy of hull setup: where to evaluate the target next so
 * that the envelope becomes valid and integrable (outward steps that
 * accelerate on unbounded sides, halving towards finite ends, the peak of a
 * piece that rises too high). Only setup uses it; the hull itself is storage
 * and geometry. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError } from '../../core/errors.js';
import { T_LOG, logHeight } from '../envelope/transforms.js';
import { SETUP_MAX_RELATIVE_HEIGHT } from './hull.js';
import type { Hull } from './hull.js';

/**
 * How far (log units) an interior piece of a valid hull may rise above the
 * highest touch point before setup probes its peak anyway: e^4 ≈ 55 times
 * the largest density seen. A hull built from well-placed start points
 * never comes near it (tangents at the mode ± one scale of a normal rise 1
 * unit above their touch points); one built from a single start point far
 * from the mode can (a normal started at 7 got touch points −4, 4, 6, 7 and
 * a peak 16 units high at 0: acceptance 0.0017, and with a small
 * `maxPieces` the kernel never adds the points that would fix it). @internal
 */
export const SETUP_QUALITY_LOG_HEIGHT = 4;

/** At most this many setup probes are spent on {@link SETUP_QUALITY_LOG_HEIGHT} per target. @internal */
export const SETUP_QUALITY_PROBES = 8;

/** Next setup probes for a hull (keeps the outward step lengths). @internal */
export class SetupProbes {
  private leftStep = 0;
  private rightStep = 0;
  private leftGrowth = 2;
  private rightGrowth = 2;
  private qualityProbes = 0;

  /**
   * @param hull - the hull being set up
   * @param scale - length scale of the first outward step
   */
  constructor(
    private readonly hull: Hull,
    private scale: number,
  ) {}

  /** Starts over for a new target in the same hull (a sampler that reuses its hull keeps one of these). */
  reset(scale: number): this {
    this.scale = scale;
    this.leftStep = 0;
    this.rightStep = 0;
    this.leftGrowth = 2;
    this.rightGrowth = 2;
    this.qualityProbes = 0;
    return this;
  }

  /**
   * The next point setup should probe so that the envelope becomes valid
   * and integrable, or NaN when it already is.
   * @throws {@link ImproperDensityError} when a tail cannot be bounded
   */
  next(): number {
    const h = this.hull;
    const k = h.k;
    const tx = h.touchX;
    const spread = k > 1 ? tx[k - 1] - tx[0] : 0;
    const base = Math.max(spread, this.scale, Math.abs(tx[0]) * 4.4e-16, 5e-324);
    if (!h.tangent && k < 3) {
      // derivative-free hulls need three touch points
      if (h.upper > tx[k - 1]) return this.outward(1, base);
      if (h.lower < tx[0]) return this.outward(-1, base);
      return tx[0] + 0.5 * (tx[1] - tx[0]);
    }
    const sL = h.leftTailSlope();
    if (h.lower === -Infinity) {
      if (!(sL * 1e300 > 1)) return this.outward(-1, base);
    } else if (h.kind !== T_LOG && tx[0] > h.lower && !(h.touchValue[0] + sL * (h.lower - tx[0]) < 0)) {
      return this.towardBound(-1);
    }
    const sR = h.rightTailSlope();
    if (h.upper === Infinity) {
      if (!(-sR * 1e300 > 1)) return this.outward(1, base);
    } else if (h.kind !== T_LOG && tx[k - 1] < h.upper && !(h.touchValue[k - 1] + sR * (h.upper - tx[k - 1]) < 0)) {
      return this.towardBound(1);
    }
    // the hull must not rise far above the touch points
    let topTouch = -Infinity;
    for (let i = 0; i < k; i++) if (h.touchLogDensity[i] > topTouch) topTouch = h.touchLogDensity[i];
    let worst = -1;
    let worstH = topTouch - h.ref + SETUP_MAX_RELATIVE_HEIGHT;
    const last = 2 * k - 1;
    for (let j = 0; j <= last; j++) {
      if (!(h.width[j] > 0)) continue;
      const height = logHeight(h.kind, h.highValue[j]);
      if (!(height <= worstH)) {
        worst = j;
        worstH = height;
        if (height !== height) break;
      }
    }
    if (worst === 0) return this.towardBound(-1);
    if (worst === last) return this.towardBound(1);
    if (worst > 0) return this.peakOf(worst);
    // valid: an interior piece far above every touch point still gets its peak probed, a few times
    if (this.qualityProbes >= SETUP_QUALITY_PROBES) return NaN;
    let high = -1;
    let highH = topTouch - h.ref + SETUP_QUALITY_LOG_HEIGHT;
    for (let j = 1; j < last; j++) {
      if (!(h.width[j] > 0)) continue;
      const height = logHeight(h.kind, h.highValue[j]);
      if (height > highH) {
        high = j;
        highH = height;
      }
    }
    if (high < 0) return NaN;
    this.qualityProbes++;
    return this.peakOf(high);
  }

  /** Where the line of interior piece j peaks: the end of the piece that is not a touch point (or the middle of its interval). */
  private peakOf(j: number): number {
    const h = this.hull;
    const i = (j - 1) >> 1;
    const z = (j & 1) === 1 ? h.hi[j] : h.lo[j];
    const a = h.touchX[i];
    const b = h.touchX[i + 1];
    return z > a && z < b ? z : a + 0.5 * (b - a);
  }

  /** A point outside the touch points on side `side`, further out at each call. */
  private outward(side: number, base: number): number {
    const h = this.hull;
    const k = h.k;
    if (side < 0) {
      // accelerating steps (×2, ×4, ×8, …): a tail that never decays reaches 1e300 in a few dozen probes
      if (this.leftStep > 0) {
        this.leftStep *= this.leftGrowth;
        this.leftGrowth *= 2;
      } else {
        this.leftStep = base;
      }
      const x = h.touchX[0] - this.leftStep;
      if (!(x > -1e300)) this.improper(-1);
      return x > h.lower ? x : h.touchX[0] - 0.5 * (h.touchX[0] - h.lower);
    }
    if (this.rightStep > 0) {
      this.rightStep *= this.rightGrowth;
      this.rightGrowth *= 2;
    } else {
      this.rightStep = base;
    }
    const x = h.touchX[k - 1] + this.rightStep;
    if (!(x < 1e300)) this.improper(1);
    return x < h.upper ? x : h.touchX[k - 1] + 0.5 * (h.upper - h.touchX[k - 1]);
  }

  private towardBound(side: number): number {
    const h = this.hull;
    const k = h.k;
    const t = side < 0 ? h.touchX[0] : h.touchX[k - 1];
    const bnd = side < 0 ? h.lower : h.upper;
    const mid = t + 0.5 * (bnd - t);
    return Math.abs(bnd - t) <= 1e-12 * Math.max(1, Math.abs(t)) || mid === t ? bnd : mid;
  }

  private improper(side: number): never {
    const h = this.hull;
    const k = h.k;
    const x = side < 0 ? h.touchX[0] : h.touchX[k - 1];
    throw new ImproperDensityError(
      `${h.api}: the ${side < 0 ? 'left' : 'right'} tail does not decay: logDensity keeps ${side < 0 ? 'increasing towards -Infinity' : 'increasing towards +Infinity'} (last touch point x = ${x}, logDensity = ${side < 0 ? h.touchLogDensity[0] : h.touchLogDensity[k - 1]}); the density has infinite mass, or its mode lies beyond ±1e300`,
    );
  }
}
