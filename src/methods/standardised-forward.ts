/**
 * What the samplers of x built over a sampler of the standardised Z
 * forward, and how their descriptions map from z to x (x = loc + 2^k·z:
 * points mapped, slopes divided by 2^k, log-areas + k·log 2, log-densities
 * unchanged). @internal
 *
 * @packageDocumentation
 */
import type { TableDescription } from './table/describe.js';
import { areaX, clampX, envelopeInX, pointX } from './transform/standardise.js';
import type { Forward, Standardisation } from './transform/standardise.js';

/** A strip table described in z, in x. @internal */
export function tableInX(t: TableDescription, st: Standardisation): TableDescription {
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

/** Forwarded members of the hull samplers (plain and table). @internal */
export const HULL_FORWARD: Readonly<Record<string, Forward>> = { envelope: envelopeInX, table: tableInX };
/** Forwarded members of a sampler across a pole (they describe Y, which the map leaves alone). @internal */
export const POLE_FORWARD: Readonly<Record<string, Forward>> = { transform: 'as-is', inner: 'as-is' };
