/**
 * What the samplers of x built over a sampler of the standardised Z
 * forward, and how their descriptions map from z to x (x = loc + 2^k·z:
 * points mapped, slopes divided by 2^k, log-areas + k·log 2, log-densities
 * unchanged). @internal
 *
 * @packageDocumentation
 */
import type { PiecewiseEnvelope } from './piecewise.js';
import type { RatioOfUniformsRegion } from './ratio-of-uniforms.js';
import type { TableDescription } from './table/describe.js';
import { areaX, clampX, envelopeInX, pointX } from './transform/standardise.js';
import type { Forward, Standardisation } from './transform/standardise.js';

/** A strip table described in z, in x. */
function tableInX(t: TableDescription, st: Standardisation): TableDescription {
  return {
    ...t,
    boundaries: t.boundaries.map((z) => pointX(st, z)),
    support: [clampX(st, pointX(st, t.support[0])), clampX(st, pointX(st, t.support[1]))],
    logSureArea: areaX(st, t.logSureArea),
    logCapArea: areaX(st, t.logCapArea),
    logTailArea: areaX(st, t.logTailArea),
    logEnvelopeArea: areaX(st, t.logEnvelopeArea),
  };
}

/** A piecewise envelope described in z, in x. */
function piecewiseInX(e: PiecewiseEnvelope, st: Standardisation): PiecewiseEnvelope {
  const px = (z: number): number => pointX(st, z);
  return {
    ...e,
    support: [clampX(st, px(e.support[0])), clampX(st, px(e.support[1]))],
    pieces: e.pieces.map((p) => ({ ...p, lower: px(p.lower), upper: px(p.upper), logArea: areaX(st, p.logArea), logSqueezeArea: areaX(st, p.logSqueezeArea) })),
    gridPoints: e.gridPoints.map(px),
    logEnvelopeArea: areaX(st, e.logEnvelopeArea),
    logSqueezeArea: areaX(st, e.logSqueezeArea),
    inflections: e.inflections.map(px),
    extrema: e.extrema.map(px),
  };
}

/** A ratio-of-uniforms region described in z, in x (v scales with 2^k; u does not). */
function regionInX(r: RatioOfUniformsRegion, st: Standardisation): RatioOfUniformsRegion {
  return {
    ...r,
    shift: pointX(st, r.shift),
    argmax: pointX(st, r.argmax),
    logVMax: areaX(st, r.logVMax),
    logVMinAbs: areaX(st, r.logVMinAbs),
    scaledVMin: r.scaledVMin * st.scale,
    scaledVMax: r.scaledVMax * st.scale,
    logRectangleArea: areaX(st, r.logRectangleArea),
    logRegionAreaEstimate: areaX(st, r.logRegionAreaEstimate),
  };
}

/** Forwarded members of the hull samplers (plain and table). @internal */
export const HULL_FORWARD: Readonly<Record<string, Forward>> = { envelope: envelopeInX, table: tableInX };
/** Forwarded members of the piecewise samplers. @internal */
export const PIECEWISE_FORWARD: Readonly<Record<string, Forward>> = { envelope: piecewiseInX, table: tableInX, logEnvelope: 'point', logSqueeze: 'point' };
/** Forwarded members of the ratio-of-uniforms sampler. @internal */
export const RATIO_FORWARD: Readonly<Record<string, Forward>> = { region: regionInX, logEnvelope: 'point' };
/** Forwarded members of a sampler across a pole (they describe Y, which the map leaves alone). @internal */
export const POLE_FORWARD: Readonly<Record<string, Forward>> = { transform: 'as-is', inner: 'as-is' };
