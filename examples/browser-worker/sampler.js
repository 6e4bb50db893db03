// EXAMPLE (invented scenario): the sampler every part uses, in one module that the page and the
// workers share. Ride duration in minutes of a bike-share fleet (invented): gamma(2.2, rate 0.11).
import { gammaTarget, tableSampler } from '../../dist/index.js';

const rideMinutes = gammaTarget(2.2, 0.11);

/** The sampler of one part: it owns substream `stream` of `seed` (the substream scheme of partitionedFill). */
export function createSampler(own) {
  return tableSampler(rideMinutes, { ...own });
}
