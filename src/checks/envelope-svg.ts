/**
 * SVG figure of a hull envelope: target, envelope, squeeze and touch points.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import type { Target } from '../core/types.js';
import { evaluateEnvelope } from '../methods/hull/describe.js';
import type { EnvelopeDescription } from '../methods/hull/describe.js';
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
   * Title, drawn at the top and used as the accessible name.
   * @defaultValue 'Target, envelope and squeeze'
   */
  title?: string;
}

const API = 'envelopeSvg';

function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function fmt(v: number): string {
  return (Math.round(v * 100) / 100).toString();
}

function label(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  return a >= 1e-3 && a < 1e5 ? Number(v.toPrecision(4)).toString() : v.toExponential(2);
}

function checkSize(name: string, v: unknown, min: number, max: number): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max) {
    throw new InvalidTargetError(`${API}: options.${name} must be a number in [${min}, ${max}], got ${String(v)}`);
  }
  return v;
}

/**
 * Draws the target, the envelope and the squeeze of a hull sampler (or of an
 * envelope description) as an SVG document, with the touch points marked.
 *
 * @remarks
 * Pure string building, no DOM or Node API: the result can be written to a
 * file, inlined in HTML or returned by a server. Heights are divided by
 * e^logScale of the description, so the envelope's maximum is near 1; the
 * target is drawn from its own `logDensity`, so an unnormalized target is
 * drawn on the envelope's scale. Where a curve is not defined (no squeeze on
 * the tails; −∞ on a log plot) the line is interrupted.
 *
 * @param source - a sampler with an `envelope` (e.g. from {@link adaptiveRejectionSampler}) or an {@link EnvelopeDescription}
 * @param target - the target the envelope was built for
 * @param options - size, x range, resolution, log scale, title
 * @returns an SVG document as a string
 * @throws {@link InvalidTargetError} for a malformed source, target or option
 * @example
 * ```ts
 * const s = adaptiveRejectionSampler(gammaTarget(2.5), { seed: 1 });
 * const svg = envelopeSvg(s, gammaTarget(2.5), { title: 'gamma(2.5) hull' });
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
  const env: EnvelopeDescription = 'pieces' in source ? source : source.envelope;
  if (env === undefined || env === null || !Array.isArray(env.pieces) || !Array.isArray(env.touchPoints)) {
    throw new InvalidTargetError(`${API}: source has no envelope description (expected pieces and touchPoints)`);
  }
  if (target === null || typeof target !== 'object' || typeof target.logDensity !== 'function') {
    throw new InvalidTargetError(`${API}: target must be an object with a logDensity function`);
  }
  if (options === null || typeof options !== 'object') {
    throw new InvalidTargetError(`${API}: options must be an object, got ${String(options)}`);
  }
  const width = checkSize('width', options.width ?? 640, 100, 10000);
  const height = checkSize('height', options.height ?? 360, 80, 10000);
  const n = Math.floor(checkSize('points', options.points ?? 400, 2, 100000));
  const logPlot = options.logScale ?? false;
  if (typeof logPlot !== 'boolean') throw new InvalidTargetError(`${API}: options.logScale must be a boolean, got ${String(logPlot)}`);
  const title = options.title ?? 'Target, envelope and squeeze';
  if (typeof title !== 'string') throw new InvalidTargetError(`${API}: options.title must be a string, got ${String(title)}`);

  const [sLo, sHi] = env.support;
  const tp = env.touchPoints;
  let a: number;
  let b: number;
  if (options.range !== undefined) {
    const r = options.range;
    if (!Array.isArray(r) || r.length !== 2 || !Number.isFinite(r[0]) || !Number.isFinite(r[1]) || !(r[0] < r[1])) {
      throw new InvalidTargetError(`${API}: options.range must be a pair [a, b] of finite numbers with a < b, got ${String(r)}`);
    }
    a = r[0];
    b = r[1];
  } else {
    const t0 = tp.length > 0 ? tp[0] : 0;
    const t1 = tp.length > 0 ? tp[tp.length - 1] : 1;
    const spread = t1 > t0 ? t1 - t0 : Math.max(1, Math.abs(t0));
    a = Math.max(sLo, t0 - 0.5 * spread);
    b = Math.min(sHi, t1 + 0.5 * spread);
    if (!(a < b)) {
      a = t0 - 1;
      b = t1 + 1;
    }
  }

  const ref = env.logScale;
  const xs = new Float64Array(n);
  const fy = new Float64Array(n);
  const gy = new Float64Array(n);
  const sy = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = a + ((b - a) * i) / (n - 1);
    xs[i] = x;
    const v = evaluateEnvelope(env, x);
    const lf = target.logDensity(x);
    fy[i] = (typeof lf === 'number' ? lf : NaN) - ref;
    gy[i] = v.logEnvelope - ref;
    sy[i] = v.logSqueeze - ref;
  }
  let top = -Infinity;
  for (let i = 0; i < n; i++) {
    if (gy[i] > top && gy[i] < Infinity) top = gy[i];
    if (fy[i] > top && fy[i] < Infinity) top = fy[i];
  }
  if (!(top > -Infinity)) top = 0;
  const bottom = top - 30;
  const yOf = (lv: number): number => (logPlot ? lv : Math.exp(lv - top));
  const yMax = logPlot ? top : 1;
  const yMin = logPlot ? bottom : 0;

  const padL = 56;
  const padR = 16;
  const padT = 34;
  const padB = 40;
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

  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-label="${escapeXml(title)}">`,
  );
  parts.push(`<title>${escapeXml(title)}</title>`);
  parts.push(`<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`);
  parts.push(`<text x="${fmt(width / 2)}" y="20" text-anchor="middle" font-family="sans-serif" font-size="14">${escapeXml(title)}</text>`);
  // axes
  parts.push(`<g stroke="#444444" stroke-width="1" fill="none">`);
  parts.push(`<path d="M${fmt(padL)} ${fmt(padT)}L${fmt(padL)} ${fmt(padT + ph)}L${fmt(padL + pw)} ${fmt(padT + ph)}"/>`);
  parts.push(`</g>`);
  parts.push(`<g font-family="sans-serif" font-size="11" fill="#444444">`);
  for (let i = 0; i <= 4; i++) {
    const x = a + ((b - a) * i) / 4;
    parts.push(`<text x="${fmt(px(x))}" y="${fmt(padT + ph + 16)}" text-anchor="middle">${escapeXml(label(x))}</text>`);
  }
  parts.push(`<text x="${fmt(padL - 6)}" y="${fmt(py(yMax) + 4)}" text-anchor="end">${escapeXml(label(logPlot ? yMax + ref : exp(top + ref)))}</text>`);
  parts.push(`<text x="${fmt(padL - 6)}" y="${fmt(py(yMin) + 4)}" text-anchor="end">${escapeXml(logPlot ? label(yMin + ref) : '0')}</text>`);
  parts.push(`<text x="${fmt(padL + pw / 2)}" y="${fmt(height - 6)}" text-anchor="middle">x</text>`);
  parts.push(`</g>`);
  // curves
  parts.push(`<path class="envelope" d="${path(gy)}" fill="none" stroke="#d62728" stroke-width="1.5"/>`);
  parts.push(`<path class="squeeze" d="${path(sy)}" fill="none" stroke="#2ca02c" stroke-width="1.5" stroke-dasharray="5 3"/>`);
  parts.push(`<path class="target" d="${path(fy)}" fill="none" stroke="#1f77b4" stroke-width="1.5"/>`);
  // touch points
  parts.push(`<g class="touch-points" fill="#000000">`);
  for (let i = 0; i < tp.length; i++) {
    const x = tp[i];
    if (!(x >= a && x <= b)) continue;
    const lf = env.touchLogDensities[i] - ref;
    const ok = lf > -Infinity && (!logPlot || lf >= bottom);
    const y = ok ? Math.min(yMax, Math.max(yMin, yOf(lf))) : yMin;
    parts.push(`<circle cx="${fmt(px(x))}" cy="${fmt(py(y))}" r="2.5"/>`);
  }
  parts.push(`</g>`);
  // legend
  const lx = padL + pw - 150;
  const ly = padT + 8;
  parts.push(`<g font-family="sans-serif" font-size="11">`);
  const items: Array<[string, string, string]> = [
    ['envelope', '#d62728', ''],
    ['target', '#1f77b4', ''],
    ['squeeze', '#2ca02c', ' stroke-dasharray="5 3"'],
  ];
  items.forEach(([name, color, dash], k) => {
    const y = ly + 14 * k;
    parts.push(`<path d="M${fmt(lx)} ${fmt(y)}L${fmt(lx + 22)} ${fmt(y)}" stroke="${color}" stroke-width="1.5"${dash}/>`);
    parts.push(`<text x="${fmt(lx + 28)}" y="${fmt(y + 4)}" fill="#222222">${name}</text>`);
  });
  parts.push(`<text x="${fmt(lx)}" y="${fmt(ly + 46)}" fill="#222222">${tp.length} touch points, ${env.transform}, ${env.construction}</text>`);
  parts.push(`</g>`);
  parts.push(`</svg>`);
  return parts.join('\n');
}
