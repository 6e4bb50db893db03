/**
 * Composite Simpson quadrature for the target and proposal tests (common
 * practice; error O(h⁴) for smooth integrands).
 */

/** ∫_a^b f(x) dx by composite Simpson with `n` (rounded up to even) intervals. */
export function simpson(f: (x: number) => number, a: number, b: number, n = 2000): number {
  const m = n % 2 === 0 ? n : n + 1;
  const h = (b - a) / m;
  let s = f(a) + f(b);
  for (let i = 1; i < m; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

/**
 * ∫ over the whole line of exp(logDensity(x)), for heavy tails, via the
 * substitution x = location + scale·tan θ, θ in (−π/2, π/2):
 * ∫ f(x) dx = ∫ f(location + scale tan θ) · scale / cos²θ dθ.
 * The open ends are approached to within `eps`.
 */
export function integrateLineByTan(
  logDensity: (x: number) => number,
  location: number,
  scale: number,
  upperTheta = Math.PI / 2,
  n = 4000,
  eps = 1e-9,
): number {
  const g = (t: number): number => {
    const c = Math.cos(t);
    return Math.exp(logDensity(location + scale * Math.tan(t))) * (scale / (c * c));
  };
  return simpson(g, -Math.PI / 2 + eps, Math.min(upperTheta, Math.PI / 2 - eps), n);
}

/** ∫_a^b exp(logDensity(x)) dx by composite Simpson. */
export function integrateDensity(logDensity: (x: number) => number, a: number, b: number, n = 2000): number {
  return simpson((x) => Math.exp(logDensity(x)), a, b, n);
}

/**
 * Composite midpoint rule: ∫_a^b f(x) dx with `n` intervals, never
 * evaluating f at a or b (for integrands whose end values are only limits).
 */
export function midpoint(f: (x: number) => number, a: number, b: number, n = 20000): number {
  const h = (b - a) / n;
  let s = 0;
  for (let i = 0; i < n; i++) s += f(a + (i + 0.5) * h);
  return s * h;
}

/**
 * Central finite difference of `f` at `x` with step about `h`, divided by the
 * distance between the two representable points actually used.
 */
export function centralDifference(f: (x: number) => number, x: number, h: number): number {
  const xp = x + h;
  const xm = x - h;
  return (f(xp) - f(xm)) / (xp - xm);
}
