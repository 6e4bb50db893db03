/**
 * Counts, not times: acceptance against the table's envelope area,
 * evaluations per draw, setup evaluations; and a deliberately wrong table
 * (caps never accepted) whose draws the checks reject.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import { Counters } from '../../../src/core/counters.js';
import { setupHull } from '../../../src/methods/hull/setup.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import { buildAliasCells } from '../../../src/methods/table/alias.js';
import { buildStripTable } from '../../../src/methods/table/build.js';
import { tableFill } from '../../../src/methods/table/kernel.js';
import { UniformBlock } from '../../../src/random/uniform-block.js';
import { mersenneTwister } from '../../../src/random/mersenne-twister.js';
import { betaTarget } from '../../../src/targets/beta.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';
import type { Sampler } from '../../../src/core/types.js';
import { expectRate } from '../../helpers/statistical.js';
import { generatorSampler, methodSuites } from '../../helpers/method-suite.js';

describe('tableSampler counts', () => {
  it('tableSampler accepts Z / envelope area of its proposals (normalized targets, Z = 1), at 10 and 1,000 strips', () => {
    // plain rejection accepts Z_f / (C·Z_g) of proposals (common practice; Devroye 1986, II.3)
    for (const [t, opts] of [
      [normalTarget(0, 1), {}],
      [gammaTarget(2.5, 1), {}],
      [betaTarget(2, 5), {}],
      [studentTTarget(3), { transform: 'inverse-sqrt' as const }],
    ] as const) {
      for (const strips of [10, 1000]) {
        const s = tableSampler(t, { ...opts, strips, seed: 17 });
        s.fill(new Float64Array(200_000));
        const st = s.stats;
        expectRate(st.samples, st.proposals, Math.exp(-s.table.logEnvelopeArea), `acceptance, ${strips} strips`);
        // the squeeze areas bracket Z = 1 from below
        expect(s.table.logSureArea).toBeLessThan(0);
        expect(s.envelope.logSqueezeArea).toBeLessThan(0);
        expect(s.envelope.logSqueezeArea).toBeGreaterThanOrEqual(s.table.logSureArea);
      }
    }
  });

  it('tableSampler(normal(0, 1)) and (gamma(2.5)) with default strips: fewer than 2e-3 density evaluations per draw over 1,000,000 draws', () => {
    for (const t of [normalTarget(0, 1), gammaTarget(2.5, 1)]) {
      const s = tableSampler(t, { seed: 1 });
      s.fill(new Float64Array(1_000_000));
      const st = s.stats;
      const tb = s.table;
      const sure = Math.exp(tb.logSureArea - tb.logEnvelopeArea);
      console.log(
        `tableSampler: ${st.samples} draws, ${st.densityEvaluations} evaluations (${(st.densityEvaluations / st.samples).toExponential(2)} per draw), acceptance ${st.acceptanceRate.toFixed(5)}, sure-rectangle share of the envelope ${sure.toFixed(5)}, ${tb.strips} strips, ${tb.cells} cells, setup evaluations ${st.setupEvaluations}`,
      );
      // regression guard: 8.1e-5 (normal) and 7.7e-4 (gamma(2.5)) per draw were observed (printed
      // above; DEFAULT_TABLE_STRIPS remarks); 2e-3 is a margin above them
      expect(st.densityEvaluations / st.samples).toBeLessThan(2e-3);
      // the caps and tails are the only places that evaluate
      expect(st.densityEvaluations / st.proposals).toBeLessThanOrEqual(1 - sure + 6 * Math.sqrt(sure / st.proposals));
      // setup: the hull's, about 100 for the placement, one per strip boundary
      expect(st.setupEvaluations).toBeGreaterThan(tb.strips);
      expect(st.setupEvaluations).toBeLessThan(tb.strips + 200);
    }
  });
});

// tableSampler biased twin: a table whose caps are never accepted. Draws from the sure rectangles and tails
// only (upper lines forced to −∞) are rejected; the intact table at the same n and seed fits (shared method
// suite; the kernel is called directly, so the stream checks are those of tableSampler elsewhere).
// With 10 strips about half of the envelope's area is in the caps, so dropping them draws from the lower
// step function instead of the normal.
const tableKernel = (broken: boolean, seed: number): Sampler => {
  const setup = setupHull('twin', normalTarget(0, 1), { seed }, ['seed']);
  const counters = new Counters();
  const table = buildStripTable({ api: 'twin', hull: setup.hull, logDensity: setup.target.logDensity, counters, strips: 10, tailMass: 1e-6 });
  if (broken) {
    // no upper lines (every cap candidate is rejected above them) and no chord squeeze
    table.leftLineSlope.fill(-Infinity);
    table.rightLineSlope.fill(-Infinity);
    table.chordSlope.fill(NaN);
  }
  const cells = buildAliasCells(table);
  const st = { table, cells, logDensity: setup.target.logDensity, accepted: false };
  const block = UniformBlock.fromOwnedMersenneTwister(mersenneTwister(seed));
  return generatorSampler((out) => {
    tableFill(st, out, out.length, counters, block, 1_000_000);
  });
};

methodSuites('tableSampler biased twin: a table whose caps are never accepted', [
  {
    name: 'table kernel, intact 10-strip table of normal(0, 1); twin: caps dropped',
    make: (seed) => tableKernel(false, seed),
    biased: (seed) => tableKernel(true, seed),
    cdf: (x) => normalCdf(x, 0, 1),
    n: 20_000,
    seed: 5,
    stream: false,
  },
]);
