/**
 * `exactdraw demo`: a city bike-share fleet simulation.
 *
 * INVENTED DATA. The city, its stations, the tariff and the trip-duration
 * density are made up for this demo; they describe no real system.
 *
 * @packageDocumentation
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { andersonDarlingCheck } from '../checks/anderson-darling.js';
import { ksCheck } from '../checks/ks.js';
import type { Target } from '../core/types.js';
import { envelopeSvg } from '../checks/envelope-svg.js';
import { adaptiveRejectionSampler } from '../methods/adaptive-rejection.js';
import { rejectionSampler } from '../methods/rejection.js';
import { exactSampler } from '../methods/auto.js';
import type { PiecewiseSampler } from '../methods/piecewise.js';
import { normalTarget } from '../targets/normal.js';
import { truncate } from '../targets/truncate.js';
import { exponentialProposal } from '../proposals/exponential.js';
import { substream } from '../random/substream.js';
import { histogramSvg } from './svg.js';
import { runCountsDemo } from './demo-counts.js';

/** Rental limit in minutes (invented rule). */
export const LIMIT_MINUTES = 180;

const commute = { weight: 0.72, logMedian: Math.log(11), sigma: 0.42 }; // lognormal part (invented)
const leisure = { weight: 0.28, scale: 10 }; // gamma(shape 4) part, mean 40 min (invented)

function logLognormal(x: number, logMedian: number, sigma: number): number {
  const z = (Math.log(x) - logMedian) / sigma;
  return -0.5 * z * z - Math.log(x * sigma * Math.sqrt(2 * Math.PI));
}
function logGamma4(x: number, scale: number): number {
  return 3 * Math.log(x / scale) - x / scale - Math.log(6 * scale); // Γ(4) = 6
}

/**
 * Invented trip-duration density (minutes): a commute peak near 11 minutes, a
 * leisure shoulder near 40 minutes, and the 180-minute rental limit.
 */
export const tripDuration: Target = {
  support: [1, LIMIT_MINUTES],
  logDensity(x: number): number {
    if (!(x >= 1 && x <= LIMIT_MINUTES)) return -Infinity;
    const a = Math.log(commute.weight) + logLognormal(x, commute.logMedian, commute.sigma);
    const b = Math.log(leisure.weight) + logGamma4(x, leisure.scale);
    const m = Math.max(a, b);
    return m + Math.log(Math.exp(a - m) + Math.exp(b - m));
  },
};

/** A cdf of exp(logf) on [a, b] by Simpson quadrature (independent of the samplers). */
export function quadratureCdf(logf: (x: number) => number, a: number, b: number, cells = 20000): { total: number; cdf: (x: number) => number } {
  const h = (b - a) / cells;
  const cum = new Float64Array(cells + 1);
  const f = (x: number): number => Math.exp(logf(x));
  for (let i = 0; i < cells; i++) {
    const x0 = a + i * h;
    cum[i + 1] = cum[i] + (h / 6) * (f(x0) + 4 * f(x0 + h / 2) + f(x0 + h));
  }
  const total = cum[cells];
  return {
    total,
    cdf(x: number): number {
      if (x <= a) return 0;
      if (x >= b) return 1;
      const i = Math.min(cells - 1, Math.floor((x - a) / h));
      const x0 = a + i * h;
      const d = x - x0;
      return Math.min(1, (cum[i] + (d / 6) * (f(x0) + 4 * f(x0 + d / 2) + f(x))) / total);
    },
  };
}

/** Runs the demo, printing with `log` and writing figures under `outDir`. */
export function runDemo(log: (line: string) => void, outDir = 'out', seed = 2026): void {
  const sampler = rejectionSampler(tripDuration, {
    proposal: exponentialProposal(1 / 20, 1), // heavier tail than the target; origin at 1 minute
    uniform: substream(seed, 0),
  });
  const stations = 40;
  const tripsPerStation = 500;
  const durations = sampler.fill(new Float64Array(stations * tripsPerStation));

  const freeMinutes = 30; // invented tariff: 30 free minutes, then 0.15 credits per minute
  let overageTrips = 0;
  let overage = 0;
  let minutes = 0;
  for (const d of durations) {
    minutes += d;
    if (d > freeMinutes) {
      overageTrips++;
      overage += 0.15 * (d - freeMinutes);
    }
  }
  const st = sampler.stats;
  const ref = quadratureCdf((x) => tripDuration.logDensity(x), 1, LIMIT_MINUTES);
  const ks = ksCheck(durations, ref.cdf);
  const ad = andersonDarlingCheck(durations, ref.cdf);

  log('exactdraw demo: bike-share fleet simulation (INVENTED data)');
  log('------------------------------------------------------------');
  log(`trips simulated              ${durations.length} (${stations} stations x ${tripsPerStation} trips)`);
  log(`mean trip duration           ${(minutes / durations.length).toFixed(2)} min`);
  log(`trips over ${freeMinutes} free minutes    ${((100 * overageTrips) / durations.length).toFixed(2)} %`);
  log(`overage revenue              ${overage.toFixed(0)} credits (invented tariff)`);
  log('');
  log('trip durations: rejectionSampler, exponential proposal, automatic bound');
  log(`  rejection constant C        ${Math.exp(sampler.logBound).toFixed(4)} (supremum found at ${sampler.argmax.toFixed(3)} min)`);
  log(`  acceptance rate             ${st.acceptanceRate.toFixed(4)} (theory Z/C = ${(ref.total / Math.exp(sampler.logBound)).toFixed(4)})`);
  log(`  density evaluations / draw  ${(st.densityEvaluations / st.samples).toFixed(3)}`);
  log(`  setup evaluations           ${st.setupEvaluations}`);
  log(`  KS p-value                  ${ks.pValue.toFixed(4)} (D = ${ks.statistic.toFixed(5)}; reference cdf by quadrature)`);
  log(`  Anderson-Darling p-value    ${ad.pValue.toFixed(4)} (A2 = ${ad.statistic.toFixed(3)})`);

  mkdirSync(outDir, { recursive: true });
  const file = join(outDir, 'trip-durations.svg');
  writeFileSync(
    file,
    histogramSvg({
      draws: durations,
      density: (x) => Math.exp(tripDuration.logDensity(x)) / ref.total,
      lower: 0,
      upper: 120,
      bins: 80,
      title: 'Bike-share trip durations (invented density): exact draws vs target',
      xLabel: 'trip duration in minutes (axis cut at 120 of the 180-minute limit)',
      yLabel: 'density (per minute)',
    }),
  );

  // Battery charge on return (%), invented: normal(62, 18) truncated to [0, 100].
  // Log-concave, so the adaptive hull serves it with almost no evaluations.
  const charge = truncate(normalTarget(62, 18), 0, 100);
  const hull = adaptiveRejectionSampler(charge, { uniform: substream(seed, 1) });
  // The envelope as built at setup (before adaptation), for the figure.
  const atSetup = hull.envelope;
  const charges = hull.fill(new Float64Array(durations.length));
  let low = 0;
  for (const c of charges) if (c < 20) low++;
  const hs = hull.stats;
  const env = hull.envelope;
  const ksCharge = ksCheck(charges, charge.cdf!);
  const adCharge = andersonDarlingCheck(charges, charge.cdf!);
  log('');
  log('battery charge on return: adaptiveRejectionSampler (log-concave hull)');
  log(`  bikes returned below 20 %   ${((100 * low) / charges.length).toFixed(2)} % (need a charging swap; invented rule)`);
  log(`  touch points / pieces       ${env.touchPoints.length} / ${env.pieces.length}`);
  log(`  acceptance rate             ${hs.acceptanceRate.toFixed(4)}`);
  log(`  density evaluations / draw  ${(hs.densityEvaluations / hs.samples).toFixed(4)} (setup ${hs.setupEvaluations})`);
  log(`  KS p-value                  ${ksCharge.pValue.toFixed(4)}; Anderson-Darling p-value ${adCharge.pValue.toFixed(4)} (cdf from @stdlib)`);
  const hullFile = join(outDir, 'battery-charge-envelope.svg');
  writeFileSync(
    hullFile,
    envelopeSvg(hull, charge, {
      setup: atSetup,
      stage: 'both',
      xLabel: 'battery charge on return (%)',
      title: `Battery charge on return (invented): hull at setup (${atSetup.touchPoints.length} touch points) and after ${charges.length} draws (${env.touchPoints.length})`,
    }),
  );

  // Daily demand: the time of day (hours) at which a rental starts, invented:
  // a morning rush near 8:15, an evening rush near 17:45 and a flat daytime
  // floor, known only up to a constant. exactSampler picks the method.
  const demand: Target = {
    support: [0, 24],
    logDensity(h: number): number {
      if (!(h >= 0 && h <= 24)) return -Infinity;
      const morning = 1.0 * Math.exp(-0.5 * ((h - 8.25) / 0.9) ** 2);
      const evening = 1.3 * Math.exp(-0.5 * ((h - 17.75) / 1.3) ** 2);
      const day = 0.25 * Math.exp(-0.5 * ((h - 13) / 4.5) ** 2);
      return Math.log(morning + evening + day + 0.01);
    },
  };
  // one draw per trip: many draws from one fixed target, so exactSampler is told and uses the fast path
  const demandSampler = exactSampler(demand, { uniform: substream(seed, 2), expectedDraws: durations.length });
  const starts = demandSampler.fill(new Float64Array(durations.length));
  const ds = demandSampler.stats;
  const demandRef = quadratureCdf((h) => demand.logDensity(h), 0, 24);
  const ksDemand = ksCheck(starts, demandRef.cdf);
  const adDemand = andersonDarlingCheck(starts, demandRef.cdf);
  let rush = 0;
  for (const h of starts) if ((h >= 7 && h < 9.5) || (h >= 16.5 && h < 19)) rush++;
  log('');
  log('rental start times (bimodal daily demand): exactSampler');
  log(`  method chosen               ${demandSampler.choice.method}`);
  log(`  why                         ${demandSampler.choice.reason}`);
  log(`  rentals in the two rushes   ${((100 * rush) / starts.length).toFixed(2)} %`);
  log(`  acceptance rate             ${ds.acceptanceRate.toFixed(4)}`);
  log(`  density evaluations / draw  ${(ds.densityEvaluations / ds.samples).toFixed(4)} (setup ${ds.setupEvaluations})`);
  log(`  KS p-value                  ${ksDemand.pValue.toFixed(4)}; Anderson-Darling p-value ${adDemand.pValue.toFixed(4)} (cdf by quadrature)`);
  const inner = demandSampler.sampler as Partial<PiecewiseSampler>;
  const envelopeCurve = typeof inner.logEnvelope === 'function' ? (h: number): number => Math.exp(inner.logEnvelope!(h)) / demandRef.total : undefined;
  const demandFile = join(outDir, 'daily-demand.svg');
  writeFileSync(
    demandFile,
    histogramSvg({
      draws: starts,
      density: (h) => Math.exp(demand.logDensity(h)) / demandRef.total,
      envelope: envelopeCurve,
      lower: 0,
      upper: 24,
      bins: 96,
      title: `Rental start times (invented bimodal demand): exactSampler chose ${demandSampler.choice.method}`,
      xLabel: 'hour of day (h)',
      yLabel: 'density (per hour)',
    }),
  );

  const countsFile = runCountsDemo(log, outDir, seed);
  log('');
  log(`figures written: ${file}, ${hullFile}, ${demandFile}, ${countsFile}`);
}
