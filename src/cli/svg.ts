/**
 * Histogram-versus-density SVG figures for the demo (string building only).
 *
 * @packageDocumentation
 */
import { roundTicks } from '../checks/svg-ticks.js';

/** Inputs of {@link histogramSvg}. */
export interface HistogramFigure {
  draws: ArrayLike<number>;
  density: (x: number) => number;
  /** Optional envelope curve (same scale as `density`), drawn dashed over the density. */
  envelope?: (x: number) => number;
  lower: number;
  upper: number;
  bins?: number;
  /** Title, drawn at the top and used as the accessible name (`<title>`). */
  title?: string;
  /** Label of the x axis, with its unit. */
  xLabel?: string;
  /** Label of the y axis, with its unit (default: 'density (per unit of x)'). */
  yLabel?: string;
  width?: number;
  height?: number;
}

/** Line styles (also used by the legend swatches): the density wide and solid, the envelope narrower and dashed over it. */
const STYLE = {
  density: 'stroke="#b2182b" stroke-width="3" stroke-opacity="0.85"',
  envelope: 'stroke="#1b7837" stroke-width="1.5" stroke-dasharray="7 4"',
} as const;

/** Histogram of draws (as a density) against a density curve, as an SVG document. */
export function histogramSvg(fig: HistogramFigure): string {
  const { draws, density, lower, upper } = fig;
  const bins = fig.bins ?? 60;
  const width = fig.width ?? 720;
  const height = fig.height ?? 380;
  const title = fig.title ?? 'Histogram of draws against the target density';
  const xLabel = fig.xLabel ?? 'x';
  const yLabel = fig.yLabel ?? 'density (per unit of x)';
  const counts = new Float64Array(bins);
  const w = (upper - lower) / bins;
  for (let k = 0; k < draws.length; k++) {
    const i = Math.floor((draws[k] - lower) / w);
    if (i >= 0 && i < bins) counts[i]++;
  }
  const hist = Array.from(counts, (c) => c / (draws.length * w));
  const grid = Array.from({ length: 400 }, (_, i) => lower + ((i + 0.5) * (upper - lower)) / 400);
  const dens = grid.map(density);
  const env = fig.envelope === undefined ? [] : grid.map(fig.envelope);
  let peak = 0;
  for (const v of [...hist, ...dens, ...env]) if (Number.isFinite(v) && v > peak) peak = v;
  const yMax = (peak > 0 ? peak : 1) * 1.08;
  const m = { l: 70, r: 16, t: 36, b: 48 };
  const pw = width - m.l - m.r;
  const ph = height - m.t - m.b;
  const px = (x: number): number => m.l + ((x - lower) / (upper - lower)) * pw;
  const py = (y: number): number => height - m.b - (y / yMax) * ph;
  const f = (v: number): string => v.toFixed(2);
  const bars = hist
    .map((h, i) => {
      const x0 = px(lower + i * w);
      const x1 = px(lower + (i + 1) * w);
      return `<rect x="${f(x0)}" y="${f(py(h))}" width="${f(x1 - x0)}" height="${f(py(0) - py(h))}" fill="#c6dbef" stroke="#6baed6" stroke-width="0.5"/>`;
    })
    .join('\n');
  const line = (ys: number[]): string =>
    grid
      .map((x, i) => (Number.isFinite(ys[i]) ? `${i === 0 || !Number.isFinite(ys[i - 1]) ? 'M' : 'L'}${f(px(x))} ${f(py(Math.min(ys[i], yMax)))}` : ''))
      .join('');
  const xt = roundTicks(lower, upper, Math.max(3, Math.min(13, Math.floor(pw / 55))));
  const yt = roundTicks(0, yMax, Math.max(3, Math.min(8, Math.floor(ph / 40))));
  const grids = yt.values.map((v) => `<path d="M${m.l} ${f(py(v))}L${width - m.r} ${f(py(v))}"/>`).join('');
  const xTicks = xt.values
    .map((v, k) => `<path d="M${f(px(v))} ${f(py(0))}L${f(px(v))} ${f(py(0) + 5)}" stroke="#444444"/><text class="x-tick" x="${f(px(v))}" y="${f(py(0) + 18)}" text-anchor="middle">${escapeXml(xt.labels[k])}</text>`)
    .join('\n');
  const yTicks = yt.values
    .map((v, k) => `<path d="M${m.l - 5} ${f(py(v))}L${m.l} ${f(py(v))}" stroke="#444444"/><text class="y-tick" x="${m.l - 8}" y="${f(py(v) + 4)}" text-anchor="end">${escapeXml(yt.labels[k])}</text>`)
    .join('\n');
  const items: Array<[string, string]> = [[`draws (${draws.length}), as a density`, 'bar'], ['target density', STYLE.density], ...(fig.envelope === undefined ? [] : ([['envelope', STYLE.envelope]] as Array<[string, string]>))];
  const lw = 210;
  const lh = 16 * items.length + 10;
  // the top corner that the bars and curves reach into least (ties: right)
  const ly = m.t + 6;
  const covered = (x0: number): number => {
    let hits = 0;
    for (let i = 0; i < grid.length; i++) {
      const X = px(grid[i]);
      if (X < x0 || X > x0 + lw) continue;
      const hb = hist[Math.min(bins - 1, Math.floor((grid[i] - lower) / w))];
      for (const v of [dens[i], env[i] ?? 0, hb]) if (Number.isFinite(v) && py(v) <= ly + lh) hits++;
    }
    return hits;
  };
  const right = width - m.r - lw - 6;
  const left = m.l + 6;
  const lx = covered(right) <= covered(left) ? right : left;
  const legend = items
    .map(([name, style], k) => {
      const y = ly + 14 + 16 * k;
      const sw = style === 'bar' ? `<rect x="${lx + 8}" y="${y - 5}" width="32" height="10" fill="#c6dbef" stroke="#6baed6"/>` : `<path class="swatch" d="M${lx + 8} ${y}L${lx + 40} ${y}" fill="none" ${style}/>`;
      return `${sw}<text x="${lx + 48}" y="${y + 4}">${escapeXml(name)}</text>`;
    })
    .join('\n');
  const desc = `Histogram of ${draws.length} draws of ${xLabel} from ${lower} to ${upper} in ${bins} bins, scaled to a density (${yLabel}), against the target density (solid line)${fig.envelope === undefined ? '' : ' and the envelope (dashed)'}.`;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" role="img" aria-label="${escapeXml(title)}">
<title>${escapeXml(title)}</title>
<desc>${escapeXml(desc)}</desc>
<rect width="100%" height="100%" fill="white"/>
<text x="${width / 2}" y="20" font-size="14" text-anchor="middle">${escapeXml(title)}</text>
<g class="grid" stroke="#e6e6e6" stroke-width="1">${grids}</g>
<g class="bars">
${bars}
</g>
<path class="density" d="${line(dens)}" fill="none" ${STYLE.density}/>
${env.length > 0 ? `<path class="envelope" d="${line(env)}" fill="none" ${STYLE.envelope}/>` : ''}
<g class="axes" stroke="#444444" fill="none"><path d="M${m.l} ${m.t}L${m.l} ${f(py(0))}L${width - m.r} ${f(py(0))}"/></g>
<g font-size="11" fill="#333333">
${xTicks}
${yTicks}
<text class="x-label" x="${f(m.l + pw / 2)}" y="${height - 8}" font-size="12" text-anchor="middle">${escapeXml(xLabel)}</text>
<text class="y-label" x="14" y="${f(m.t + ph / 2)}" font-size="12" text-anchor="middle" transform="rotate(-90 14 ${f(m.t + ph / 2)})">${escapeXml(yLabel)}</text>
</g>
<g class="legend" font-size="11" fill="#222222">
<rect x="${lx}" y="${ly}" width="${lw}" height="${lh}" fill="#ffffff" fill-opacity="0.9" stroke="#cccccc"/>
${legend}
</g>
</svg>
`;
}

/** Escapes text for SVG. */
export function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
