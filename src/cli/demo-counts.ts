/**
 * `exactdraw demo`, count part: hourly rentals per station.
 *
 * INVENTED DATA. The count law below is made up for this demo: a
 * zero-inflated, over-dispersed count (a station is closed for the hour with
 * probability 0.18; otherwise a negative-binomial-shaped count with r = 2.2
 * and mean 6), known to the sampler only as an unnormalized log-pmf.
 *
 * @packageDocumentation
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { discreteChiSquareCheck } from '../checks/discrete-chi-square.js';
import type { DiscreteTarget } from '../core/types.js';
import { discreteSampler } from '../discrete/discrete-sampler.js';
import { substream } from '../random/substream.js';
import { gammaln } from '../vendor/stdlib.js';
import { escapeXml } from './svg.js';

const CLOSED = 0.18; // invented
const R = 2.2; // invented
const MEAN = 6; // invented
const P = R / (R + MEAN);

/** Invented hourly rental count law (unnormalized log-pmf on 0, 1, 2, ...). */
export const hourlyRentals: DiscreteTarget = {
  support: [0, Infinity],
  logPmf(k: number): number {
    if (k < 0) return -Infinity;
    const nb = gammaln(k + R) - gammaln(R) - gammaln(k + 1) + R * Math.log(P) + k * Math.log1p(-P);
    // weight 1 - CLOSED on the count law, CLOSED on an extra zero; scaled by an arbitrary 7 (unnormalized)
    return Math.log(7) + (k === 0 ? Math.log(CLOSED + (1 - CLOSED) * Math.exp(nb)) : Math.log(1 - CLOSED) + nb);
  },
};

/** Runs the count demo: prints with `log`, writes `hourly-rentals.svg` under `outDir`. */
export function runCountsDemo(log: (line: string) => void, outDir: string, seed: number): string {
  const stations = 40;
  const hours = 24 * 30;
  const n = stations * hours;
  const s = discreteSampler(hourlyRentals, { uniform: substream(seed, 3), expectedDraws: n });
  const counts = s.fill(new Int32Array(n));
  // reference pmf: normalized by summing the log-pmf (independent of the sampler's table)
  const top = 400;
  const w = new Float64Array(top + 1);
  let z = 0;
  for (let k = 0; k <= top; k++) z += w[k] = Math.exp(hourlyRentals.logPmf(k) - Math.log(7));
  const pmf = (k: number): number => (k >= 0 && k <= top ? w[k] / z : 0);
  const check = discreteChiSquareCheck(counts, pmf, [0, Infinity]);
  let zeros = 0;
  let sum = 0;
  let max = 0;
  for (const c of counts) {
    if (c === 0) zeros++;
    sum += c;
    if (c > max) max = c;
  }
  const st = s.stats;
  log('');
  log('hourly rentals per station (INVENTED zero-inflated, over-dispersed count law): discreteSampler');
  log(`  station-hours simulated     ${n} (${stations} stations x ${hours} hours)`);
  log(`  method chosen               ${s.choice.method}`);
  log(`  why                         ${s.choice.reason}`);
  log(`  mean rentals per hour       ${(sum / n).toFixed(3)} (law: ${((1 - CLOSED) * MEAN).toFixed(3)})`);
  log(`  hours with no rental        ${((100 * zeros) / n).toFixed(2)} % (law: ${(100 * pmf(0)).toFixed(2)} %)`);
  log(`  busiest station-hour        ${max} rentals`);
  log(`  evaluations                 setup ${st.setupEvaluations}, per draw ${(st.densityEvaluations / st.samples).toFixed(4)}`);
  log(`  chi-square p-value          ${check.pValue.toFixed(4)} (X2 = ${check.statistic.toFixed(2)}, df = ${check.df}; cells pooled to expected >= 5)`);
  const file = join(outDir, 'hourly-rentals.svg');
  writeFileSync(file, countsSvg(counts, pmf, 30));
  return file;
}

/** Bars of observed frequencies against the pmf (dots), k = 0..kMax. */
function countsSvg(counts: Int32Array, pmf: (k: number) => number, kMax: number): string {
  const width = 720;
  const height = 360;
  const m = { l: 64, r: 16, t: 36, b: 48 };
  const freq = new Float64Array(kMax + 1);
  for (const c of counts) if (c <= kMax) freq[c]++;
  for (let k = 0; k <= kMax; k++) freq[k] /= counts.length;
  let yMax = 0;
  for (let k = 0; k <= kMax; k++) yMax = Math.max(yMax, freq[k], pmf(k));
  const step = yMax > 0.2 ? 0.05 : 0.02;
  yMax = Math.ceil((yMax * 1.05) / step) * step;
  const bw = (width - m.l - m.r) / (kMax + 1);
  const px = (k: number): number => m.l + (k + 0.5) * bw;
  const py = (y: number): number => height - m.b - (y / yMax) * (height - m.t - m.b);
  const parts: string[] = [];
  for (let k = 0; k <= kMax; k++) {
    parts.push(`<rect x="${(px(k) - bw * 0.4).toFixed(2)}" y="${py(freq[k]).toFixed(2)}" width="${(bw * 0.8).toFixed(2)}" height="${(py(0) - py(freq[k])).toFixed(2)}" fill="#9ecae1"/>`);
    parts.push(`<circle cx="${px(k).toFixed(2)}" cy="${py(pmf(k)).toFixed(2)}" r="3" fill="#d62728"/>`);
    if (k % 5 === 0) parts.push(`<text x="${px(k).toFixed(1)}" y="${height - m.b + 16}" font-size="11" text-anchor="middle">${k}</text>`);
  }
  for (let y = 0; y <= yMax + 1e-12; y += step) {
    parts.push(`<text x="${m.l - 6}" y="${(py(y) + 4).toFixed(1)}" font-size="11" text-anchor="end">${+y.toFixed(2)}</text>`);
    parts.push(`<line x1="${m.l - 3}" y1="${py(y).toFixed(1)}" x2="${m.l}" y2="${py(y).toFixed(1)}" stroke="black"/>`);
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif">
<rect width="100%" height="100%" fill="white"/>
<text x="${width / 2}" y="20" font-size="14" text-anchor="middle">${escapeXml('Hourly rentals per station (invented count law): exact draws vs pmf')}</text>
${parts.join('\n')}
<line x1="${m.l}" y1="${py(0)}" x2="${width - m.r}" y2="${py(0)}" stroke="black"/>
<line x1="${m.l}" y1="${m.t}" x2="${m.l}" y2="${py(0)}" stroke="black"/>
<text x="${width / 2}" y="${height - 10}" font-size="12" text-anchor="middle">rentals in the hour (k)</text>
<text x="16" y="${height / 2}" font-size="12" text-anchor="middle" transform="rotate(-90 16 ${height / 2})">probability</text>
<text x="${width - m.r - 4}" y="${m.t + 4}" font-size="11" text-anchor="end">bars: ${counts.length} draws; red dots: pmf</text>
</svg>
`;
}
