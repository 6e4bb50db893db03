/**
 * Piece areas and inversions of the two hull transforms, against closed forms
 * written independently here and against Simpson quadrature.
 */
import { describe, expect, it } from 'vitest';
import { T_INV_SQRT, T_LOG, invertPiece, logHeight, pieceConstant, pieceLogArea, transformSlope, transformValue } from '../../../src/methods/envelope/transforms.js';
import { simpson } from '../../helpers/quadrature.js';

/** Log of ∫_0^w e^(tH − s·d) dd by Simpson quadrature (common practice). */
function logAreaLogQuad(tH: number, s: number, w: number): number {
  return Math.log(simpson((d) => tH - s * d, 0, w, 2000));
}
/** Log of ∫_0^w (a + s·d)^(−2) dd by Simpson quadrature, a = −tH. */
function logAreaInvQuad(tH: number, s: number, w: number): number {
  const a = -tH;
  return Math.log(simpson((d) => -2 * Math.log(a + s * d), 0, w, 2000));
}

describe('pieceLogArea', () => {
  it('pieceLogArea(log) matches quadrature for moderate slopes and heights', () => {
    for (const [tH, s, w] of [
      [0, 1, 1],
      [-3, 0.2, 5],
      [2, 7, 0.3],
      [-700, 1.5, 2],
    ]) {
      expect(pieceLogArea(T_LOG, tH, s, w)).toBeCloseTo(logAreaLogQuad(tH, s, w), 9);
    }
  });

  it('pieceLogArea(log) keeps full precision for a nearly flat piece', () => {
    // ∫_0^w e^(−s d) = w (1 − z/2 + z²/6 − …), z = s w (Taylor series, common practice)
    const s = 1e-9;
    const w = 3;
    const z = s * w;
    const series = Math.log(w) + Math.log1p(-z / 2 + (z * z) / 6);
    expect(Math.abs(pieceLogArea(T_LOG, 0, s, w) - series)).toBeLessThan(1e-15);
    expect(pieceLogArea(T_LOG, -2, 0, 4)).toBe(-2 + Math.log(4));
  });

  it('pieceLogArea(log) of an exponential tail is tH − log(s), and is infinite without decay', () => {
    // ∫_0^∞ e^(tH − s d) dd = e^tH / s (common practice)
    expect(pieceLogArea(T_LOG, -1, 2, Infinity)).toBeCloseTo(-1 - Math.log(2), 14);
    expect(pieceLogArea(T_LOG, -1, 0, Infinity)).toBe(Infinity);
    expect(pieceLogArea(T_LOG, -1, 2, 0)).toBe(-Infinity);
  });

  it('pieceLogArea(inverse-sqrt) matches quadrature, including slope 0', () => {
    for (const [tH, s, w] of [
      [-1, 1, 1],
      [-2, 0, 3],
      [-0.5, 10, 0.2],
      [-1e6, 3e6, 2],
    ]) {
      expect(pieceLogArea(T_INV_SQRT, tH, s, w)).toBeCloseTo(logAreaInvQuad(tH, s, w), 8);
    }
  });

  it('pieceLogArea(inverse-sqrt) of a tail is −log(s·a), and is infinite when the line does not stay below 0', () => {
    // ∫_0^∞ (a + s d)^(−2) dd = 1/(s·a) (common practice)
    expect(pieceLogArea(T_INV_SQRT, -2, 0.5, Infinity)).toBeCloseTo(-Math.log(0.5 * 2), 14);
    expect(pieceLogArea(T_INV_SQRT, -2, 0, Infinity)).toBe(Infinity);
    expect(pieceLogArea(T_INV_SQRT, 0, 1, 1)).toBe(Infinity);
  });
});

describe('invertPiece', () => {
  /** Normalized cdf of the piece at distance d, written from the densities directly. */
  const cdfLog = (s: number, w: number, d: number): number => (1 - Math.exp(-s * d)) / (1 - Math.exp(-s * w));
  const cdfInv = (a: number, s: number, w: number, d: number): number =>
    w === Infinity ? (s * d) / (a + s * d) : (d / (a * (a + s * d))) / (w / (a * (a + s * w)));

  it('invertPiece(log) inverts the piece cdf', () => {
    for (const [s, w] of [
      [1, 1],
      [0.01, 50],
      [30, 0.5],
      [2, Infinity],
    ]) {
      const q = pieceConstant(T_LOG, 0, s, w);
      for (const u of [0, 1e-12, 0.1, 0.5, 0.9, 1 - 1e-12]) {
        const d = invertPiece(T_LOG, q, s, w, u);
        expect(d).toBeGreaterThanOrEqual(0);
        expect(d).toBeLessThanOrEqual(w);
        const c = w === Infinity ? 1 - Math.exp(-s * d) : cdfLog(s, w, d);
        expect(Math.abs(c - u)).toBeLessThan(1e-12);
      }
    }
  });

  it('invertPiece(log) of a flat piece is uniform', () => {
    const q = pieceConstant(T_LOG, 0, 1e-20, 2);
    expect(q).toBe(0);
    expect(invertPiece(T_LOG, q, 1e-20, 2, 0.25)).toBe(0.5);
  });

  it('invertPiece(inverse-sqrt) inverts the piece cdf, finite and tail pieces', () => {
    for (const [tH, s, w] of [
      [-1, 1, 1],
      [-3, 0, 2],
      [-0.2, 40, 1],
      [-2, 0.5, Infinity],
    ]) {
      const a = -tH;
      const q = pieceConstant(T_INV_SQRT, tH, s, w);
      for (const u of [0, 1e-12, 0.3, 0.5, 0.99, 1 - 1e-12]) {
        const d = invertPiece(T_INV_SQRT, q, s, w, u);
        expect(d).toBeGreaterThanOrEqual(0);
        expect(d).toBeLessThanOrEqual(w);
        if (s > 0 || w < Infinity) expect(Math.abs(cdfInv(a, s, w, d) - u)).toBeLessThan(1e-10);
      }
    }
  });
});

describe('transformValue / transformSlope / logHeight', () => {
  it('transformValue and logHeight are inverse to each other for both transforms', () => {
    for (const lr of [-500, -3, 0, 0.7]) {
      expect(logHeight(T_LOG, transformValue(T_LOG, lr))).toBe(lr);
      expect(logHeight(T_INV_SQRT, transformValue(T_INV_SQRT, lr))).toBeCloseTo(lr, 12);
    }
    expect(logHeight(T_INV_SQRT, 0)).toBe(Infinity);
  });

  it('transformSlope(inverse-sqrt) is the chain rule d/dx(−f^(−1/2)) = f^(−1/2)·(log f)′/2', () => {
    // central difference of −exp(−l(x)/2) for l(x) = −x²/2 at x = 0.7 (common practice)
    const l = (x: number): number => -0.5 * x * x;
    const x = 0.7;
    const h = 1e-5;
    const fd = (transformValue(T_INV_SQRT, l(x + h)) - transformValue(T_INV_SQRT, l(x - h))) / (2 * h);
    expect(transformSlope(T_INV_SQRT, transformValue(T_INV_SQRT, l(x)), -x)).toBeCloseTo(fd, 8);
  });
});
