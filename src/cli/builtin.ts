/**
 * The built-in benchmark / check suite: exactdraw samplers for common targets
 * next to @stdlib peers, all drawing from the same kind of MT19937 source.
 *
 * @packageDocumentation
 */
import { gammaFactory, zigguratFactory } from '../vendor/peers.js';
import * as ed from '../index.js';
import type { Sampler, SamplerStats, Uniform } from '../core/types.js';
import type { SuiteEntry } from '../node/suite.js';
import { quadratureCdf } from './demo.js';

/** A suite entry that is a peer generator, not an exactdraw sampler. */
export interface BuiltinEntry extends SuiteEntry {
  /** True for peers (their acceptance and evaluation counts are not reported). */
  peer?: boolean;
  /** `exactdraw bench` times `draws / drawsDivisor` draws per round for this entry (each draw of the Gibbs cases is a fresh setup). */
  drawsDivisor?: number;
}

/**
 * A Gibbs step as a sampler: each draw builds a fresh `adaptiveRejectionSampler`
 * on a gamma(a, b) conditional whose (a, b) change every step (the workload of
 * bench/gibbs.mjs) and draws once. Counts add setup and sampling evaluations.
 */
function gibbsSampler(uniform: Uniform, tangents: boolean): Sampler {
  let a = 2.5;
  let b = 1.3;
  const logDensity = (t: number): number => (t > 0 ? (a - 1) * Math.log(t) - b * t : -Infinity);
  const conditional: ed.Target = tangents
    ? { support: [0, Infinity], logDensity, dLogDensity: (t: number) => (a - 1) / t - b }
    : { support: [0, Infinity], logDensity };
  let samples = 0;
  let proposals = 0;
  let evaluations = 0;
  let setup = 0;
  const step = (): number => {
    a = 1.5 + (samples % 11) * 0.4;
    b = 0.5 + (samples % 7) * 0.25;
    const s = ed.adaptiveRejectionSampler(conditional, { uniform });
    const x = s.sample();
    const st = s.stats;
    samples++;
    proposals += st.proposals;
    evaluations += st.densityEvaluations + st.setupEvaluations;
    setup += st.setupEvaluations;
    return x;
  };
  return {
    sample: step,
    fill(out: Float64Array): Float64Array {
      for (let i = 0; i < out.length; i++) out[i] = step();
      return out;
    },
    get stats(): SamplerStats {
      return { samples, proposals, densityEvaluations: evaluations, setupEvaluations: setup, acceptanceRate: proposals > 0 ? samples / proposals : 0 };
    },
  };
}

/** Wraps a plain generator function as a Sampler (peers have no rejection counts). */
function peerSampler(next: () => number): Sampler {
  let samples = 0;
  return {
    sample: () => { samples++; return next(); },
    fill(out: Float64Array): Float64Array {
      for (let i = 0; i < out.length; i++) out[i] = next();
      samples += out.length;
      return out;
    },
    get stats(): SamplerStats {
      return { samples, proposals: samples, densityEvaluations: 0, setupEvaluations: 0, acceptanceRate: 1 };
    },
  };
}

/** Names of the built-in peers. */
export const PEERS = {
  uniform: 'mt19937 uniform (raw)',
  normal: '@stdlib improved-ziggurat normal',
  gamma: '@stdlib gamma(2.5)',
} as const;

/** Worked example: a multimodal unnormalized log-density used across the suite. */
export function multimodalLogDensity(x: number): number {
  const s6 = Math.sin(6 * x);
  const c1 = Math.cos(x);
  const s4 = Math.sin(4 * x);
  return -0.5 * x * x + Math.log(s6 * s6 + 3 * c1 * c1 * s4 * s4 + 1);
}

let cachedCdf: { cdf: (x: number) => number } | undefined;
/** cdf of the multimodal example by Simpson quadrature on [-12, 12] (mass outside is below 1e-31). */
function multimodalCdf(): { cdf: (x: number) => number } {
  cachedCdf ??= quadratureCdf(multimodalLogDensity, -12, 12, 48_000);
  return cachedCdf;
}

/** The built-in suite. Entries for methods not in this build are left out. */
export function builtinSuite(): BuiltinEntry[] {
  const normal = ed.normalTarget(0, 1);
  const gamma = ed.gammaTarget(2.5, 1);
  const list: BuiltinEntry[] = [
    { name: PEERS.uniform, peer: true, create: (u: Uniform) => peerSampler(u), cdf: (x) => (x <= 0 ? 0 : x >= 1 ? 1 : x) },
    {
      name: PEERS.normal,
      peer: true,
      create: (u: Uniform) => peerSampler(zigguratFactory({ prng: u })),
      cdf: (x) => normal.cdf!(x),
    },
    {
      name: PEERS.gamma,
      peer: true,
      create: (u: Uniform) => peerSampler(gammaFactory(2.5, 1, { prng: u })),
      cdf: (x) => gamma.cdf!(x),
    },
    {
      name: 'rejection normal / cauchy proposal',
      reference: PEERS.normal,
      create: (uniform) => ed.rejectionSampler(normal, { proposal: ed.cauchyProposal(0, 1), uniform }),
      cdf: (x) => normal.cdf!(x),
    },
    {
      name: 'rejection multimodal / U(-3,3), C = 25',
      reference: PEERS.uniform,
      create: (uniform) =>
        ed.rejectionSampler(
          { logDensity: (x: number) => (x >= -3 && x <= 3 ? multimodalLogDensity(x) : -Infinity), support: [-3, 3] },
          { proposal: ed.uniformProposal(-3, 3), logBound: Math.log(25), uniform },
        ),
    },
    {
      name: 'rejection multimodal / N(0,1), C = 11',
      reference: PEERS.uniform,
      create: (uniform) =>
        ed.rejectionSampler({ logDensity: multimodalLogDensity }, { proposal: ed.normalProposal(0, 1), logBound: Math.log(11), uniform }),
    },
  ];
  const t5 = ed.studentTTarget(5);
  const t3 = ed.studentTTarget(3);
  list.push(
    { name: 'adaptive hull normal', reference: PEERS.normal, create: (uniform) => ed.adaptiveRejectionSampler(normal, { uniform }), cdf: (x) => normal.cdf!(x) },
    { name: 'adaptive hull gamma(2.5)', reference: PEERS.gamma, create: (uniform) => ed.adaptiveRejectionSampler(gamma, { uniform }), cdf: (x) => gamma.cdf!(x) },
    {
      name: 'adaptive hull student-t(3), inverse-sqrt',
      reference: PEERS.uniform,
      create: (uniform) => ed.adaptiveRejectionSampler(t3, { uniform, transform: 'inverse-sqrt' }),
      cdf: (x) => t3.cdf!(x),
    },
    // the table-driven fast path (tableSampler); the injected uniform is read one value at a time
    { name: 'fast hull normal', reference: PEERS.normal, create: (uniform) => ed.tableSampler(normal, { uniform }), cdf: (x) => normal.cdf!(x) },
    { name: 'fast hull gamma(2.5)', reference: PEERS.gamma, create: (uniform) => ed.tableSampler(gamma, { uniform }), cdf: (x) => gamma.cdf!(x) },
    // the same samplers owning the same substream (create's second argument): same draws, read in blocks
    { name: 'fast hull normal (own stream)', reference: PEERS.normal, create: (_u, own) => ed.tableSampler(normal, { ...own }), cdf: (x) => normal.cdf!(x) },
    { name: 'fast hull gamma(2.5) (own stream)', reference: PEERS.gamma, create: (_u, own) => ed.tableSampler(gamma, { ...own }), cdf: (x) => gamma.cdf!(x) },
    {
      name: 'fast hull student-t(3), inverse-sqrt',
      reference: PEERS.uniform,
      create: (uniform) => ed.tableSampler(t3, { uniform, transform: 'inverse-sqrt' }),
      cdf: (x) => t3.cdf!(x),
    },
    {
      name: 'exactSampler multimodal (line)',
      reference: PEERS.uniform,
      create: (uniform) => ed.exactSampler({ logDensity: multimodalLogDensity }, { uniform }),
      cdf: (x) => multimodalCdf().cdf(x),
    },
    {
      // many draws expected: exactSampler picks the piecewise envelope with the fast path (a strip table over it)
      name: 'exactSampler multimodal (line), fast path',
      reference: PEERS.uniform,
      create: (_u, own) => ed.exactSampler({ logDensity: multimodalLogDensity }, { ...own, expectedDraws: 1e6 }),
      cdf: (x) => multimodalCdf().cdf(x),
    },
    {
      name: 'exactSampler multimodal on [-3,3]',
      reference: PEERS.uniform,
      create: (uniform) =>
        ed.exactSampler({ logDensity: (x: number) => (x >= -3 && x <= 3 ? multimodalLogDensity(x) : -Infinity), support: [-3, 3] }, { uniform }),
    },
    { name: 'ratio-of-uniforms normal', reference: PEERS.normal, create: (uniform) => ed.ratioOfUniformsSampler(normal, { uniform }), cdf: (x) => normal.cdf!(x) },
    { name: 'ratio-of-uniforms student-t(5)', reference: PEERS.uniform, create: (uniform) => ed.ratioOfUniformsSampler(t5, { uniform }), cdf: (x) => t5.cdf!(x) },
    // Gibbs steps: a fresh hull on a changing gamma conditional per draw (evaluations/draw include the setup)
    { name: 'gibbs step: fresh hull, tangents', reference: PEERS.uniform, drawsDivisor: 100, create: (uniform) => gibbsSampler(uniform, true) },
    { name: 'gibbs step: fresh hull, secants', reference: PEERS.uniform, drawsDivisor: 100, create: (uniform) => gibbsSampler(uniform, false) },
  );
  return list;
}
