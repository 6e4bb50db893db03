/**
 * SVG figure of a hull envelope: target, envelope, squeeze and touch points.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import { InvalidOptionError } from '../core/errors.js';
import { checkOptionKeys, showValue } from '../core/validate.js';
import type { Target } from '../core/types.js';
import { evaluateEnvelope } from '../methods/envelope/description.js';
import type { EnvelopeDescription } from '../methods/envelope/description.js';
import { roundTicks } from './svg-ticks.js';
import { exp } from '../vendor/math.js';

/** Options of {@link envelopeSvg}. */
export interface EnvelopeSvgOptions {
  /**
   * Width of the figure in pixels.
   * @defaultValue 640
   */
  width?: number;
  /**
   * Height of the figure in pixels.
   * @defaultValue 360
   */
  height?: number;
  /**
   * Plotted x range. Defaults to the touch points widened by half their
   * spread on each side, clipped to the support.
   */
  range?: readonly [number, number];
  /**
   * Number of points per curve.
   * @defaultValue 400
   */
  points?: number;
  /**
   * Plot log-densities (the 30 units below the envelope's maximum) instead of densities.
   * @defaultValue false
   */
  logScale?: boolean;
  /**
   * Title, drawn at the top and used as the accessible name (`<title>`).
   * @defaultValue 'Target, envelope and squeeze'
   */
  title?: string;
  /**
   * Label of the x axis; include the unit, e.g. `'battery charge (%)'`.
   * @defaultValue 'x'
   */
  xLabel?: string;
  /**
   * Label of the y axis.
   * @defaultValue `'density relative to the envelope maximum'`, or with `logScale`
   * `'log density (as returned by logDensity)'`
   */
  yLabel?: string;
  /**
   * Which stage of the hull to draw: `'current'` (the source's envelope now,
   * with the touch points adaptation has added), `'setup'` (the hull as built
   * before the first draw, given as `setup`) or `'both'` (the setup envelope
   * as a thin grey dash-dot line under the current one).
   * @defaultValue `'both'` when `setup` is given, else `'current'`
   */
  stage?: 'current' | 'setup' | 'both';
  /**
   * The envelope description at setup: `sampler.envelope` read before the
   * first draw (descriptions are snapshots). Needed by `stage: 'setup'` and `'both'`.
   */
  setup?: EnvelopeDescription;
  /**
   * Longer text for assistive technology (`<desc>`). Defaults to a sentence
   * naming the curves, the stage and the number of touch points.
   */
  description?: string;
}

const API = 'envelopeSvg';

function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function fmt(v: number): string {
  return (Math.round(v * 100) / 100).toString();
}

const KNOWN_OPTIONS = ['width', 'height', 'range', 'points', 'logScale', 'title', 'xLabel', 'yLabel', 'stage', 'setup', 'description'] as const;

function checkText(name: string, v: unknown, def: string): string {
  if (v === undefined) return def;
  if (typeof v !== 'string') throw new InvalidOptionError(`${API}: options.${name} must be a string, got ${showValue(v)}`);
  return v;
}

function checkDescription(name: string, v: unknown): EnvelopeDescription {
  if (v === null || typeof v !== 'object' || !Array.isArray((v as EnvelopeDescription).pieces) || !Array.isArray((v as EnvelopeDescription).touchPoints)) {
    throw new InvalidOptionError(`${API}: ${name} must be an envelope description (with pieces and touchPoints), got ${v === null ? 'null' : typeof v}`);
  }
  return v as EnvelopeDescription;
}

/** Line styles of the curves (also used by the legend swatches). */
const STYLE = {
  target: 'stroke="#1f77b4" stroke-width="3" stroke-opacity="0.85"',
  envelope: 'stroke="#b2182b" stroke-width="1.6" stroke-dasharray="7 4"',
  setup: 'stroke="#777777" stroke-width="1.2" stroke-dasharray="9 3 2 3"',
  squeeze: 'stroke="#1b7837" stroke-width="1.4" stroke-dasharray="2 3"',
} as const;

function checkSize(name: string, v: unknown, min: number, max: number): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max) {
    throw new InvalidOptionError(`${API}: options.${name} must be a number in [${min}, ${max}], got ${String(v)}`);
  }
  return v;
}

/**
 * Draws the target, the envelope and the squeeze of a hull sampler (or of an
 * envelope description) as an SVG document, with the touch points marked.
 *
 * @remarks
 * Pure string building, no DOM or Node API: the result can be written to a
 * file, inlined in HTML or returned by a server. The axes have round ticks
 * (1, 2 or 5 times a power of ten) and labels (`xLabel`, `yLabel`). On the
 * linear scale heights are relative to the maximum of the drawn envelope (the
 * target may be unnormalized); on the log scale the y values are the target's
 * own logDensity values, over the 30 units below the maximum. The target is a
 * wide solid line, the envelope a narrower dashed line drawn over it (so an
 * envelope that touches the target stays visible), the squeeze dotted; the
 * legend shows each style. To show how adaptation refined the hull, read
 * `sampler.envelope` before the first draw and pass it as `setup` (with
 * `stage: 'both'` or `'setup'`). The figure carries `<title>` and `<desc>`
 * for assistive technology. Where a curve is not defined (no squeeze on the
 * tails; −∞ on a log plot) the line is interrupted.
 *
 * @param source - a sampler with an `envelope` (e.g. from {@link adaptiveRejectionSampler}) or an {@link EnvelopeDescription}
 * @param target - the target the envelope was built for
 * @param options - size, x range, resolution, log scale, title, axis labels, stage
 * @returns an SVG document as a string
 * @throws {@link InvalidTargetError} for a malformed source or target; {@link InvalidOptionError} for an unknown option or a bad option value
 * @example
 * ```ts
 * const t = gammaTarget(2.5);
 * const s = adaptiveRejectionSampler(t, { seed: 1 });
 * const setup = s.envelope;                      // snapshot before the first draw
 * s.fill(new Float64Array(10_000));
 * const svg = envelopeSvg(s, t, { setup, stage: 'both', xLabel: 'waiting time (h)', title: 'gamma(2.5) hull' });
 * ```
 */
export function envelopeSvg(
  source: EnvelopeDescription | { readonly envelope: EnvelopeDescription },
  target: Target,
  options: EnvelopeSvgOptions = {},
): string {
  if (source === null || typeof source !== 'object') {
    throw new InvalidTargetError(`${API}: source must be a hull sampler or an envelope description, got ${source === null ? 'null' : typeof source}`);
  }
  const current: EnvelopeDescription = 'pieces' in source ? source : source.envelope;
  if (current === undefined || current === null || !Array.isArray(current.pieces) || !Array.isArray(current.touchPoints)) {
    throw new InvalidTargetError(`${API}: source has no envelope description (expected pieces and touchPoints)`);
  }
  if (target === null || typeof target !== 'object' || typeof target.logDensity !== 'function') {
    throw new InvalidTargetError(`${API}: target must be an object with a logDensity function`);
  }
  if (options === null || typeof options !== 'object') {
    throw new InvalidOptionError(`${API}: options must be an object, got ${String(options)}`);
  }
  checkOptionKeys(API, options, KNOWN_OPTIONS);
  const width = checkSize('width', options.width ?? 640, 100, 10000);
  const height = checkSize('height', options.height ?? 360, 80, 10000);
  const n = Math.floor(checkSize('points', options.points ?? 400, 2, 100000));
  const logPlot = options.logScale ?? false;
  if (typeof logPlot !== 'boolean') throw new InvalidOptionError(`${API}: options.logScale must be a boolean, got ${String(logPlot)}`);
  const title = checkText('title', options.title, 'Target, envelope and squeeze');
  const xLabel = checkText('xLabel', options.xLabel, 'x');
  const yLabel = checkText('yLabel', options.yLabel, logPlot ? 'log density (as returned by logDensity)' : 'density relative to the envelope maximum');
  const setup = options.setup === undefined ? undefined : checkDescription('options.setup', options.setup);
  const stage = options.stage ?? (setup ? 'both' : 'current');
  if (stage !== 'current' && stage !== 'setup' && stage !== 'both') {
    throw new InvalidOptionError(`${API}: options.stage must be 'current', 'setup' or 'both', got ${typeof stage === 'string' ? `'${stage}'` : String(stage)}`);
  }
  if (stage !== 'current' && setup === undefined) {
    throw new InvalidOptionError(`${API}: options.stage '${stage}' needs options.setup (read sampler.envelope before the first draw)`);
  }
  // main: the hull whose envelope and squeeze are drawn in full; under: the setup envelope drawn beneath (stage 'both')
  const main = stage === 'setup' ? (setup as EnvelopeDescription) : current;
  const under = stage === 'both' ? setup : undefined;
  const mainName = stage === 'setup' ? 'setup hull' : 'current hull';

  const [sLo, sHi] = main.support;
  const tp = main.touchPoints;
  let a: number;
  let b: number;
  if (options.range !== undefined) {
    const r = options.range;
    if (!Array.isArray(r) || r.length !== 2 || !Number.isFinite(r[0]) || !Number.isFinite(r[1]) || !(r[0] < r[1])) {
      throw new InvalidOptionError(`${API}: options.range must be a pair [a, b] of finite numbers with a < b, got ${String(r)}`);
    }
    a = r[0];
    b = r[1];
  } else {
    const all = under ? [...tp, ...under.touchPoints] : [...tp];
    const t0 = all.length > 0 ? Math.min(...all) : 0;
    const t1 = all.length > 0 ? Math.max(...all) : 1;
    const spread = t1 > t0 ? t1 - t0 : Math.max(1, Math.abs(t0));
    a = Math.max(sLo, t0 - 0.5 * spread);
    b = Math.min(sHi, t1 + 0.5 * spread);
    if (!(a < b)) {
      a = t0 - 1;
      b = t1 + 1;
    }
  }

  // log values relative to ref (the main hull's reference height)
  const ref = main.logScale;
  const xs = new Float64Array(n);
  const fy = new Float64Array(n);
  const gy = new Float64Array(n);
  const sy = new Float64Array(n);
  const uy = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = a + ((b - a) * i) / (n - 1);
    xs[i] = x;
    const v = evaluateEnvelope(main, x);
    const lf = target.logDensity(x);
    fy[i] = (typeof lf === 'number' ? lf : NaN) - ref;
    gy[i] = v.logEnvelope - ref;
    sy[i] = v.logSqueeze - ref;
    uy[i] = under ? evaluateEnvelope(under, x).logEnvelope - ref : -Infinity;
  }
  let top = -Infinity;
  for (let i = 0; i < n; i++) {
    for (const v of [gy[i], fy[i], uy[i]]) if (v > top && v < Infinity) top = v;
  }
  if (!(top > -Infinity)) top = 0;
  const bottom = top - 30;
  // plotted y: linear, relative to the maximum (0 .. 1); log, the logDensity values themselves
  const yOf = (lv: number): number => (logPlot ? lv + ref : exp(lv - top));
  const yMax = logPlot ? top + ref : 1.04;
  const yMin = logPlot ? bottom + ref : 0;

  const padL = 64;
  const padR = 16;
  const padT = 34;
  const padB = 48;
  const pw = width - padL - padR;
  const ph = height - padT - padB;
  const px = (x: number): number => padL + ((x - a) / (b - a)) * pw;
  const py = (y: number): number => padT + (1 - (y - yMin) / (yMax - yMin)) * ph;

  const path = (vals: Float64Array): string => {
    let d = '';
    let pen = false;
    for (let i = 0; i < n; i++) {
      const lv = vals[i];
      const ok = lv === lv && lv > -Infinity && lv < Infinity && (!logPlot || lv >= bottom);
      if (!ok) {
        pen = false;
        continue;
      }
      const y = Math.min(yMax, Math.max(yMin, yOf(lv)));
      d += `${pen ? 'L' : 'M'}${fmt(px(xs[i]))} ${fmt(py(y))}`;
      pen = true;
    }
    return d;
  };

  const desc = checkText(
    'description',
    options.description,
    `Plot of ${xLabel} against ${yLabel}, from ${fmt(a)} to ${fmt(b)}: the target (solid line), the envelope of the ${mainName} ` +
      `(dashed, ${tp.length} ${main.construction === 'bounds' ? 'cell edges' : 'touch points'}, ${main.transform} transform, ${constructionLabel(main.construction)}) and its squeeze (dotted)` +
      (under ? `, over the envelope of the setup hull (grey dash-dot, ${under.touchPoints.length} touch points)` : '') +
      '. The envelope lies on or above the target everywhere, the squeeze on or below it.',
  );
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-label="${escapeXml(title)}">`,
  );
  parts.push(`<title>${escapeXml(title)}</title>`);
  parts.push(`<desc>${escapeXml(desc)}</desc>`);
  parts.push(`<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`);
  parts.push(`<text x="${fmt(width / 2)}" y="20" text-anchor="middle" font-family="sans-serif" font-size="14">${escapeXml(title)}</text>`);
  // ticks, grid lines and axes
  const xt = roundTicks(a, b, Math.max(3, Math.min(11, Math.floor(pw / 70))));
  const yt = roundTicks(yMin, logPlot ? yMax : 1, Math.max(3, Math.min(9, Math.floor(ph / 40))));
  parts.push(`<g class="grid" stroke="#e6e6e6" stroke-width="1">`);
  for (const v of yt.values) parts.push(`<path d="M${fmt(padL)} ${fmt(py(v))}L${fmt(padL + pw)} ${fmt(py(v))}"/>`);
  parts.push(`</g>`);
  parts.push(`<g class="axes" stroke="#444444" stroke-width="1" fill="none">`);
  parts.push(`<path d="M${fmt(padL)} ${fmt(padT)}L${fmt(padL)} ${fmt(padT + ph)}L${fmt(padL + pw)} ${fmt(padT + ph)}"/>`);
  for (const v of xt.values) parts.push(`<path d="M${fmt(px(v))} ${fmt(padT + ph)}L${fmt(px(v))} ${fmt(padT + ph + 5)}"/>`);
  for (const v of yt.values) parts.push(`<path d="M${fmt(padL - 5)} ${fmt(py(v))}L${fmt(padL)} ${fmt(py(v))}"/>`);
  parts.push(`</g>`);
  parts.push(`<g font-family="sans-serif" font-size="11" fill="#333333">`);
  xt.values.forEach((v, k) => parts.push(`<text class="x-tick" x="${fmt(px(v))}" y="${fmt(padT + ph + 18)}" text-anchor="middle">${escapeXml(xt.labels[k])}</text>`));
  yt.values.forEach((v, k) => parts.push(`<text class="y-tick" x="${fmt(padL - 8)}" y="${fmt(py(v) + 4)}" text-anchor="end">${escapeXml(yt.labels[k])}</text>`));
  parts.push(`<text class="x-label" x="${fmt(padL + pw / 2)}" y="${fmt(height - 8)}" text-anchor="middle" font-size="12">${escapeXml(xLabel)}</text>`);
  parts.push(
    `<text class="y-label" x="${fmt(14)}" y="${fmt(padT + ph / 2)}" text-anchor="middle" font-size="12" transform="rotate(-90 ${fmt(14)} ${fmt(padT + ph / 2)})">${escapeXml(yLabel)}</text>`,
  );
  parts.push(`</g>`);
  // curves: the target first (wide), the envelopes and the squeeze over it (narrower, dashed)
  parts.push(`<path class="target" d="${path(fy)}" fill="none" ${STYLE.target}/>`);
  if (under) parts.push(`<path class="setup-envelope" d="${path(uy)}" fill="none" ${STYLE.setup}/>`);
  parts.push(`<path class="envelope" d="${path(gy)}" fill="none" ${STYLE.envelope}/>`);
  parts.push(`<path class="squeeze" d="${path(sy)}" fill="none" ${STYLE.squeeze}/>`);
  // touch points: filled for the drawn hull, hollow for the setup hull under it
  const marks = (desc0: EnvelopeDescription, cls: string, attrs: string, r: number): void => {
    parts.push(`<g class="${cls}" ${attrs}>`);
    const pts = desc0.touchPoints;
    for (let i = 0; i < pts.length; i++) {
      const x = pts[i];
      if (!(x >= a && x <= b)) continue;
      const lf = desc0.touchLogDensities[i] - ref;
      const ok = lf > -Infinity && (!logPlot || lf >= bottom);
      const y = ok ? Math.min(yMax, Math.max(yMin, yOf(lf))) : yMin;
      parts.push(`<circle cx="${fmt(px(x))}" cy="${fmt(py(y))}" r="${r}"/>`);
    }
    parts.push(`</g>`);
  };
  if (under) marks(under, 'setup-touch-points', 'fill="#ffffff" stroke="#555555" stroke-width="1.2"', 4.5);
  marks(main, 'touch-points', 'fill="#000000"', 2.5);
  // legend with swatches in the curves' styles
  const items: Array<[string, string]> = [
    ['target', STYLE.target],
    [`envelope, ${mainName}`, STYLE.envelope],
    ...(under ? ([['envelope, setup hull', STYLE.setup]] as Array<[string, string]>) : []),
    ['squeeze', STYLE.squeeze],
  ];
  const lw = 212;
  const lh = 16 * items.length + 36;
  // the corner of the plot that the curves cross least (ties: top right, top left, bottom right, bottom left)
  const covered = (x0: number, y0: number): number => {
    let hits = 0;
    for (const vals of [fy, gy, sy, uy]) {
      for (let i = 0; i < n; i++) {
        const lv = vals[i];
        if (!(lv > -Infinity && lv < Infinity) || (logPlot && lv < bottom)) continue;
        const X = px(xs[i]);
        const Y = py(Math.min(yMax, Math.max(yMin, yOf(lv))));
        if (X >= x0 && X <= x0 + lw && Y >= y0 && Y <= y0 + lh) hits++;
      }
    }
    return hits;
  };
  const corners: Array<[number, number]> = [
    [padL + pw - lw - 6, padT + 6],
    [padL + 6, padT + 6],
    [padL + pw - lw - 6, padT + ph - lh - 6],
    [padL + 6, padT + ph - lh - 6],
  ];
  let [lx, ly] = corners[0];
  let fewest = Infinity;
  for (const [cx, cy] of corners) {
    const h = covered(cx, cy);
    if (h < fewest) {
      fewest = h;
      lx = cx;
      ly = cy;
    }
  }
  parts.push(`<g class="legend" font-family="sans-serif" font-size="11">`);
  parts.push(`<rect x="${fmt(lx)}" y="${fmt(ly)}" width="${lw}" height="${lh}" fill="#ffffff" fill-opacity="0.9" stroke="#cccccc"/>`);
  items.forEach(([name, style], k) => {
    const y = ly + 14 + 16 * k;
    parts.push(`<path class="swatch" d="M${fmt(lx + 8)} ${fmt(y)}L${fmt(lx + 40)} ${fmt(y)}" fill="none" ${style}/>`);
    parts.push(`<text x="${fmt(lx + 48)}" y="${fmt(y + 4)}" fill="#222222">${escapeXml(name)}</text>`);
  });
  const yk = ly + 14 + 16 * items.length;
  parts.push(`<circle cx="${fmt(lx + 24)}" cy="${fmt(yk)}" r="2.5" fill="#000000"/>`);
  parts.push(`<text x="${fmt(lx + 48)}" y="${fmt(yk + 4)}" fill="#222222">${tp.length} touch points${under ? ` (setup: ${under.touchPoints.length}, hollow)` : ''}</text>`);
  parts.push(`<text x="${fmt(lx + 8)}" y="${fmt(yk + 20)}" fill="#555555">${escapeXml(`${main.transform} transform, ${constructionLabel(main.construction)}`)}</text>`);
  parts.push(`</g>`);
  parts.push(`</svg>`);
  return parts.join('\n');
}

/** How the figure names an envelope's construction. @internal */
function constructionLabel(c: 'tangent' | 'secant' | 'bounds'): string {
  return c === 'bounds' ? 'proven from bounds' : `${c}s`;
}
