#!/usr/bin/env node
// The raw MT19937 uniform in a loop of its own, alone in a fresh process, with
// none of the harness's machinery: the reference of the self-check
// (bench/lib/self-check.mjs). Prints { ns } (median ns per uniform of `rounds`
// fills after two warm-up fills), like a harness child.
//   node bench/lib/raw-alone.mjs [size] [rounds]
import { mersenneTwister } from '../../dist/index.js';

const size = Number(process.argv[2] ?? 1e6);
const rounds = Number(process.argv[3] ?? 5);
const next = mersenneTwister(101);
const out = new Float64Array(size);
// the output array is a parameter, as in the harness's cases (`fill(out)`) and in a user's fill
// function: a loop over an array the closure captures as a constant let V8 fold its length and bounds
// checks, and ran about 9 % faster here (7.8 vs 8.5 ns per uniform, 2026-12-04), which made the
// self-check fail on a difference of loop forms rather than of harnesses
const fill = (o) => {
  for (let i = 0; i < o.length; i++) o[i] = next();
};
fill(out);
fill(out);
const t = [];
for (let r = 0; r < rounds; r++) {
  const a = performance.now();
  fill(out);
  const b = performance.now();
  let sum = 0;
  for (let i = 0; i < out.length; i += 97) sum += out[i];
  if (!Number.isFinite(sum)) throw new Error('raw uniform: non-finite draw');
  t.push(((b - a) * 1e6) / size);
}
t.sort((x, y) => x - y);
process.stdout.write(JSON.stringify({ ns: t.length % 2 ? t[t.length >> 1] : 0.5 * (t[t.length / 2 - 1] + t[t.length / 2]) }));
