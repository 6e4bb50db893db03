// Regenerates the reference values of the invented worked example
//   f(x) = exp(−x²/2)·(sin²(6x) + 3·cos²(x)·sin²(4x) + 1)
// used in test/helpers/fixtures.ts, independently of exactdraw (plain
// composite Simpson rule and a dense grid search; no library code).
// Run: node test/reference/multimodal-quadrature.mjs
const f = (x) => Math.exp(-0.5 * x * x) * (Math.sin(6 * x) ** 2 + 3 * Math.cos(x) ** 2 * Math.sin(4 * x) ** 2 + 1);
function simpson(g, a, b, n) {
  const h = (b - a) / n;
  let s = g(a) + g(b);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * g(a + i * h);
  return (s * h) / 3;
}
// the integrand is below e^(−200) beyond |x| = 20, so [−20, 20] is the whole line in double precision
const zLine = simpson(f, -20, 20, 4_000_000);
const z3 = simpson(f, -3, 3, 4_000_000);
let supF = 0;
let argF = 0;
let supPhi = 0;
for (let i = 0; i <= 12_000_000; i++) {
  const x = -6 + i * 1e-6;
  const v = f(x);
  if (v > supF) { supF = v; argF = x; }
  const r = v / (Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI));
  if (r > supPhi) supPhi = r;
}
const out = {
  zLine: zLine.toPrecision(7),
  zOn3: z3.toPrecision(7),
  supF: supF.toPrecision(7),
  argmaxF: argF.toPrecision(6),
  supOverUniform: (supF * 6).toPrecision(6),
  supOverNormal: supPhi.toPrecision(6),
  acceptUniform: (z3 / (supF * 6)).toPrecision(5),
  acceptNormal: (zLine / supPhi).toPrecision(5),
};
console.log(JSON.stringify(out, null, 2));
