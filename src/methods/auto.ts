/**
 * exactSampler(): picks a method from what the target offers and what each
 * method can check.
 *
 * @packageDocumentation
 */
import { ImproperDensityError, InvalidTargetError, ShapeViolationError } from '../core/errors.js';
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { checkFillArray, checkInteger, checkOptionKeys, checkTarget, resolveMaxRejections } from '../core/validate.js';
import { tableSampler } from './table-sampler.js';
import type { CheckedTarget } from '../core/validate.js';
import { adaptiveRejectionSampler } from './adaptive-rejection.js';
import { piecewiseSampler } from './piecewise.js';
import { PIECEWISE_NOISE as NOISE } from './piecewise/cells.js';
import { Evaluator } from '../core/evaluate.js';
import { scanTarget } from './piecewise/scan.js';
import type { ScanPoint } from './piecewise/scan.js';
import { ratioOfUniformsSampler } from './ratio-of-uniforms.js';
import { DEFAULT_SCAN_POINTS } from './piecewise.js';
import { blackBoxAssumption, scanSpacing } from './auto/assumption.js';
import { exactWithBounds } from './auto/with-bounds.js';
import type { ExactSamplerOptions, ExactMethod, ShapeScan, ShapeProof, RefusedMethod, ExactChoice, ExactSampler } from './auto/types.js';
export type { ExactSamplerOptions, ExactMethod, ShapeScan, ShapeProof, RefusedMethod, ExactChoice, ExactSampler } from './auto/types.js';
import { exactAcrossPoles } from './transform/exact.js';
import { FINE_GRAIN, findStandardisation, inheritCells, isStandardised, retryable, standardisationOf, mapStandardised, markStandardised, noteCoordinate, standardisedTarget } from './transform/standardise.js';
import type { Standardisation } from './transform/standardise.js';
import { HULL_FORWARD, POLE_FORWARD } from './standardised-forward.js';
import { PIECEWISE_FORWARD } from './piecewise.js';
import { RATIO_FORWARD } from './ratio-of-uniforms.js';
import { exp, log } from '../vendor/math.js';

/** Scan points of the shape scan's uniform grids (the rays come on top). */
const SHAPE_SCAN_POINTS = DEFAULT_SCAN_POINTS;

/** Evaluation budget of the shape scan. */
const SHAPE_SCAN_BUDGET = 100_000;

/** Points more than this below the maximum log-density are left out of the T-concavity test (T would overflow). */
const T_SCAN_DROP = 1200;

const KNOWN = ['seed', 'stream', 'uniform', 'maxRejections', 'expectedDraws'] as const;

/**
 * From this many expected draws on, {@link exactSampler} serves log-concave and
 * T-concave targets with the table-driven fast path ({@link tableSampler})
 * instead of the plain adaptive hull: its setup (about 500 strips) pays for
 * itself within roughly 1,000–13,000 draws (bench/fast-path.mjs), so below
 * 10,000 draws — e.g. a Gibbs step taking one draw from a fresh target — the
 * plain hull is cheaper.
 */
export const FAST_PATH_MIN_DRAWS = 10_000;

/**
 * An exact sampler for `target`, by a method chosen from what the target
 * offers and what the methods can check.
 *
 * @remarks
 * **Targets with `logDensityBounds`** (hand-written bounds, or a formula
 * target): the shape is proven, not scanned. With `d2LogDensityBounds`, the
 * support is bisected (at most 512 cells) until the bounds prove
 * (log f)″ ≤ 0 on every cell → {@link adaptiveRejectionSampler} with
 * `transform: 'log'`, *with a proof*; else, with `dLogDensityBounds` too,
 * (log f)″ ≤ ((log f)′)²/2 on every cell (−1/√f concave) → the same with
 * `transform: 'inverse-sqrt'`; otherwise, and without `d2LogDensityBounds`,
 * → {@link certifiedSampler}, whose envelope is proven on every cell.
 * `choice.reason` says which was proven, `choice.proof` holds the proofs,
 * `choice.assumption` says that nothing is assumed beyond the bounds. When
 * no hull is proven and `certifiedSampler` refuses the target (a tail not
 * proven to decay exponentially, such as the polynomial tail of a
 * Student-t, or a pole), the refusal is recorded in `choice.rejected` and
 * the target is scanned as a black-box one below (`choice.assumption` says
 * so).
 *
 * **Black-box targets** (no bounds): nothing can be proven from point
 * values, so the choice rests on an assumption, stated in numbers in
 * `choice.assumption`: the density has no feature narrower than the spacing
 * of the scan near it (`choice.scan.bodySpacing`, `finestSpacing`). A narrow
 * mode between scan points can be missed, and a method whose envelope never
 * proposes there never evaluates it, so no error is raised: e.g.
 * 0.7·N(0, 1) + 0.3·N(2.5, 1e-5²) is served by the log-concave hull and no
 * draw lands near 2.5 (test/methods/certified/exact-with-bounds.test.ts).
 * Give `logDensityBounds` (or a formula) for such targets.
 *
 * A shape scan (the piecewise method's own scan, {@link DEFAULT_SCAN_POINTS}
 * = 1024 grid points, so the chooser never resolves less than the
 * piecewise method it may fall back to; a global maximisation unless
 * `target.mode` is given, geometric rays to both ends, nested uniform grids,
 * plus `target.modes`; about 2,300 evaluations for the targets tried, counted
 * in `stats.setupEvaluations`) computes the second divided differences of
 * log f and of T(f) = −1/√f on all consecutive scan triples, with the same
 * rounding allowance as the piecewise method. Then, in this order:
 *
 * 1. log f concave at every triple → {@link adaptiveRejectionSampler} with
 *    `transform: 'log'` (Gilks & Wild 1992): the fewest evaluations and the
 *    cheapest setup, and its own checks (tangent slopes must decrease) keep
 *    watching the shape while it adapts.
 * 2. else −1/√f concave at every triple → the same with
 *    `transform: 'inverse-sqrt'` (Hörmann 1995): heavier tails such as
 *    Student-t with df ≥ 1.
 * 3. else, when a tail is neither log-concave nor T-concave (it decays
 *    slower than |x|^−2, f ~ |x|^−α) → {@link ratioOfUniformsSampler} with
 *    power r = max(1, 1.1/(α − 1)) (Wakefield, Gelfand & Smith 1991), which
 *    needs only a bounded density with such tails, and checks its bounds.
 * 4. else → {@link piecewiseSampler}: multimodal or otherwise non-concave
 *    targets with light or T-concave tails.
 *
 * A method that refuses the target at construction with
 * {@link ShapeViolationError} (its own check found a shape it cannot serve)
 * is recorded in `choice.rejected` and the next one is tried (log hull →
 * inverse-sqrt hull → piecewise → ratio-of-uniforms). Errors that describe
 * the target rather than a method's shape needs are not retried: a tail that
 * does not decay ({@link ImproperDensityError}, "no decay found"), NaN or
 * +Infinity from logDensity ({@link NonFiniteDensityError}).
 *
 * A density with an integrable pole at a finite end (declared in
 * `target.poles`, found by probing an end other than 0 before the scan, or
 * found where the scan refuses the target) is sampled through the change of
 * variables of {@link poleTransform}: the choice above is made for Y and
 * `choice.reason` names the map.
 *
 * The chosen sampler receives the options (`seed`, `uniform`,
 * `maxRejections`), so its stream is that method's stream for the same
 * seed. `stats` are the chosen sampler's, with `setupEvaluations` including
 * the scan and any refused attempts. To skip the scan, call a method
 * directly.
 *
 * @param target - the target
 * @param options - uniform source and rejection bound for the chosen method
 * @returns the sampler, with `choice` (method, reason, scan) and the chosen `sampler`
 * @throws {@link InvalidTargetError} for bad inputs, or a pole whose mass closer to the end than 2^−1022 cannot be represented
 * @throws {@link ImproperDensityError} when a tail does not decay, or decays like |x|^−α with α ≤ 1
 * @throws {@link ShapeViolationError} when every method refuses the target
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity
 * @throws the errors of {@link certifiedSampler} for a target with bounds it cannot cover (a pole, no proven decay, lying bounds)
 * @example
 * ```ts
 * const s = exactSampler(studentTTarget(3), { seed: 1 });
 * s.choice.method;    // 'adaptive-rejection'
 * s.choice.transform; // 'inverse-sqrt'
 * s.choice.reason;    // why
 * const xs = s.fill(new Float64Array(1000));
 * ```
 */
export function exactSampler(target: Target, options?: ExactSamplerOptions): ExactSampler {
  const api = 'exactSampler';
  const t = checkTarget(api, target);
  checkOptionKeys(api, options, KNOWN);
  const opts: ExactSamplerOptions = options ?? {};
  if (opts.maxRejections !== undefined) resolveMaxRejections(api, opts.maxRejections);
  if (opts.expectedDraws !== undefined) checkInteger(api, 'options.expectedDraws', opts.expectedDraws, 0, Number.MAX_SAFE_INTEGER);
  const fast = (opts.expectedDraws ?? 1) >= FAST_PATH_MIN_DRAWS;
  const fastNote = fast ? `; ${opts.expectedDraws} expected draws >= ${FAST_PATH_MIN_DRAWS}, so the table-driven fast path serves it` : '';
  // With interval bounds the shape is proven, not scanned (src/methods/auto/with-bounds.ts).
  let boundsRefused: RefusedMethod | undefined;
  if (typeof target.logDensityBounds === 'function') {
    const r = exactWithBounds(api, target, t.lower, t.upper, opts, fast, fastNote);
    if ('sample' in r) return r;
    boundsRefused = r; // the bounds cannot cover this target: scan it, and say so
  }
  // The chosen sampler's own counts start after construction; a counting
  // wrapper measures the scan and every construction attempt.
  let counted = 0;
  const logf = t.logDensity;
  const wrapped: Target = {
    logDensity: (x: number): number => {
      counted++;
      return logf(x);
    },
    support: [t.lower, t.upper],
  };
  if (t.dLogDensity !== undefined) (wrapped as { dLogDensity?: (x: number) => number }).dLogDensity = t.dLogDensity;
  if (t.mode !== undefined) (wrapped as { mode?: number }).mode = t.mode;

  // A pole at a finite end (declared, or found where the scan refuses the target): change of variables (transform/exact.ts).
  const acrossPole = (e: unknown, spent: number): ExactSampler | undefined => exactAcrossPoles(api, target, { ...t, logDensity: wrapped.logDensity }, e, (y) => exactSampler(y, options), spent);
  const declaredPole = acrossPole(undefined, 0);
  if (declaredPole !== undefined) return declaredPole;
  // Scan and methods work in the standardised coordinate z = (x − loc)/2^k (transform/standardise.ts);
  // ordinary targets get the identity and are sampled as before.
  let standardising = 0;
  if (!isStandardised(target)) {
    const st = findStandardisation(api, t);
    standardising = st.evaluations;
    if (!st.identity) {
      try {
        return exactStandardised(st, standardisedTarget(st, t, target), options);
      } catch (e) {
        if (!retryable(e)) throw e; // else: the scan and methods in x, as for an ordinary target
      }
    }
  }
  // Where the doubles of x are coarse in z (more than 2^-40 of a scale unit apart), logDensity of Z is a
  // staircase that the hulls and the piecewise cells would see as a shape violation: ratio-of-uniforms only.
  const coarse = standardisationOf(target);
  const staircase = coarse !== undefined && coarse.grain > FINE_GRAIN;
  markStandardised(wrapped);
  inheritCells(target, wrapped);
  const ev = new Evaluator(api, logf, undefined, SHAPE_SCAN_BUDGET);
  let scanResult: ReturnType<typeof scanTarget>;
  try {
    scanResult = scanTarget(api, t, ev, SHAPE_SCAN_POINTS, target.modes ?? [], false);
  } catch (e) {
    const viaPole = acrossPole(e, ev.evaluations);
    if (viaPole !== undefined) return viaPole;
    throw e;
  }
  const scan = verdict(scanResult.points, scanResult.logMax, ev.evaluations, t, scanResult.centre);
  const assumption = blackBoxAssumption(scan.points, scan, boundsRefused === undefined ? undefined : `its logDensityBounds could not cover it: ${boundsRefused.error}`);
  if (scan.heavyTailExponent <= 1) {
    throw new ImproperDensityError(
      `${api}: a tail decays like |x|^(−${scan.heavyTailExponent.toPrecision(3)}); with an exponent ≤ 1 the mass is infinite`,
    );
  }

  const rejected: { method: string; error: string }[] = boundsRefused === undefined ? [] : [{ ...boundsRefused }];
  const pass = { seed: opts.seed, stream: opts.stream, uniform: opts.uniform, maxRejections: opts.maxRejections };
  const clean = <T extends object>(o: T): T => {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(o)) if (v !== undefined) out[k] = v;
    return out as T;
  };
  const tryBuild = (name: string, build: () => Sampler): Sampler | undefined => {
    try {
      return build();
    } catch (e) {
      if (e instanceof ShapeViolationError) {
        rejected.push({ method: name, error: e.message });
        return undefined;
      }
      throw e;
    }
  };
  const rouPower = Number.isFinite(scan.heavyTailExponent) ? Math.max(1, 1.1 / (scan.heavyTailExponent - 1)) : 1;
  const convexWhere = `log f is convex near x = ${fmt(scan.convexAt)}`;
  const tConvexWhere = `−1/√f is convex near x = ${fmt(scan.tConvexAt)}`;

  type Plan = { method: ExactMethod; transform?: 'log' | 'inverse-sqrt'; power?: number; reason: string; build: () => Sampler };
  const plans: Plan[] = [];
  if (scan.logConcave) {
    plans.push({
      method: 'adaptive-rejection',
      transform: 'log',
      reason: `log-concave: log f is concave at all ${scan.points} scan points (no second divided difference above rounding), so tangents of log f bound it (Gilks & Wild 1992)${fastNote}`,
      build: () =>
        fast
          ? tableSampler(wrapped, clean({ ...pass, transform: 'log' as const }))
          : adaptiveRejectionSampler(wrapped, clean({ ...pass, transform: 'log' as const })),
    });
  }
  if (scan.tConcave) {
    plans.push({
      method: 'adaptive-rejection',
      transform: 'inverse-sqrt',
      reason: `T-concave for T(f) = −1/√f at all ${scan.points} scan points${scan.logConcave ? '' : ` but not log-concave (${convexWhere})`}: tangents of −1/√f bound it, heavy tails included (Hörmann 1995)${fastNote}`,
      build: () =>
        fast
          ? tableSampler(wrapped, clean({ ...pass, transform: 'inverse-sqrt' as const }))
          : adaptiveRejectionSampler(wrapped, clean({ ...pass, transform: 'inverse-sqrt' as const })),
    });
  }
  const heavy = Number.isFinite(scan.heavyTailExponent);
  const rouPlan: Plan = {
    method: 'ratio-of-uniforms',
    power: rouPower,
    reason: heavy
      ? `a tail decays like |x|^(−${scan.heavyTailExponent.toPrecision(3)}), slower than |x|^−2, so no hull bounds it; ratio-of-uniforms with power r = ${rouPower.toPrecision(3)} needs only a bounded density with such tails (Wakefield, Gelfand & Smith 1991)`
      : `the other methods refused the target; ratio-of-uniforms needs only a bounded density with tails lighter than |x|^−2 (Kinderman & Monahan 1977)`,
    build: () => ratioOfUniformsSampler(wrapped, clean({ ...pass, power: rouPower })),
  };
  const pwPlan: Plan = {
    method: 'piecewise',
    reason: `not log-concave (${convexWhere}) and not T-concave (${tConvexWhere}), e.g. multimodal: piecewise envelopes on cells of constant curvature${fastNote}`,
    build: () => (fast ? piecewiseSampler(wrapped, clean({ ...pass, fast: true as const })) : piecewiseSampler(wrapped, clean(pass))),
  };
  if (staircase) {
    plans.length = 0;
    plans.push({
      ...rouPlan,
      reason: `the doubles of x are ${coarse.grain.toPrecision(3)} scale units apart near ${coarse.loc}, so logDensity in the standardised coordinate is a staircase, which no hull or piecewise cell bounds within its tolerance; ratio-of-uniforms needs only the bound of each step (its rectangle is widened by the step width)`,
    });
  } else if (heavy) plans.push(rouPlan, pwPlan);
  else plans.push(pwPlan, rouPlan);

  for (const p of plans) {
    const before = counted;
    const s = tryBuild(p.transform === undefined ? p.method : `${p.method} (${p.transform})`, p.build);
    if (s === undefined) continue;
    const setupOther = standardising + scan.evaluations + before; // finding the scale + scan + refused attempts; the chosen method counts its own setup
    const reason = rejected.length === 0 ? p.reason : `${p.reason}; tried first: ${rejected.map((r) => r.method).join(', ')}`;
    const choice: ExactChoice = Object.freeze({
      method: p.method,
      table: fast && p.method !== 'ratio-of-uniforms',
      transform: p.transform,
      power: p.power,
      reason,
      rejected: Object.freeze(rejected.map((r) => Object.freeze({ ...r }))),
      scan,
      assumption,
      proof: undefined,
    });
    return {
      choice,
      sampler: s,
      sample: () => s.sample(),
      fill: (out: Float64Array) => {
        checkFillArray(api, out); // the error names exactSampler, not the method it delegates to
        return s.fill(out);
      },
      get stats(): SamplerStats {
        const st = s.stats;
        return { ...st, setupEvaluations: st.setupEvaluations + setupOther };
      },
    };
  }
  throw new ShapeViolationError(
    `${api}: no method can serve this target: ${rejected.map((r) => `${r.method}: ${r.error}`).join(' | ')}`,
  );
}


/** exactSampler of the standardised target, its draws mapped back to x and its choice saying so. */
function exactStandardised(st: Standardisation, z: Target, options: ExactSamplerOptions | undefined): ExactSampler {
  let inner: ExactSampler;
  try {
    inner = exactSampler(z, options);
  } catch (e) {
    throw noteCoordinate(e, st);
  }
  const outer = mapStandardised(inner, st, st.evaluations, {});
  const c = inner.choice;
  const forward = 'transform' in inner.sampler ? POLE_FORWARD : c.method === 'piecewise' ? PIECEWISE_FORWARD : c.method === 'ratio-of-uniforms' ? RATIO_FORWARD : HULL_FORWARD;
  const sampler = mapStandardised(inner.sampler, st, 0, forward);
  const choice: ExactChoice = Object.freeze({
    ...c,
    reason: `sampled in the standardised coordinate ${st.description} (scale = the power of two over which logDensity changes by 1/2 next to loc; draws mapped back by x = ${st.loc === 0 ? '' : `${st.loc} + `}2^${st.log2Scale}·z, the scan and descriptions are in z); for z: ${c.reason}`,
  });
  return {
    choice,
    sampler,
    sample: outer.sample,
    fill: outer.fill,
    get stats(): SamplerStats {
      return outer.stats;
    },
  };
}

function fmt(x: number): string {
  return Number.isFinite(x) ? x.toPrecision(6) : String(x);
}

/** The shape verdict from the scan points (secant second differences with a rounding allowance). */
function verdict(pts: readonly ScanPoint[], logMax: number, evaluations: number, t: CheckedTarget, centre: number): ShapeScan {
  let finite = 0;
  for (const p of pts) if (p.l > -Infinity) finite++;
  let convexAt = NaN;
  let tConvexAt = NaN;
  // a zero of the density between points of positive density: the support is not an interval
  let first = -1;
  let last = -1;
  for (let i = 0; i < pts.length; i++) if (pts[i].l > -Infinity) { if (first < 0) first = i; last = i; }
  let zeroInside = false;
  for (let i = first; i <= last && first >= 0; i++) {
    if (pts[i].l === -Infinity) {
      convexAt = pts[i].x;
      tConvexAt = pts[i].x;
      zeroInside = true;
      break;
    }
  }
  const tOf = (l: number): number => -exp(-0.5 * (l - logMax));
  for (let j = 1; j + 1 < pts.length; j++) {
    const p = pts[j - 1];
    const q = pts[j];
    const r = pts[j + 1];
    if (!(p.l > -Infinity && q.l > -Infinity && r.l > -Infinity)) continue;
    const w0 = q.x - p.x;
    const w1 = r.x - q.x;
    const nearer = (old: number): boolean => old !== old || Math.abs(q.x - centre) < Math.abs(old - centre);
    if (nearer(convexAt) && !zeroInside) {
      const s0 = (q.l - p.l) / w0;
      const s1 = (r.l - q.l) / w1;
      const e = (NOISE * (Math.abs(p.l) + Math.abs(q.l) + 2)) / w0 + (NOISE * (Math.abs(q.l) + Math.abs(r.l) + 2)) / w1 + NOISE * (Math.abs(s0) + Math.abs(s1));
      if (s1 - s0 > e) convexAt = q.x;
    }
    if (nearer(tConvexAt) && !zeroInside && p.l >= logMax - T_SCAN_DROP && q.l >= logMax - T_SCAN_DROP && r.l >= logMax - T_SCAN_DROP) {
      const tp = tOf(p.l);
      const tq = tOf(q.l);
      const tr = tOf(r.l);
      const s0 = (tq - tp) / w0;
      const s1 = (tr - tq) / w1;
      const ne = (v: number, l: number): number => Math.abs(v) * (Math.abs(l) + Math.abs(logMax) + 2);
      const e = (NOISE * (ne(tp, p.l) + ne(tq, q.l))) / w0 + (NOISE * (ne(tq, q.l) + ne(tr, r.l))) / w1 + NOISE * (Math.abs(s0) + Math.abs(s1));
      if (s1 - s0 > e) tConvexAt = q.x;
    }
  }
  // Tails: the three outermost points of positive density on each infinite side.
  let alpha = NaN;
  const sides: [number, number][] = [];
  if (t.upper === Infinity && last >= 2 && last === pts.length - 1) sides.push([last, -1]);
  if (t.lower === -Infinity && first >= 0 && first === 0 && first + 2 < pts.length) sides.push([first, 1]);
  for (const [k, step] of sides) {
    const a = pts[k];
    const b = pts[k + step];
    const c = pts[k + 2 * step];
    if (!(b.l > -Infinity && c.l > -Infinity)) continue;
    // in increasing x: (lo, mid, hi)
    const [lo, md, hi] = step < 0 ? [c, b, a] : [a, b, c];
    const w0 = md.x - lo.x;
    const w1 = hi.x - md.x;
    const s0 = (md.l - lo.l) / w0;
    const s1 = (hi.l - md.l) / w1;
    const e = (NOISE * (Math.abs(lo.l) + Math.abs(md.l) + 2)) / w0 + (NOISE * (Math.abs(md.l) + Math.abs(hi.l) + 2)) / w1 + NOISE * (Math.abs(s0) + Math.abs(s1));
    const logConvex = s1 - s0 > e;
    if (!logConvex) continue;
    // T relative to the outermost value (T(a) = −1), as the piecewise tails do
    const T = (l: number): number => -exp(-0.5 * (l - a.l));
    const t0 = (T(md.l) - T(lo.l)) / w0;
    const t1 = (T(hi.l) - T(md.l)) / w1;
    const eT = NOISE * ((4 + Math.abs(T(lo.l)) + Math.abs(T(md.l)) + Math.abs(T(hi.l))) / Math.min(w0, w1) + Math.abs(t0) + Math.abs(t1));
    if (t1 - t0 <= eT) continue;
    const r0 = log(Math.abs(b.x - centre));
    const r1 = log(Math.abs(a.x - centre));
    const al = r1 > r0 ? -(a.l - b.l) / (r1 - r0) : NaN;
    if (al === al && !(al >= alpha)) alpha = al;
  }
  if (finite < 3) {
    throw new InvalidTargetError(`exactSampler: the scan found positive density at only ${finite} points; give target.mode or a narrower support`);
  }
  return Object.freeze({
    points: finite,
    evaluations,
    logConcave: convexAt !== convexAt,
    convexAt,
    tConcave: tConvexAt !== tConvexAt,
    tConvexAt,
    heavyTailExponent: alpha,
    ...scanSpacing(pts, logMax),
  });
}
