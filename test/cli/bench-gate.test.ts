/**
 * The bench regression gate's sensitivity and stability (issue 16 item 1). Opt-in, because both
 * depend on the machine being quiet: `npm run test:gate` (sets EXACTDRAW_GATE_STABILITY=1 and runs
 * this file alone, `vitest.gate.config.ts`; the default vitest config excludes it).
 *
 * - Sensitivity: a 1.5x slowdown of one sampler must fail the gate on that row's time ratio.
 * - Stability: 20 gated runs of unchanged code against one baseline must all pass.
 * Measured with the gate on ratios to the raw uniform row, each case in 6 processes
 * (src/cli/bench.ts REPLICAS) and the noise taken from the per-round ratios (src/cli/gate.ts):
 * 2026-12-04 on a quiet machine (nothing else running, load average below 1.8), run alone, twice
 * (the second on the session's final build): sensitivity passed, stability 20/20 passed, both
 * times; but every one of the 20 runs reported a row as
 * "TOO NOISY": 3 standard errors of this run and the baseline were 25-42 % on this 2-core virtual
 * machine, above the 20 % tolerance, so the gate flags only changes beyond the noise there (and says
 * so), and a slowdown well below 1.5x can pass unflagged. Earlier (2026-12-03, before the replicas):
 * sensitivity 3 of 6 runs, stability 19/20 and 12/20 on a quiet machine.
 * No time is asserted: only the gate's verdicts.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { run, suiteModule, tempDir } from './run.js';

/** The suite module (two samplers; EXACTDRAW_TEST_SLOWDOWN = 1.5 makes 'steady b' do 1.5x its work), its arguments and a baseline. */
function setupGate(): { args: string[]; base: string } {
  const dir = tempDir();
  // two samplers; EXACTDRAW_TEST_SLOWDOWN = 1.5 makes 'steady b' do 1.5x its work (a second fill of half the draws)
  const mod = suiteModule(
    dir,
    'gate.mjs',
    `const n = ed.normalTarget(0, 1);
const slow = Number(process.env.EXACTDRAW_TEST_SLOWDOWN ?? '1');
function slowed(s) {
  let scratch = new Float64Array(0);
  return {
  sample: () => s.sample(),
  fill(out) {
    s.fill(out);
    if (slow > 1) {
      const extra = Math.round(out.length * (slow - 1));
      if (scratch.length !== extra) scratch = new Float64Array(extra);
      s.fill(scratch);
    }
    return out;
  },
  get stats() { return s.stats; },
  };
}
export const samplers = [
  { name: 'steady a', create: (u) => ed.rejectionSampler(n, { proposal: ed.cauchyProposal(0, 1), uniform: u }) },
  { name: 'steady b', create: (u) => slowed(ed.tableSampler(n, { uniform: u })) },
];`,
  );
  const args = [mod, '--only', 'steady a', '--only', 'steady b', '--draws', '100000', '--rounds', '15', '--skip-self-check'];
  const base = join(dir, 'base.json');
  const made = run(['bench', ...args, '--out', base]);
  expect(made.code, made.stderr).toBe(0);
  return { args, base };
}

describe.runIf(process.env.EXACTDRAW_GATE_STABILITY === '1')('exactdraw bench gate: sensitivity (opt-in: needs a quiet machine)', () => {
  it('a 1.5x slowdown of one sampler fails the gate on that row (exit 1)', () => {
    const { args, base } = setupGate();
    const slowed = run(['bench', ...args.slice(0, 5), '--baseline', base, '--skip-self-check'], { env: { EXACTDRAW_TEST_SLOWDOWN: '1.5' } });
    expect(slowed.code, slowed.stderr).toBe(1);
    expect(slowed.stderr).toMatch(/REGRESSION steady b: time ratio to 'mt19937 uniform \(raw\)'/);
    // twin: the same baseline and code without the slowdown is not flagged on the slowed row
    const same = run(['bench', ...args.slice(0, 5), '--baseline', base, '--skip-self-check']);
    expect(same.stderr).not.toContain('REGRESSION steady b');
  }, 600_000);
});

describe.runIf(process.env.EXACTDRAW_GATE_STABILITY === '1')('exactdraw bench gate: stability (opt-in: needs a quiet machine)', () => {
  it('20 repeated gated runs of unchanged code pass at the default tolerance', () => {
    const { args, base } = setupGate();
    const verdicts: string[] = [];
    let noisy = 0;
    const rounds = 20;
    for (let k = 0; k < rounds; k++) {
      const r = run(['bench', ...args.slice(0, 1), '--baseline', base, ...args.slice(1, 5), '--skip-self-check', '--json']);
      verdicts.push(r.code === 0 ? 'pass' : `exit ${r.code}: ${r.stderr.trim()}`);
      if (r.stderr.includes('TOO NOISY')) noisy++;
    }
    const passes = verdicts.filter((v) => v === 'pass').length;
    if (rounds > 0) console.log(`bench gate stability: ${passes}/${rounds} unchanged runs passed (default tolerance 0.2); ${noisy} of them warned that a row was too noisy`);
    expect(verdicts, verdicts.join('\n')).toEqual(new Array(rounds).fill('pass'));
  }, 900_000);
});
