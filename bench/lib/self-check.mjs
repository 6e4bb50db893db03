// The benchmark harness's self-check (pure logic; no clock, no processes).
//
// Rule (DEVELOPERS.md, benchmark policy): the raw-uniform case timed by the
// harness must agree within 10 % with the same loop alone in a fresh process.
// If it does not, the harness adds (or removes) cost that a user's own loop
// does not have (a shared call site made megamorphic, other generators
// instantiated in the same process, a busy machine during one of the two), and
// its figures must not be quoted.

/** Default tolerance of the self-check: 10 %. */
export const SELF_CHECK_TOLERANCE = 0.1;

/** Median of a non-empty list of finite numbers (throws otherwise). */
export function median(values) {
  if (!Array.isArray(values) && !ArrayBuffer.isView(values)) throw new TypeError('median: values must be an array');
  const s = Array.from(values);
  if (s.length === 0) throw new RangeError('median: no values');
  for (const v of s) if (!Number.isFinite(v)) throw new RangeError(`median: non-finite value ${v}`);
  s.sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/**
 * Compares the harness's raw-uniform timings with those of the same loop alone
 * in a fresh process (ns per uniform). When both lists have the same length they
 * are taken as pairs measured back to back (round r of the harness, then the
 * fresh process started right after it), and the ratio is the median of the
 * per-pair ratios, which cancels the machine's drift between rounds; otherwise
 * it is the ratio of the medians. Agreement: |ratio − 1| <= tolerance.
 * Returns { ok, harnessNs, aloneNs, ratio, paired, tolerance, line }; `line` is
 * the sentence the benchmark prints.
 */
export function selfCheck(harnessNs, aloneNs, tolerance = SELF_CHECK_TOLERANCE) {
  if (!(tolerance > 0 && tolerance < 1)) throw new RangeError(`selfCheck: tolerance must be in (0, 1), got ${tolerance}`);
  const h = median(harnessNs);
  const a = median(aloneNs);
  const hs = Array.from(harnessNs);
  const as = Array.from(aloneNs);
  for (const v of [...hs, ...as]) if (!(v > 0)) throw new RangeError(`selfCheck: timings must be positive, got ${v}`);
  const paired = hs.length === as.length;
  const ratio = paired ? median(hs.map((v, i) => v / as[i])) : h / a;
  const ok = Math.abs(ratio - 1) <= tolerance + 1e-12; // inclusive; 1e-12 absorbs rounding in the ratio
  const pct = Math.round(tolerance * 100);
  const how = paired ? `median of ${hs.length} back-to-back pairs` : 'ratio of medians';
  const figures = `raw MT19937 uniform ${h.toFixed(2)} ns in the harness, ${a.toFixed(2)} ns alone in a fresh process (ratio ${ratio.toFixed(3)}, ${how})`;
  const line = ok
    ? `# self-check passed: ${figures}, within ${pct} %`
    : `# SELF-CHECK FAILED: ${figures}, not within ${pct} %: the harness does not time loops as a user's own loop runs, or the machine's speed changed between the two (load); do not quote these figures`;
  return { ok, harnessNs: h, aloneNs: a, ratio, paired, tolerance, line };
}
