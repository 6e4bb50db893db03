/**
 * Histogram-versus-density SVG figures for the demo (string building only).
 *
 * @packageDocumentation
 */

/** Inputs of {@link histogramSvg}. */
export interface HistogramFigure {
  draws: ArrayLike<number>;
  density: (x: number) => number;
  /** Optional envelope curve (same scale as `density`), drawn dashed. */
  envelope?: (x: number) => number;
  lower: number;
  upper: number;
  bins?: number;
  title?: string;
  xLabel?: string;
  width?: number;
  height?: number;
}

/** Histogram of draws (as a density) against a density curve, as an SVG document. */
export function histogramSvg(fig: HistogramFigure): string {
  const { draws, density, lower, upper } = fig;
  const bins = fig.bins ?? 60;
  const width = fig.width ?? 720;
  const height = fig.height ?? 360;
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
  const yMax = Math.max(...hist, ...dens, ...env.filter((v) => Number.isFinite(v))) * 1.1;
  const m = { l: 56, r: 16, t: 36, b: 44 };
  const px = (x: number): number => m.l + ((x - lower) / (upper - lower)) * (width - m.l - m.r);
  const py = (y: number): number => height - m.b - (y / yMax) * (height - m.t - m.b);
  const bars = hist
    .map((h, i) => {
      const x0 = px(lower + i * w);
      const x1 = px(lower + (i + 1) * w);
      return `<rect x="${x0.toFixed(2)}" y="${py(h).toFixed(2)}" width="${(x1 - x0).toFixed(2)}" height="${(py(0) - py(h)).toFixed(2)}" fill="#9ecae1" stroke="#6baed6" stroke-width="0.5"/>`;
    })
    .join('\n');
  const path = grid.map((x, i) => `${i === 0 ? 'M' : 'L'}${px(x).toFixed(2)},${py(dens[i]).toFixed(2)}`).join('');
  const ticks = Array.from({ length: 6 }, (_, i) => lower + (i * (upper - lower)) / 5)
    .map((x) => `<text x="${px(x).toFixed(1)}" y="${height - m.b + 16}" font-size="11" text-anchor="middle">${+x.toFixed(2)}</text>`)
    .join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif">
<rect width="100%" height="100%" fill="white"/>
<text x="${width / 2}" y="20" font-size="14" text-anchor="middle">${escapeXml(fig.title ?? '')}</text>
${bars}
<path d="${path}" fill="none" stroke="#d62728" stroke-width="2"/>
${env.length > 0 ? `<path d="${grid.map((x, i) => `${i === 0 ? 'M' : 'L'}${px(x).toFixed(2)},${py(Number.isFinite(env[i]) ? env[i] : 0).toFixed(2)}`).join('')}" fill="none" stroke="#2ca02c" stroke-width="1.2" stroke-dasharray="5,3"/>` : ''}
<line x1="${m.l}" y1="${py(0)}" x2="${width - m.r}" y2="${py(0)}" stroke="black"/>
<line x1="${m.l}" y1="${m.t}" x2="${m.l}" y2="${py(0)}" stroke="black"/>
${ticks}
<text x="${width / 2}" y="${height - 8}" font-size="12" text-anchor="middle">${escapeXml(fig.xLabel ?? 'x')}</text>
<text x="${width - m.r - 4}" y="${m.t + 4}" font-size="11" text-anchor="end">bars: ${draws.length} draws; red: target density${fig.envelope === undefined ? '' : '; green dashed: envelope'}</text>
</svg>
`;
}

/** Escapes text for SVG. */
export function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
