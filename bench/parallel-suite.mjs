// Sampler-suite module used by bench/parallel.mjs (the worker threads import it).
// `create(uniform, own)`: the '(own stream)' entries pass own = { seed, stream }
// as options, so the sampler owns substream(seed, stream) and the fast path
// reads it in blocks; the others call the injected uniform once per value.
// Both give the same draws.
import { normalTarget, gammaTarget, tableSampler, adaptiveRejectionSampler } from '../dist/index.js';

export const samplers = [
  { name: 'fast normal (own stream)', create: (uniform, own) => tableSampler(normalTarget(0, 1), { ...own }) },
  { name: 'fast normal (uniform)', create: (uniform) => tableSampler(normalTarget(0, 1), { uniform }) },
  { name: 'fast gamma(2.5) (own stream)', create: (uniform, own) => tableSampler(gammaTarget(2.5, 1), { ...own }) },
  { name: 'hull normal (uniform)', create: (uniform) => adaptiveRejectionSampler(normalTarget(0, 1), { uniform }) },
];
