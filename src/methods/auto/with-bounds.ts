/**
 * exactSampler for targets with interval bounds: prove the shape instead of
 * scanning it. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError, InvalidTargetError, ShapeViolationError } from '../../core/errors.js';
import type { Sampler, SamplerStats, Target } from '../../core/types.js';
import { adaptiveRejectionSampler } from '../adaptive-rejection.js';
import { certifiedSampler } from '../certified.js';
import { splitPoint } from '../certified/cells.js';
import { tableSampler } from '../table-sampler.js';
import type { ExactChoice, ExactSampler, ExactSamplerOptions, RefusedMethod, ShapeProof, ShapeScan } from './types.js';

/** Cells the concavity proof may examine before it gives up (undecided). @internal */
export const PROOF_MAX_CELLS = 512;

type Bounds = (a: number, b: number) => readonly [number, number];

function read(api: string, name: string, f: Bounds, a: number, b: number): [number, number] {
  const r = f(a, b);
  if (r === null || typeof r !== 'object' || typeof r[0] !== 'number' || typeof r[1] !== 'number' || r[0] !== r[0] || r[1] !== r[1] || r[0] > r[1]) {
    throw new InvalidTargetError(`${api}: target.${name}(${a}, ${b}) must return a pair [lo, hi] of numbers with lo <= hi, got ${String(r)}`);
  }
  return [r[0], r[1]];
}

/**
 * Tries to cover [lower, upper] by cells on each of which the bounds prove
 * the condition: log-concave when (log f)″ ≤ 0; T-concave for T(f) = −1/√f
 * when (log f)″ ≤ ((log f)′)²/2 (T″ = e^(−log f/2)·((log f)″/2 − ((log f)′)²/4)),
 * which holds on a cell when the upper bound of (log f)″ is at most half the
 * smallest square of (log f)′ there. Bisection (geometric steps on infinite
 * cells), at most {@link PROOF_MAX_CELLS} cells.
 * @internal
 */
export function proveShape(
  api: string,
  kind: 'log' | 'inverse-sqrt',
  lower: number,
  upper: number,
  d2: Bounds,
  d1: Bounds | undefined,
  maxCells = PROOF_MAX_CELLS,
): ShapeProof {
  const stack: [number, number][] = [[lower, upper]];
  let proven = 0;
  let examined = 0;
  let evaluations = 0;
  let refutedOn: readonly [number, number] | undefined;
  let undecidedOn: readonly [number, number] | undefined;
  while (stack.length > 0 && examined < 4 * maxCells) {
    const cell = stack.pop() as [number, number];
    const [a, b] = cell;
    examined++;
    const [lo2, hi2] = read(api, 'd2LogDensityBounds', d2, a, b);
    evaluations++;
    let limit = 0;
    let refuted = lo2 > 0;
    if (kind === 'inverse-sqrt') {
      if (d1 === undefined) {
        refuted = false;
        limit = 0;
      } else {
        const [lo1, hi1] = read(api, 'dLogDensityBounds', d1, a, b);
        evaluations++;
        const m = lo1 <= 0 && hi1 >= 0 ? 0 : Math.min(lo1 * lo1, hi1 * hi1);
        limit = 0.5 * m * (1 - 1e-12);
        // refuted when (log f)'' > ((log f)')²/2 everywhere on the cell
        const big = Math.max(lo1 * lo1, hi1 * hi1);
        refuted = lo2 > 0.5 * big * (1 + 1e-12);
      }
    }
    if (hi2 <= limit) {
      proven++;
      continue;
    }
    if (refuted) {
      refutedOn = Object.freeze([a, b] as [number, number]);
      break;
    }
    const m = splitPoint(a, b);
    if (m !== m || proven + stack.length + 2 > maxCells) {
      undecidedOn = Object.freeze([a, b] as [number, number]);
      break;
    }
    stack.push([m, b], [a, m]);
  }
  if (refutedOn === undefined && undecidedOn === undefined && stack.length > 0) undecidedOn = Object.freeze([...stack[stack.length - 1]] as [number, number]);
  const ok = refutedOn === undefined && undecidedOn === undefined;
  return Object.freeze({ transform: kind, proven: ok, cells: proven, boundEvaluations: evaluations, refutedOn, undecidedOn });
}

function describeFailure(p: ShapeProof): string {
  const what = p.transform === 'log' ? '(log f)″ ≤ 0' : '(log f)″ ≤ ((log f)′)²/2';
  if (p.refutedOn !== undefined) return `${what} is disproved on [${p.refutedOn[0]}, ${p.refutedOn[1]}]`;
  if (p.undecidedOn !== undefined) return `${what} is undecided on [${p.undecidedOn[0]}, ${p.undecidedOn[1]}] after ${p.cells} proven cells`;
  return `${what} holds`;
}

/**
 * The part of {@link exactSampler} for a target with `logDensityBounds`.
 * Returns the sampler, or — when the bounds cannot cover the target
 * (certifiedSampler refuses it: a tail not proven to decay exponentially,
 * such as a polynomial tail, or a pole) and no hull was proven — the
 * refusal, and exactSampler goes on with its scan (and says so).
 * @internal
 */
export function exactWithBounds(
  api: string,
  target: Target,
  lower: number,
  upper: number,
  opts: ExactSamplerOptions,
  fast: boolean,
  fastNote: string,
): ExactSampler | RefusedMethod {
  const pass: Record<string, unknown> = {};
  for (const k of ['seed', 'stream', 'uniform', 'maxRejections'] as const) if (opts[k] !== undefined) pass[k] = opts[k];
  const d2 = typeof target.d2LogDensityBounds === 'function' ? (target.d2LogDensityBounds.bind(target) as Bounds) : undefined;
  const d1 = typeof target.dLogDensityBounds === 'function' ? (target.dLogDensityBounds.bind(target) as Bounds) : undefined;
  const proofs: ShapeProof[] = [];
  const rejected: { method: string; error: string }[] = [];
  const support = `[${lower}, ${upper}]`;
  if (d2 !== undefined) {
    for (const kind of ['log', 'inverse-sqrt'] as const) {
      if (kind === 'inverse-sqrt' && d1 === undefined) continue;
      const p = proveShape(api, kind, lower, upper, d2, d1);
      proofs.push(p);
      if (!p.proven) continue;
      const name = `adaptive-rejection (${kind})`;
      let s: Sampler | undefined;
      try {
        s = fast ? tableSampler(target, { ...pass, transform: kind }) : adaptiveRejectionSampler(target, { ...pass, transform: kind });
      } catch (e) {
        if (!(e instanceof ShapeViolationError)) throw e;
        rejected.push({ method: name, error: e.message });
      }
      if (s === undefined) continue;
      const reason =
        kind === 'log'
          ? `log-concave, proven: the interval bounds of (log f)″ (target.d2LogDensityBounds) are ≤ 0 on all ${p.cells} cells covering the support ${support}, so tangents of log f bound it (Gilks & Wild 1992)${fastNote}`
          : `T-concave for T(f) = −1/√f, proven: the interval bounds give (log f)″ ≤ ((log f)′)²/2 on all ${p.cells} cells covering the support ${support} (${describeFailure(proofs[0])} for log-concavity), so tangents of −1/√f bound it (Hörmann 1995)${fastNote}`;
      return wrap(s, 'adaptive-rejection', kind, reason, rejected, proofs, p.boundEvaluations);
    }
  }
  let s: ReturnType<typeof certifiedSampler>;
  try {
    s = certifiedSampler(target, pass);
  } catch (e) {
    if (e instanceof ImproperDensityError || e instanceof ShapeViolationError) {
      return Object.freeze({ method: 'certified', error: e.message });
    }
    throw e;
  }
  const st = s.stats;
  const why = d2 === undefined ? 'the target has no d2LogDensityBounds, so concavity was not tried' : proofs.map(describeFailure).join('; ');
  const reason = `interval bounds given (target.logDensityBounds): certifiedSampler proved an envelope on each of its ${st.cells} cells (acceptance ≥ ${s.cells.acceptanceBound.toPrecision(4)} proven); no hull: ${why}`;
  let evals = 0;
  for (const p of proofs) evals += p.boundEvaluations;
  return wrap(s, 'certified', undefined, reason, rejected, proofs, evals);
}

function wrap(
  s: Sampler,
  method: 'adaptive-rejection' | 'certified',
  transform: 'log' | 'inverse-sqrt' | undefined,
  reason: string,
  rejected: { method: string; error: string }[],
  proofs: ShapeProof[],
  proofEvaluations: number,
): ExactSampler {
  const proven = proofs.find((p) => p.proven);
  const scan: ShapeScan = Object.freeze({
    points: 0,
    evaluations: 0,
    logConcave: proven !== undefined && proven.transform === 'log',
    convexAt: NaN,
    tConcave: proven !== undefined,
    tConvexAt: NaN,
    heavyTailExponent: NaN,
    finestSpacing: NaN,
    finestSpacingAt: NaN,
    bodySpacing: NaN,
    bodySpacingAt: NaN,
  });
  const choice: ExactChoice = Object.freeze({
    method,
    table: false,
    transform,
    power: undefined,
    reason,
    rejected: Object.freeze(rejected.map((r) => Object.freeze({ ...r }))),
    scan,
    assumption:
      method === 'certified'
        ? 'none beyond the target: every cell envelope is proven from target.logDensityBounds (and dLogDensityBounds); every evaluation is still checked against it'
        : `none beyond the target: the shape is proven from target.d2LogDensityBounds (${proofEvaluations} interval evaluations); the hull is built from point values and checks every one`,
    proof: proofs.length > 0 ? Object.freeze([...proofs]) : undefined,
  });
  return {
    choice,
    sampler: s,
    sample: () => s.sample(),
    fill: (out: Float64Array) => s.fill(out),
    get stats(): SamplerStats {
      return s.stats;
    },
  };
}
