import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import {
  InvalidTargetError,
  cauchyProposal,
  exponentialProposal,
  mersenneTwister,
  normalProposal,
  uniformProposal,
} from '../../src/index.js';
import type { Proposal, Sampler, Uniform } from '../../src/index.js';
import { generatorSampler, methodSuites } from '../helpers/method-suite.js';
import { integrateLineByTan, midpoint, simpson } from '../targets/quadrature.js';

const N = 20_000;

function drawFrom(p: Proposal, u: Uniform, n = N): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = p.sample(u);
  return out;
}

interface Case {
  name: string;
  make: () => Proposal;
  /** Slightly wrong parameters: the biased twin. */
  makeBiased: () => Proposal;
  /** Reference cdf written in the test (closed form or @stdlib). */
  cdf: (x: number) => number;
  /** ∫ exp(logDensity) over the support by quadrature. */
  mass: (p: Proposal) => number;
}

const CASES: Case[] = [
  {
    name: 'uniformProposal(-3, 5)',
    make: () => uniformProposal(-3, 5),
    makeBiased: () => uniformProposal(-3, 4.85),
    cdf: (x) => Math.min(1, Math.max(0, (x + 3) / 8)), // closed form
    mass: (p) => simpson((x) => Math.exp(p.logDensity(x)), -3, 5),
  },
  {
    name: 'normalProposal(10, 2.5)',
    make: () => normalProposal(10, 2.5),
    makeBiased: () => normalProposal(10.25, 2.5),
    cdf: (x) => normalCdf(x, 10, 2.5), // @stdlib/stats-base-dists-normal-cdf
    mass: (p) => simpson((x) => Math.exp(p.logDensity(x)), 10 - 30, 10 + 30, 4000),
  },
  {
    name: 'normalProposal(-1e6, 1e-3)',
    make: () => normalProposal(-1e6, 1e-3),
    makeBiased: () => normalProposal(-1e6, 1.05e-3),
    cdf: (x) => normalCdf(x, -1e6, 1e-3),
    mass: (p) => simpson((x) => Math.exp(p.logDensity(x)), -1e6 - 0.012, -1e6 + 0.012, 4000),
  },
  {
    name: 'exponentialProposal(2, 1)',
    make: () => exponentialProposal(2, 1),
    makeBiased: () => exponentialProposal(2.1, 1),
    cdf: (x) => (x <= 1 ? 0 : -Math.expm1(-2 * (x - 1))), // closed form 1 − e^(−rate(x − origin))
    mass: (p) => simpson((x) => Math.exp(p.logDensity(x)), 1, 1 + 25, 4000),
  },
  {
    name: 'exponentialProposal(0.5) (default origin 0)',
    make: () => exponentialProposal(0.5),
    makeBiased: () => exponentialProposal(0.5, 0.03),
    cdf: (x) => (x <= 0 ? 0 : -Math.expm1(-0.5 * x)),
    mass: (p) => simpson((x) => Math.exp(p.logDensity(x)), 0, 100, 4000),
  },
  {
    name: 'cauchyProposal(3, 0.5)',
    make: () => cauchyProposal(3, 0.5),
    makeBiased: () => cauchyProposal(3, 0.53),
    cdf: (x) => 0.5 + Math.atan((x - 3) / 0.5) / Math.PI, // closed form
    mass: (p) => integrateLineByTan((x) => p.logDensity(x), 3, 0.5),
  },
];

/** A proposal drawing on its own MT19937 stream, as a sampler for the shared method suite. */
function proposalSampler(p: Proposal, seed: number): Sampler {
  const u = mersenneTwister(seed);
  return generatorSampler((out) => {
    for (let i = 0; i < out.length; i++) out[i] = p.sample(u);
  });
}

// Draws fit the reference cdf (KS + AD at ALPHA, n = N, stream seed 4100 + k); the twin with slightly wrong
// parameters is rejected at the same n and seed (shared method suite; the stream checks are below).
methodSuites(
  'proposals: goodness of fit with biased twins',
  CASES.map((c, k) => ({
    name: c.name,
    make: (seed: number) => proposalSampler(c.make(), seed),
    biased: (seed: number) => proposalSampler(c.makeBiased(), seed),
    cdf: c.cdf,
    n: N,
    seed: 4100 + k,
    support: [c.make().support[0], c.make().support[1]] as [number, number],
    stream: false,
  })),
);

describe('proposals', () => {
  CASES.forEach((c, k) => {
    it(`${c.name}: logDensity integrates to 1 and is −Infinity outside the support`, () => {
      const p = c.make();
      expect(Math.abs(c.mass(p) - 1)).toBeLessThan(1e-8);
      const [lo, hi] = p.support;
      if (Number.isFinite(lo)) expect(p.logDensity(lo - 1e-9 * Math.max(1, Math.abs(lo)))).toBe(-Infinity);
      if (Number.isFinite(hi)) expect(p.logDensity(hi + 1e-9 * Math.max(1, Math.abs(hi)))).toBe(-Infinity);
    });

    it(`${c.name}: same uniform stream, same draws; one uniform per draw`, () => {
      const a = drawFrom(c.make(), mersenneTwister(77), 500);
      const b = drawFrom(c.make(), mersenneTwister(77), 500);
      expect(Array.from(b)).toEqual(Array.from(a));
      let calls = 0;
      const base = mersenneTwister(78);
      const counting: Uniform = () => {
        calls++;
        return base();
      };
      drawFrom(c.make(), counting, 100);
      expect(calls).toBe(100);
    });
  });

  it('proposals map the extreme uniforms 0 and 1 − 2^-53 to finite draws inside the support', () => {
    const ends = [0, 1 - Math.pow(2, -53)];
    for (const c of CASES) {
      const p = c.make();
      for (const v of ends) {
        const x = p.sample(() => v);
        expect(Number.isFinite(x), `${c.name} u = ${v}`).toBe(true);
        expect(x >= p.support[0] && x <= p.support[1], `${c.name} u = ${v}: ${x}`).toBe(true);
        expect(p.logDensity(x) > -Infinity, `${c.name} u = ${v}`).toBe(true);
      }
    }
    expect(exponentialProposal(3, 2).sample(() => 0)).toBe(2);
  });

  it('normalProposal logDensity matches the closed form and cauchyProposal stays finite for huge |x|', () => {
    const p = normalProposal(1, 2);
    expect(p.logDensity(4)).toBeCloseTo(-0.5 * 1.5 * 1.5 - Math.log(2) - 0.5 * Math.log(2 * Math.PI), 14);
    const c = cauchyProposal(0, 1);
    expect(c.logDensity(1e200)).toBeCloseTo(-Math.log(Math.PI) - 400 * Math.log(10), 9);
    expect(c.logDensity(-1e300)).toBeCloseTo(-Math.log(Math.PI) - 600 * Math.log(10), 9);
    expect(c.logDensity(Infinity)).toBe(-Infinity);
    // exponential logDensity by midpoint check of the constant: ∫_0^1 = 1 − e^(−rate)
    const e = exponentialProposal(4);
    expect(midpoint((x) => Math.exp(e.logDensity(x)), 0, 1)).toBeCloseTo(-Math.expm1(-4), 8);
  });

  it('proposal factories reject bad parameters with InvalidTargetError naming API, parameter and value', () => {
    const bad: [() => unknown, RegExp][] = [
      [() => uniformProposal(1, 1), /uniformProposal: b must be > a, got a = 1, b = 1/],
      [() => uniformProposal(2, 1), /uniformProposal: b must be > a/],
      [() => uniformProposal(NaN, 1), /uniformProposal: a .* got NaN/],
      [() => uniformProposal(0, Infinity), /uniformProposal: b .* got Infinity/],
      [() => uniformProposal(-1e308, 1e308), /uniformProposal: the width b - a must be finite/],
      [() => normalProposal(0, 0), /normalProposal: sd .* got 0/],
      [() => normalProposal(Infinity, 1), /normalProposal: mean .* got Infinity/],
      [() => normalProposal(0, -2), /normalProposal: sd .* got -2/],
      [() => exponentialProposal(0), /exponentialProposal: rate .* got 0/],
      [() => exponentialProposal(-1), /exponentialProposal: rate .* got -1/],
      [() => exponentialProposal(1, NaN), /exponentialProposal: origin .* got NaN/],
      [() => cauchyProposal(0, 0), /cauchyProposal: scale .* got 0/],
      [() => cauchyProposal(NaN, 1), /cauchyProposal: location .* got NaN/],
      [() => cauchyProposal(0, '1' as unknown as number), /cauchyProposal: scale/],
    ];
    for (const [f, re] of bad) {
      expect(f).toThrow(InvalidTargetError);
      expect(f).toThrow(re);
    }
  });
});
