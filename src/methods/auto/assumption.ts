/**
 * What exactSampler's shape scan assumes about a black-box target, in
 * numbers. @internal
 *
 * @packageDocumentation
 */
import type { ScanPoint } from '../piecewise/scan.js';

/** log f within this of its maximum counts as the body of the target for the spacing statement. @internal */
export const BODY_DROP = 30;

/** Spacings of the scan: the finest, and the coarsest within the body (log f ≥ max − {@link BODY_DROP}). @internal */
export interface ScanSpacing {
  readonly finestSpacing: number;
  readonly finestSpacingAt: number;
  readonly bodySpacing: number;
  readonly bodySpacingAt: number;
}

/** Computes {@link ScanSpacing} from sorted scan points. @internal */
export function scanSpacing(pts: readonly ScanPoint[], logMax: number): ScanSpacing {
  let finest = Infinity;
  let finestAt = NaN;
  let body = 0;
  let bodyAt = NaN;
  for (let i = 0; i + 1 < pts.length; i++) {
    const p = pts[i];
    const q = pts[i + 1];
    if (!(p.l > -Infinity && q.l > -Infinity)) continue;
    const h = q.x - p.x;
    const mid = 0.5 * p.x + 0.5 * q.x;
    if (h > 0 && h < finest) {
      finest = h;
      finestAt = mid;
    }
    if (p.l >= logMax - BODY_DROP && q.l >= logMax - BODY_DROP && h > body) {
      body = h;
      bodyAt = mid;
    }
  }
  return { finestSpacing: finest === Infinity ? NaN : finest, finestSpacingAt: finestAt, bodySpacing: body === 0 ? NaN : body, bodySpacingAt: bodyAt };
}

function g(x: number): string {
  return Number.isFinite(x) ? Number(x.toPrecision(3)).toString() : String(x);
}

/** The assumption sentence of a black-box choice. @internal */
export function blackBoxAssumption(points: number, s: ScanSpacing, why = 'no logDensityBounds'): string {
  return (
    `black-box target (${why}): the shape scan evaluated log f at ${points} points, ` +
    `${g(s.finestSpacing)} apart at the closest (near x = ${g(s.finestSpacingAt)}) and up to ${g(s.bodySpacing)} apart where log f is within ${BODY_DROP} of its maximum (near x = ${g(s.bodySpacingAt)}), ` +
    `farther apart in the tails. The choice assumes the density has no feature narrower than the local spacing: ` +
    `a narrow mode or spike between scan points can be missed, and a method whose envelope never proposes there never sees it ` +
    `(e.g. 0.7·N(0, 1) + 0.3·N(6, 0.001²): the mode at 6 is 0.001 wide). ` +
    `For a proof, give target.logDensityBounds (a formula target has them): exactSampler then uses certifiedSampler or a proven hull`
  );
}
