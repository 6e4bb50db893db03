/** Powers of two in a table, shared by the vendored exp and expm1. @internal @packageDocumentation */

/**
 * 2^k for k in [−1022, 1023] at index k + 1022: every normal power of two,
 * each exact (repeated products of 2 and of 1/2). @internal
 */
export const POW2 = /* @__PURE__ */ powersOfTwo();

function powersOfTwo(): Float64Array {
  const t = new Float64Array(2046);
  let v = 1;
  for (let k = 0; k <= 1023; k++, v *= 2) t[k + 1022] = v;
  v = 0.5;
  for (let k = -1; k >= -1022; k--, v *= 0.5) t[k + 1022] = v;
  return t;
}
