/**
 * Read-only description of a hull envelope, for plots and audits.
 *
 * @packageDocumentation
 */
import { logSumExp } from '../envelope/arith.js';
import type { EnvelopeDescription, EnvelopePiece } from '../envelope/description.js';
import { T_LOG, pieceLogArea } from '../envelope/transforms.js';
import type { Hull } from './hull.js';

/** Builds the description of a hull. @internal */
export function describeHull(h: Hull): EnvelopeDescription {
  h.flush();
  const k = h.k;
  const n = 2 * k;
  const pieces: EnvelopePiece[] = [];
  const areas: number[] = [];
  for (let j = 0; j < n; j++) {
    const la = h.pieceLogArea(j) + h.ref;
    pieces.push({
      lower: h.lo[j],
      upper: h.hi[j],
      anchor: h.lineAnchor[j],
      value: h.lineValue[j],
      slope: h.lineSlope[j],
      squeezeAnchor: h.squeezeAnchor[j],
      squeezeValue: h.squeezeValue[j],
      squeezeSlope: h.squeezeSlope[j],
      logArea: la,
    });
    areas.push(la);
  }
  const sq: number[] = [];
  for (let i = 0; i + 1 < k; i++) {
    const y0 = h.touchValue[i];
    const y1 = h.touchValue[i + 1];
    const w = h.touchX[i + 1] - h.touchX[i];
    sq.push(h.ref + pieceLogArea(h.kind, Math.max(y0, y1), Math.abs((y1 - y0) / w), w));
  }
  return {
    transform: h.kind === T_LOG ? 'log' : 'inverse-sqrt',
    construction: h.tangent ? 'tangent' : 'secant',
    logScale: h.ref,
    support: [h.lower, h.upper],
    touchPoints: Array.from(h.touchX.subarray(0, k)),
    touchLogDensities: Array.from(h.touchLogDensity.subarray(0, k)),
    pieces,
    logEnvelopeArea: logSumExp(areas),
    logSqueezeArea: logSumExp(sq),
    derivativeEvaluations: h.derivativeEvaluations,
  };
}
