/**
 * `discreteSampler`: exact draws from a log-pmf, with the method picked from
 * what the target offers.
 *
 * @packageDocumentation
 */
import { Counters, DEFAULT_MAX_REJECTIONS } from '../core/counters.js';
import { InvalidOptionError, InvalidTargetError, ShapeViolationError } from '../core/errors.js';
import type { DiscreteTarget, SamplerStats, Uniform } from '../core/types.js';
import { checkInteger, checkOptionKeys } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import { SetupEvaluator, findMode } from './_internals/setup.js';
import { buildLogConcaveHat, logConcaveSampler, type LogConcaveHat } from './methods/log-concave.js';
import { buildRatioRectangle, ratioSampler } from './methods/ratio-of-uniforms.js';
import { MAX_DISCRETE_TABLE_POINTS, TABLE_PROBE_MIN_REACH, TABLE_PROBE_REACH, buildDiscreteTable, tableSamplerOf } from './methods/table.js';
import type { ChosenDiscreteSampler, DiscreteChoice, DiscreteMethod, DiscreteRefusal, DiscreteSampler, DiscreteSamplerOptions } from './types.js';
import { checkDiscreteTarget, type CheckedDiscreteTarget } from './validate.js';
import { discreteDraws } from './_internals/draws.js';
import { newUniversalHat, setUniversalHat, universalDraw } from './methods/universal.js';

/** A table is always chosen when it needs at most this many points. */
export const DISCRETE_TABLE_MIN_POINTS = 32;

const KNOWN = ['seed', 'stream', 'uniform', 'method', 'expectedDraws', 'maxRejections'] as const;
const METHODS: readonly string[] = ['auto', 'table', 'log-concave-rejection', 'ratio-of-uniforms', 'log-concave-universal'];

/**
 * Estimated table size for a log-concave pmf from its hat: the table grows
 * until logPmf has dropped by 40; a normal-like pmf drops by 0.6 at the hat
 * edge, so by 40 at about √(40/0.6) ≈ 8.2 times that distance.
 */
function tableEstimate(hat: LogConcaveHat): number {
  return Math.ceil(8.2 * (hat.right.edge - hat.left.edge)) + 8;
}

/**
 * Exact draws from a discrete target given by its (unnormalized) log-pmf.
 *
 * @remarks
 * The method, and why, is in `choice`:
 * - `'table'` (alias table, O(1), no rejection and no evaluation per draw)
 *   when the support is finite with at most 32 points, or at most
 *   `expectedDraws` points (up to 2^20), whatever the shape; and for an
 *   unbounded log-concave pmf whose table is estimated at those sizes. On
 *   an unbounded support the table holds the points down to e^-40 of the
 *   maximum; the tails beyond are drawn by rejection from a geometric hat
 *   (exact, evaluated only when the table's tail entry is drawn).
 * - `'log-concave-rejection'`: a flat hat over the centre with a chord
 *   squeeze and geometric tails, after Devroye's (1987) universal bound for
 *   log-concave pmfs but anchored at measured points (the normalized mode
 *   probability the bound needs is unknown for an unnormalized logPmf).
 *   About 8–12 setup evaluations; acceptance about 0.7 for normal-like pmfs.
 *   This is the method for a fresh target per draw (Gibbs).
 * - `'ratio-of-uniforms'`: for pmfs that are not log-concave but T-concave
 *   with T = −1/√·, ratio-of-uniforms on the step function with a searched
 *   rectangle (Kinderman & Monahan 1977; Leydold 2001 for T-concave pmfs).
 *
 * Shape: the discrete second differences at the measured points are checked;
 * a pmf that fails them is refused with {@link ShapeViolationError} (the
 * automatic choice then tries the next method), and every evaluation while
 * sampling is checked against the hat ({@link EnvelopeViolationError}). The
 * mode is located by a climb from `target.mode` (or the finite end of the
 * support, or 0); for a multimodal pmf on a large support only the table is
 * exact, and only if its points cover the modes. Draws are safe integers.
 *
 * @param target - the discrete target
 * @param options - seed/stream/uniform, forced method, expected draws, rejection bound
 * @returns the sampler with `choice` and `mode`
 * @throws {@link InvalidTargetError} for a malformed target, {@link InvalidOptionError} for bad options,
 *   {@link ShapeViolationError} when no method fits, {@link ImproperDensityError} for a pmf that does not decay,
 *   {@link NonFiniteDensityError} for NaN or +Infinity from logPmf
 * @example
 * ```ts
 * import { discreteSampler, poissonTarget } from 'exactdraw';
 * const s = discreteSampler(poissonTarget(1e4), { seed: 3 });
 * s.choice.method; // 'log-concave-rejection'
 * const k = s.sample();
 * ```
 */
export function discreteSampler(target: DiscreteTarget, options?: DiscreteSamplerOptions): ChosenDiscreteSampler {
  const api = 'discreteSampler';
  checkOptionKeys(api, options, KNOWN);
  const method = options?.method ?? 'auto';
  if (typeof method !== 'string' || !METHODS.includes(method)) {
    throw new InvalidOptionError(`${api}: options.method must be one of ${METHODS.map((m) => `'${m}'`).join(', ')}, got ${typeof method === 'string' ? `'${method}'` : String(method)}`);
  }
  const expected = options?.expectedDraws ?? 1;
  if (typeof expected !== 'number' || !Number.isInteger(expected) || expected < 0) {
    throw new InvalidOptionError(`${api}: options.expectedDraws must be an integer >= 0, got ${String(expected)}`);
  }
  const maxRejections = options?.maxRejections ?? DEFAULT_MAX_REJECTIONS;
  if (options?.maxRejections !== undefined) checkInteger(api, 'options.maxRejections', maxRejections, 1, Number.MAX_SAFE_INTEGER);
  const t = checkDiscreteTarget(api, target);
  const u = resolveUniform(api, options);
  return chooseDiscrete(api, t, u, new Counters(), method as DiscreteMethod | 'auto', expected, maxRejections);
}

/**
 * The method choice and setup of {@link discreteSampler}, after the options
 * are resolved (shared with {@link reusableDiscreteSampler}, which resolves
 * them once). @internal
 */
export function chooseDiscrete(
  api: string,
  t: CheckedDiscreteTarget,
  u: Uniform,
  counters: Counters,
  method: DiscreteMethod | 'auto',
  expected: number,
  maxRejections: number,
  minTablePoints: number = DISCRETE_TABLE_MIN_POINTS,
): ChosenDiscreteSampler {
  const ev = new SetupEvaluator(api, t, counters);
  const lo = t.lower;
  const hi = t.upper;
  const size = hi - lo + 1;
  const budget = Math.max(minTablePoints, Math.min(MAX_DISCRETE_TABLE_POINTS, expected));
  const refused: { method: DiscreteMethod; message: string }[] = [];
  const logPmf = t.logPmf;
  // the reason is written when it is read: a sampler built for one draw (a Gibbs step) never formats it
  const done = (inner: DiscreteSampler, m: DiscreteMethod, mode: number, reason: () => string): ChosenDiscreteSampler => {
    const choice: DiscreteChoice = new LazyChoice(m, reason, refused);
    return {
      choice,
      mode,
      sample: inner.sample,
      fill: inner.fill,
      get stats(): SamplerStats {
        return counters.snapshot();
      },
    };
  };
  // probe: check the tail hats beyond the edges (the table was not preceded by the log-concave measurement)
  const table = (m: number | undefined, reason: () => string, probe: boolean): ChosenDiscreteSampler => {
    const tab = buildDiscreteTable(ev, m, MAX_DISCRETE_TABLE_POINTS, probe);
    let mode = tab.first;
    for (let i = 1; i < tab.logp.length; i++) if (tab.logp[i] > tab.logp[mode - tab.first]) mode = tab.first + i;
    const s = tableSamplerOf(api, tab, logPmf, lo, hi, u, counters, maxRejections);
    return done(s, 'table', mode, () => `${reason()}; the table has ${tab.logp.length} points [${tab.first}, ${tab.last}]${Number.isNaN(tab.slopeLeft) && Number.isNaN(tab.slopeRight) ? '' : `, tails beyond drawn by rejection from geometric hats${probe ? ` (each hat checked at 1, 2, 4, ... points beyond its edge up to max(${TABLE_PROBE_MIN_REACH}, ${TABLE_PROBE_REACH} x the edge's distance from the mode); the table grew past every probe above a hat)` : ' (the pmf was log-concave at the measured points)'}`}`);
  };
  if (method === 'log-concave-universal') {
    if (t.mode === undefined || !t.logConcave || !t.normalized) {
      throw new InvalidTargetError(
        `${api}: method 'log-concave-universal' needs target.mode, target.logConcave = true and target.normalized = true, got mode ${String(t.mode)}, logConcave ${String(t.logConcave)}, normalized ${String(t.normalized)}`,
      );
    }
    const m = t.mode;
    const hat = newUniversalHat();
    if (!setUniversalHat(api, hat, m, ev.h(m), lo, hi)) {
      throw new ShapeViolationError(`${api}: method 'log-concave-universal' needs pmf(mode) >= 2^-40; logPmf(${m}) = ${ev.h(m)}`);
    }
    const s = discreteDraws(api, () => universalDraw(api, hat, t, lo, hi, u, counters, maxRejections), counters);
    return done(s, 'log-concave-universal', m, () => `forced; log-concave pmf summing to at most 1 with mode ${m} (promised by the target): universal hat from pmf(mode) = ${hat.q.toPrecision(4)} alone, hat mass ${(hat.cMass + hat.rMass + hat.lMass).toPrecision(4)}`);
  }
  if (method === 'table' || (method === 'auto' && size <= budget)) {
    const m = size <= MAX_DISCRETE_TABLE_POINTS ? undefined : findMode(ev, t.mode ?? startOf(lo, hi));
    return table(m, () => size <= budget ? `finite support of ${size} points <= ${budget} (max(${minTablePoints}, expectedDraws = ${expected})): alias table, O(1) per draw` : 'table forced by options.method', true);
  }
  const m = findMode(ev, t.mode ?? startOf(lo, hi));
  const attempt = <T>(name: DiscreteMethod, f: () => T): T | undefined => {
    try {
      return f();
    } catch (e) {
      if (method !== 'auto' || !(e instanceof ShapeViolationError)) throw e;
      refused.push({ method: name, message: e.message });
      return undefined;
    }
  };
  if (method === 'auto' || method === 'log-concave-rejection') {
    const hat = attempt('log-concave-rejection', () => buildLogConcaveHat(ev, m));
    if (hat !== undefined) {
      const est = tableEstimate(hat);
      if (method === 'auto' && est <= budget) {
        const r = attempt('table', () => table(m, () => `log-concave pmf with mode ${m} whose table is estimated at ${est} points <= ${budget} (max(${minTablePoints}, expectedDraws = ${expected}))`, false));
        if (r !== undefined) return r;
      }
      const s = logConcaveSampler(api, hat, logPmf, lo, hi, u, counters, maxRejections);
      const area = hat.massCentre + hat.massRight + hat.massLeft;
      return done(
        s,
        'log-concave-rejection',
        m,
        () => `log-concave at the measured points (mode ${m}, hat centre [${hat.left.edge}, ${hat.right.edge}], hat mass ${area.toPrecision(4)} x pmf(mode)); a table would need about ${est} points > ${budget}`,
      );
    }
  }
  if (method === 'auto' || method === 'ratio-of-uniforms') {
    const rect = attempt('ratio-of-uniforms', () => buildRatioRectangle(ev, m));
    if (rect !== undefined) {
      const s = ratioSampler(api, rect, logPmf, lo, hi, u, counters, maxRejections);
      return done(s, 'ratio-of-uniforms', m, () => `not log-concave${refused.length > 0 ? ` (${refused[0].message})` : ''}; ratio-of-uniforms rectangle found around the mode ${m}`);
    }
  }
  if (method === 'auto' && size <= MAX_DISCRETE_TABLE_POINTS) {
    return table(m, () => `neither log-concave nor T-concave; finite support of ${size} points <= ${MAX_DISCRETE_TABLE_POINTS}`, true);
  }
  throw new ShapeViolationError(`${api}: no method fits this target: ${refused.map((r) => `${r.method}: ${r.message}`).join('; ')}`);
}

/** A {@link DiscreteChoice} whose reason is formatted on first read (a prototype getter: cheap to create). */
class LazyChoice implements DiscreteChoice {
  readonly method: DiscreteMethod;
  readonly refused: readonly DiscreteRefusal[];
  private text: string | undefined;
  private readonly write: () => string;

  constructor(method: DiscreteMethod, write: () => string, refused: readonly DiscreteRefusal[]) {
    this.method = method;
    this.write = write;
    this.refused = refused;
  }

  get reason(): string {
    return (this.text ??= this.write());
  }

  toJSON(): { method: DiscreteMethod; reason: string; refused: readonly DiscreteRefusal[] } {
    return { method: this.method, reason: this.reason, refused: this.refused };
  }
}

function startOf(lo: number, hi: number): number {
  if (Number.isFinite(lo)) return lo;
  if (Number.isFinite(hi)) return hi;
  return 0;
}

