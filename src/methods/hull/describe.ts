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
  const k = h.k;
  const n = 2 * k;
  const pieces: EnvelopePiece[] = [];
  const areas: number[] = [];
  for (let j = 0; j < n; j++) {
    const la = h.logArea[j] + h.ref;
    pieces.push({
      lower: h.lo[j],
      upper: h.hi[j],
      anchor: h.ax[j],
      value: h.at[j],
      slope: h.sl[j],
      squeezeAnchor: h.sqx[j],
      squeezeValue: h.sqt[j],
      squeezeSlope: h.sqs[j],
      logArea: la,
    });
    areas.push(la);
  }
  const sq: number[] = [];
  for (let i = 0; i + 1 < k; i++) {
    const y0 = h.ty[i];
    const y1 = h.ty[i + 1];
    const w = h.tx[i + 1] - h.tx[i];
    sq.push(h.ref + pieceLogArea(h.kind, Math.max(y0, y1), Math.abs((y1 - y0) / w), w));
  }
  return {
    transform: h.kind === T_LOG ? 'log' : 'inverse-sqrt',
    construction: h.tangent ? 'tangent' : 'secant',
    logScale: h.ref,
    support: [h.lower, h.upper],
    touchPoints: Array.from(h.tx.subarray(0, k)),
    touchLogDensities: Array.from(h.tl.subarray(0, k)),
    pieces,
    logEnvelopeArea: logSumExp(areas),
    logSqueezeArea: logSumExp(sq),
    derivativeEvaluations: h.derivativeEvaluations,
  };
}
