// EXAMPLE: one part of a parallel fill. The worker gets (seed, part, length) and fills its part
// with a sampler on substream(seed, part): the same scheme as partitionedFill, so the result does
// not depend on which worker runs first.
import { createSampler } from './sampler.js';

self.onmessage = (event) => {
  const { seed, part, length } = event.data;
  const out = createSampler({ seed, stream: part }).fill(new Float64Array(length));
  self.postMessage({ part, out }, [out.buffer]);
};
