#!/usr/bin/env node
/**
 * The `exactdraw` command: `demo`, `bench [module]`, `check [module]`.
 *
 * Exit codes: 0 success; 1 a check failed or a benchmark regressed;
 * 2 usage error or a module that cannot be loaded.
 *
 * @packageDocumentation
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { builtinSuite } from './builtin.js';
import type { BuiltinEntry } from './builtin.js';
import { compareBaseline, formatBench, readBaseline, runBench } from './bench.js';
import { formatCheck, runCheck } from './check.js';
import { runDemo } from './demo.js';
import { loadSuite } from '../node/suite.js';

const USAGE = `usage:
  exactdraw demo                       run the bike-share fleet demo (invented data)
  exactdraw bench [module] [options]   time the built-in suite or a module's samplers
      --draws N (1000000)  --rounds R (7)  --seed S (1)  --only NAME-SUBSTRING
      --json               print the JSON report (schema exactdraw-bench/1) instead of the table
      --out FILE           also write the JSON report to FILE
      --baseline FILE      compare with a saved report; exit 1 on a regression
      --tolerance T (0.2)  relative slack of the regression gate on time ratios
      --count-tolerance C  relative slack on evaluations per draw (default: T)
  exactdraw check [module] [options]   KS and Anderson-Darling for every sampler with a cdf
      --n N (20000)  --seed S (20261201)  --alpha A (0.001, overall)  --only NAME  --json

A module exports 'samplers': [{ name, create(uniform, own) => Sampler, cdf?, reference? }];
own = { seed, stream } names the same substream as uniform (pass it as sampler options to own it).`;

class UsageError extends Error {}

interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
}

function parse(argv: string[]): Parsed {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  const booleans = new Set(['json', 'help']);
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a.startsWith('--')) {
      const name = a.slice(2);
      if (booleans.has(name)) flags.set(name, true);
      else {
        const v = argv[i + 1];
        if (v === undefined || v.startsWith('--')) throw new UsageError(`option --${name} needs a value`);
        flags.set(name, v);
        i++;
      }
    } else positional.push(a);
  }
  return { positional, flags };
}

function num(p: Parsed, name: string, dflt: number, check: (v: number) => boolean): number {
  const v = p.flags.get(name);
  if (v === undefined) return dflt;
  const x = Number(v);
  if (v === true || !Number.isFinite(x) || !check(x)) throw new UsageError(`--${name} has an invalid value: ${String(v)}`);
  return x;
}

function str(p: Parsed, name: string): string | undefined {
  const v = p.flags.get(name);
  return typeof v === 'string' ? v : undefined;
}

function known(p: Parsed, names: string[]): void {
  for (const k of p.flags.keys()) if (!names.includes(k)) throw new UsageError(`unknown option --${k}`);
}

/** Runs the command with arguments `argv` (without node and script); returns the exit code. */
export async function main(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s + '\n'), err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  try {
    const p = parse(argv);
    const [command, moduleSpec, extra] = p.positional;
    if (command === undefined || p.flags.has('help') || command === 'help') {
      out(USAGE);
      return command === undefined && !p.flags.has('help') ? 2 : 0;
    }
    if (extra !== undefined) throw new UsageError(`unexpected argument: ${extra}`);
    if (command === 'demo') {
      known(p, ['out']);
      runDemo(out, str(p, 'out') ?? 'out');
      return 0;
    }
    if (command === 'bench') {
      known(p, ['draws', 'rounds', 'seed', 'only', 'json', 'out', 'baseline', 'tolerance', 'count-tolerance']);
      const builtin = builtinSuite();
      let entries: BuiltinEntry[] = builtin;
      if (moduleSpec !== undefined) entries = [...builtin.filter((e) => e.peer), ...(await loadSuite(moduleSpec))];
      const draws = num(p, 'draws', 1_000_000, (v) => Number.isInteger(v) && v >= 1);
      const rounds = num(p, 'rounds', 7, (v) => Number.isInteger(v) && v >= 1 && v <= 1000);
      const seed = num(p, 'seed', 1, (v) => Number.isInteger(v) && v >= 0);
      const tolerance = num(p, 'tolerance', 0.2, (v) => v >= 0);
      const countTolerance = num(p, 'count-tolerance', tolerance, (v) => v >= 0);
      const isTty = process.stderr.isTTY === true;
      let lastProgress = 0;
      const report = runBench(entries, {
        draws,
        rounds,
        seed,
        only: str(p, 'only'),
        progress: (line) => {
          const now = Date.now();
          if (now - lastProgress < 1000) return;
          lastProgress = now;
          if (isTty) process.stderr.write(`\r${line.padEnd(78)}`);
          else err(line);
        },
      });
      if (isTty) process.stderr.write(`\r${''.padEnd(78)}\r`);
      const file = str(p, 'out');
      if (file !== undefined) {
        mkdirSync(dirname(file), { recursive: true });
        writeFileSync(file, JSON.stringify(report, null, 2) + '\n');
      }
      out(p.flags.has('json') ? JSON.stringify(report, null, 2) : formatBench(report));
      const baseline = str(p, 'baseline');
      if (baseline !== undefined) {
        const regressions = compareBaseline(report, readBaseline(baseline), tolerance, countTolerance);
        for (const r of regressions) err(`REGRESSION ${r.name}: ${r.metric} ${r.current.toPrecision(4)} vs baseline ${r.baseline.toPrecision(4)} (tolerance ${tolerance})`);
        if (regressions.length > 0) return 1;
        err(`no regression against ${baseline} (tolerance ${tolerance})`);
      }
      return 0;
    }
    if (command === 'check') {
      known(p, ['n', 'seed', 'alpha', 'only', 'json']);
      const entries = moduleSpec === undefined ? builtinSuite() : await loadSuite(moduleSpec);
      const report = runCheck(entries, {
        n: num(p, 'n', 20_000, (v) => Number.isInteger(v) && v >= 10),
        seed: num(p, 'seed', 20261201, (v) => Number.isInteger(v) && v >= 0),
        alpha: num(p, 'alpha', 1e-3, (v) => v > 0 && v < 1),
        only: str(p, 'only'),
      });
      out(p.flags.has('json') ? JSON.stringify(report, null, 2) : formatCheck(report, moduleSpec ?? ''));
      return report.passed ? 0 : 1;
    }
    throw new UsageError(`unknown command: ${command}`);
  } catch (e) {
    if (e instanceof UsageError) {
      err(`exactdraw: ${e.message}\n${USAGE}`);
      return 2;
    }
    err(`exactdraw: ${(e as Error).message ?? String(e)}`);
    return 2;
  }
}

const invoked = process.argv[1] !== undefined && /exactdraw$|main\.[cm]?[jt]s$/.test(process.argv[1]);
if (invoked) {
  main(process.argv.slice(2)).then((code) => {
    process.exitCode = code;
  });
}
