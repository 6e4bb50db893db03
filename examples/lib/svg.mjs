// Tiny SVG helpers for the examples (no dependencies). Invented-data figures only.

/** Histogram of draws (as a density) against a density curve, as an SVG string. */
export function histogramSvg({ draws, density, lower, upper, bins = 60, title = '', xLabel = 'x', width = 720, height = 360 }) {
  const counts = new Float64Array(bins);
  const w = (upper - lower) / bins;
  let n = 0;
  for (const x of draws) {
    const i = Math.floor((x - lower) / w);
    if (i >= 0 && i < bins) { counts[i]++; n++; }
  }
  const hist = Array.from(counts, (c) => c / (draws.length * w));
  const grid = Array.from({ length: 400 }, (_, i) => lower + ((i + 0.5) * (upper - lower)) / 400);
  const dens = grid.map(density);
  const yMax = Math.max(...hist, ...dens) * 1.1;
  const m = { l: 56, r: 16, t: 36, b: 44 };
  const px = (x) => m.l + ((x - lower) / (upper - lower)) * (width - m.l - m.r);
  const py = (y) => height - m.b - (y / yMax) * (height - m.t - m.b);
  const bars = hist
    .map((h, i) => `<rect x="${px(lower + i * w).toFixed(2)}" y="${py(h).toFixed(2)}" width="${(px(lower + (i + 1) * w) - px(lower + i * w)).toFixed(2)}" height="${(py(0) - py(h)).toFixed(2)}" fill="#9ecae1" stroke="#6baed6" stroke-width="0.5"/>`)
    .join('');
  const path = grid.map((x, i) => `${i === 0 ? 'M' : 'L'}${px(x).toFixed(2)},${py(dens[i]).toFixed(2)}`).join('');
  const ticks = Array.from({ length: 6 }, (_, i) => lower + (i * (upper - lower)) / 5)
    .map((x) => `<text x="${px(x).toFixed(1)}" y="${height - m.b + 16}" font-size="11" text-anchor="middle">${+x.toFixed(2)}</text>`)
    .join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif">
<rect width="100%" height="100%" fill="white"/>
<text x="${width / 2}" y="20" font-size="14" text-anchor="middle">${title}</text>
${bars}
<path d="${path}" fill="none" stroke="#d62728" stroke-width="2"/>
<line x1="${m.l}" y1="${py(0)}" x2="${width - m.r}" y2="${py(0)}" stroke="black"/>
<line x1="${m.l}" y1="${m.t}" x2="${m.l}" y2="${py(0)}" stroke="black"/>
${ticks}
<text x="${width / 2}" y="${height - 8}" font-size="12" text-anchor="middle">${xLabel}</text>
<text x="${width - m.r - 4}" y="${m.t + 4}" font-size="11" text-anchor="end">bars: ${draws.length} draws; red: target density</text>
</svg>
`;
}
