#!/usr/bin/env node
/**
 * The `exactdraw` command: `demo`, `bench [module]`, `check [module]`.
 *
 * Exit codes: 0 success; 1 a check failed, nothing was checked, or a
 * benchmark regressed; 2 usage error, a module that cannot be loaded or a
 * baseline that cannot be used (all found before the run); 3 (only with
 * `--fail-on-noise`) the run's noise exceeds the tolerance of the gate.
 *
 * @packageDocumentation
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { builtinSuite } from './builtin.js';
import type { BuiltinEntry } from './builtin.js';
import { BaselineError, RAW_UNIFORM, formatBench, readBaseline, runBench, runBenchChild } from './bench.js';
import type { BenchCase, BenchReport } from './bench.js';
import { gate } from './gate.js';
import { formatCheck, runCheck } from './check.js';
import { runDemo } from './demo.js';
import { loadSuite, suiteModuleUrl } from '../node/suite.js';

type OptionSpec = { type: 'string' | 'boolean'; short?: string; multiple?: boolean };

const COMMON: Record<string, OptionSpec> = { help: { type: 'boolean', short: 'h' }, version: { type: 'boolean' } };

const SUITE_NOTE = `A module exports 'samplers': [{ name, create(uniform, own) => Sampler, cdf?, reference? }];
own = { seed, stream } names the same substream as uniform (pass it as sampler options to own it).
A module path is resolved against the current working directory (URLs are used as given).`;

const HELP: Record<string, string> = {
  demo: `usage: exactdraw demo [--out DIR]
  Runs the bike-share fleet demo (invented data) and writes figures to DIR (default: out).`,
  bench: `usage: exactdraw bench [module] [options]
  Times the built-in suite, or the module's samplers next to the built-in peers. Every case runs in a
  process of its own; rounds are interleaved; every row's time ratio to the gate reference is measured
  round by round in the same run.
  --draws N (1000000)     draws per round (--n is the same option)
  --rounds R (7)          timed rounds after warm-up
  --seed S (1)            case i draws from substream(S, i)
  --only NAME             run only the case with exactly this name (repeatable); the gate reference
                          and the rows' references are always run
  --json                  print the JSON report (schema exactdraw-bench/2) instead of the table
  --out FILE              also write the JSON report to FILE
  --baseline FILE         gate against a saved report: exit 1 on a regression (beyond the tolerance and
                          the run's noise) or a missing row; draws, rounds and seed default to the baseline's
  --tolerance T (0.2)     relative slack on the time ratios
  --count-tolerance C     relative slack on evaluations and uniforms per draw (default: T)
  --gate-reference NAME   row the time ratios are taken to (default: '${RAW_UNIFORM}')
  --gate-times            also gate raw ns per draw (off: raw times drift with the machine's load)
  --fail-on-noise         exit 3 when a row's noise exceeds the tolerance (default: a warning)
  --skip-self-check       do not time the raw uniform alone in a fresh process
  --quiet                 no progress line (it is shown on stderr only when stderr is a terminal)
${SUITE_NOTE}`,
  check: `usage: exactdraw check [module] [options]
  KS and Anderson-Darling tests of every sampler that has a cdf, at a stated overall false-positive rate.
  Samplers without a cdf are listed as not checked; a run that checks nothing fails (exit 1).
  --draws N (20000)       draws per sampler (--n is the same option)
  --seed S (20261201)     sampler i draws from substream(S, i)
  --alpha A (0.001)       overall false-positive rate (Bonferroni over 2 tests per checked sampler)
  --per-test-alpha P      per-test threshold instead of alpha / tests (the replay line passes it)
  --only NAME             check only the sampler with exactly this name (repeatable)
  --require-all           fail when a selected sampler has no cdf
  --json                  print the JSON report (schema exactdraw-check/2) instead of the text
  --out FILE              also write the JSON report to FILE
  --quiet                 accepted for symmetry with bench (check prints no progress line)
${SUITE_NOTE}`,
};

const USAGE = `usage: exactdraw <command> [options]    (exactdraw <command> --help for its options)
  exactdraw demo                       run the bike-share fleet demo (invented data)
  exactdraw bench [module] [options]   time the built-in suite or a module's samplers; regression gate
  exactdraw check [module] [options]   KS and Anderson-Darling for every sampler with a cdf
  exactdraw --version                  print the version`;

const OPTIONS: Record<string, Record<string, OptionSpec>> = {
  demo: { out: { type: 'string' } },
  bench: {
    draws: { type: 'string' },
    n: { type: 'string' },
    rounds: { type: 'string' },
    seed: { type: 'string' },
    only: { type: 'string', multiple: true },
    json: { type: 'boolean' },
    out: { type: 'string' },
    baseline: { type: 'string' },
    tolerance: { type: 'string' },
    'count-tolerance': { type: 'string' },
    'gate-reference': { type: 'string' },
    'gate-times': { type: 'boolean' },
    'skip-self-check': { type: 'boolean' },
    'fail-on-noise': { type: 'boolean' },
    quiet: { type: 'boolean' },
  },
  check: {
    draws: { type: 'string' },
    n: { type: 'string' },
    seed: { type: 'string' },
    alpha: { type: 'string' },
    'per-test-alpha': { type: 'string' },
    only: { type: 'string', multiple: true },
    'require-all': { type: 'boolean' },
    json: { type: 'boolean' },
    out: { type: 'string' },
    quiet: { type: 'boolean' },
  },
};

/** A usage error: exit 2 with the message and a pointer to --help. */
class UsageError extends Error {}

type Values = Record<string, string | boolean | string[] | undefined>;

function knownFlags(command: string | undefined): string {
  const spec = { ...(command === undefined ? {} : OPTIONS[command]), ...COMMON };
  return Object.entries(spec)
    .map(([k, v]) => `--${k}${v.short !== undefined ? `/-${v.short}` : ''}`)
    .join(', ');
}

function parse(command: string | undefined, args: string[]): { values: Values; positionals: string[] } {
  const options = { ...(command === undefined ? {} : OPTIONS[command]), ...COMMON };
  const where = command === undefined ? 'exactdraw' : `exactdraw ${command}`;
  try {
    const r = parseArgs({ args, options, strict: true, allowPositionals: true });
    return { values: r.values as Values, positionals: r.positionals };
  } catch (e) {
    const err = e as Error & { code?: string };
    if (err.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') {
      const flag = /'([^']+)'/.exec(err.message)?.[1] ?? err.message;
      throw new UsageError(`${where}: unknown option ${flag} (known: ${knownFlags(command)})`);
    }
    if (err.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') throw new UsageError(`${where}: ${err.message.replace(/\.$/, '')}`);
    throw new UsageError(`${where}: ${err.message}`);
  }
}

function str(v: Values, name: string): string | undefined {
  const x = v[name];
  return typeof x === 'string' ? x : undefined;
}

function num(where: string, v: Values, name: string, dflt: number, ok: (x: number) => boolean, what: string): number {
  const s = str(v, name);
  if (s === undefined) return dflt;
  const x = Number(s);
  if (s.trim() === '' || !Number.isFinite(x) || !ok(x)) throw new UsageError(`${where}: --${name} must be ${what}, got '${s}'`);
  return x;
}

/** --draws, or its alias --n. */
function draws(where: string, v: Values, dflt: number, min: number): { value: number; given: boolean } {
  const d = str(v, 'draws');
  const n = str(v, 'n');
  if (d !== undefined && n !== undefined && Number(d) !== Number(n)) throw new UsageError(`${where}: --draws ${d} and --n ${n} disagree (--n is the same option as --draws)`);
  const name = d !== undefined ? 'draws' : 'n';
  return { value: num(where, v, name, dflt, (x) => Number.isInteger(x) && x >= min, `an integer >= ${min}`), given: d !== undefined || n !== undefined };
}

function only(where: string, v: Values, names: readonly string[]): string[] | null {
  const o = v.only;
  if (!Array.isArray(o)) return null;
  for (const n of o) {
    if (!names.includes(n)) throw new UsageError(`${where}: --only '${n}' names no sampler (exact names: ${names.map((x) => `'${x}'`).join(', ')})`);
  }
  return o;
}

function writeJson(file: string, value: unknown): void {
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, JSON.stringify(value, null, 2) + '\n');
}

function packageVersion(): string {
  try {
    return (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
  } catch {
    return 'unknown';
  }
}

async function suiteEntries(where: string, moduleSpec: string | undefined, withBuiltins: 'all' | 'peers'): Promise<{ entries: BuiltinEntry[]; moduleUrl: Map<string, string | null> }> {
  const builtin = builtinSuite();
  const moduleUrl = new Map<string, string | null>();
  if (moduleSpec === undefined) {
    for (const e of builtin) moduleUrl.set(e.name, null);
    return { entries: builtin, moduleUrl };
  }
  const mod = await loadSuite(moduleSpec, where);
  const base = withBuiltins === 'peers' ? builtin.filter((e) => e.peer === true) : [];
  for (const e of base) moduleUrl.set(e.name, null);
  for (const e of mod) {
    if (moduleUrl.has(e.name)) throw new UsageError(`${where}: ${moduleSpec} has a sampler named '${e.name}', the name of a built-in peer; rename it`);
    moduleUrl.set(e.name, suiteModuleUrl(moduleSpec));
  }
  return { entries: [...base, ...mod], moduleUrl };
}

async function bench(values: Values, moduleSpec: string | undefined, out: (s: string) => void, err: (s: string) => void): Promise<number> {
  const where = 'exactdraw bench';
  const tolerance = num(where, values, 'tolerance', 0.2, (x) => x >= 0, 'a number >= 0');
  const countTolerance = num(where, values, 'count-tolerance', tolerance, (x) => x >= 0, 'a number >= 0');
  // the baseline is read and checked before anything runs
  const baselineFile = str(values, 'baseline');
  const baseline: BenchReport | undefined = baselineFile === undefined ? undefined : readBaseline(baselineFile);
  const d = draws(where, values, baseline?.draws ?? 1_000_000, 1);
  const rounds = num(where, values, 'rounds', baseline?.rounds ?? 7, (x) => Number.isInteger(x) && x >= 3 && x <= 1000, 'an integer in [3, 1000]');
  const seed = num(where, values, 'seed', baseline?.seed ?? 1, (x) => Number.isInteger(x) && x >= 0 && x <= Number.MAX_SAFE_INTEGER, 'an integer in [0, 2^53 - 1]');
  if (baseline !== undefined) {
    const diffs: string[] = [];
    if (baseline.draws !== d.value) diffs.push(`--draws ${d.value} (baseline ${baseline.draws})`);
    if (baseline.rounds !== rounds) diffs.push(`--rounds ${rounds} (baseline ${baseline.rounds})`);
    if (baseline.seed !== seed) diffs.push(`--seed ${seed} (baseline ${baseline.seed})`);
    if (diffs.length > 0) throw new UsageError(`${where}: this run and the baseline ${baselineFile} differ: ${diffs.join(', ')}; counts are comparable only for the same settings (omit them to use the baseline's, or refresh the baseline)`);
  }
  const { entries, moduleUrl } = await suiteEntries(where, moduleSpec, 'peers');
  const names = entries.map((e) => e.name);
  const quotedNames = names.map((x) => `'${x}'`).join(', ');
  for (const e of entries) {
    if (e.reference !== undefined && !names.includes(e.reference)) throw new UsageError(`${where}: sampler '${e.name}' has reference '${e.reference}', which names no row (valid: ${quotedNames})`);
  }
  const gateReference = str(values, 'gate-reference') ?? baseline?.gateReference ?? RAW_UNIFORM;
  if (!names.includes(gateReference)) throw new UsageError(`${where}: --gate-reference '${gateReference}' names no row (valid: ${quotedNames})`);
  if (baseline !== undefined && baseline.gateReference !== gateReference) throw new UsageError(`${where}: the baseline ${baselineFile} gates on '${baseline.gateReference}', this run on '${gateReference}'`);
  const picked = only(where, values, names);
  const selected = new Set(picked ?? names);
  if (picked !== null) {
    selected.add(gateReference);
    for (const e of entries) if (picked.includes(e.name) && e.reference !== undefined) selected.add(e.reference);
  }
  const cases: BenchCase[] = [];
  entries.forEach((e, index) => {
    if (!selected.has(e.name)) return;
    cases.push({
      name: e.name,
      index,
      peer: e.peer === true,
      reference: e.reference ?? null,
      module: moduleUrl.get(e.name) ?? null,
      draws: Math.max(1, Math.ceil(d.value / (e.drawsDivisor ?? 1))),
    });
  });
  const progressOn = values.quiet !== true && process.stderr.isTTY === true;
  let last = 0;
  const report = await runBench(
    cases,
    {
      draws: d.value,
      rounds,
      seed,
      gateReference,
      childScript: fileURLToPath(import.meta.url),
      selfCheck: values['skip-self-check'] !== true,
      version: packageVersion(),
      progress: progressOn
        ? (line) => {
            const now = Date.now();
            if (now - last < 250) return;
            last = now;
            process.stderr.write(`\r${line.slice(0, 78).padEnd(78)}`);
          }
        : undefined,
    },
    picked,
  );
  if (progressOn) process.stderr.write(`\r${''.padEnd(78)}\r`);
  let verdict: 'pass' | 'regression' | 'too-noisy' = 'pass';
  const json: BenchReport & { gate?: unknown } = report;
  const lines: string[] = [];
  if (baseline !== undefined) {
    const env: string[] = [];
    for (const k of ['exactdraw', 'node', 'cpu', 'platform'] as const) {
      if (baseline[k] !== report[k]) env.push(`${k} ${String(report[k])} (baseline ${String(baseline[k])})`);
    }
    const skipped = new Set(names.filter((n) => !selected.has(n)));
    const g = gate(report.rows, baseline.rows, { tolerance, countTolerance, gateTimes: values['gate-times'] === true, gateReference, skipped });
    verdict = g.verdict;
    json.gate = { baseline: baselineFile, tolerance, countTolerance, verdict, environmentDifferences: env, findings: g.findings };
    if (env.length > 0) lines.push(`note: this run and the baseline differ in ${env.join('; ')}; ratios transfer better than raw times, but compare with care`);
    for (const f of g.findings) lines.push(f.message);
    if (verdict === 'pass') lines.push(`no regression against ${baselineFile} (tolerance ${tolerance}, ${report.rows.length} rows, time gated on ratios to '${gateReference}')`);
    else if (verdict === 'too-noisy') lines.push(`no regression against ${baselineFile} beyond the noise, but the noise of some rows exceeds the tolerance ${tolerance} (WARNING: a regression of that size could hide there${values['fail-on-noise'] === true ? '; --fail-on-noise: exit 3' : ''})`);
  }
  const file = str(values, 'out');
  if (file !== undefined) writeJson(file, json);
  out(values.json === true ? JSON.stringify(json, null, 2) : formatBench(report));
  for (const l of lines) err(l);
  return verdict === 'regression' ? 1 : verdict === 'too-noisy' && values['fail-on-noise'] === true ? 3 : 0;
}

async function check(values: Values, moduleSpec: string | undefined, out: (s: string) => void): Promise<number> {
  const where = 'exactdraw check';
  const d = draws(where, values, 20_000, 10);
  const seed = num(where, values, 'seed', 20261201, (x) => Number.isInteger(x) && x >= 0 && x <= Number.MAX_SAFE_INTEGER, 'an integer in [0, 2^53 - 1]');
  const alpha = num(where, values, 'alpha', 1e-3, (x) => x > 0 && x < 1, 'a number in (0, 1)');
  const perTest = str(values, 'per-test-alpha') === undefined ? undefined : num(where, values, 'per-test-alpha', 0, (x) => x > 0 && x < 1, 'a number in (0, 1)');
  const { entries } = await suiteEntries(where, moduleSpec, 'all');
  const picked = only(where, values, entries.map((e) => e.name));
  const report = runCheck(entries, { draws: d.value, seed, alpha, perTestAlpha: perTest, only: picked, requireAll: values['require-all'] === true });
  const file = str(values, 'out');
  if (file !== undefined) writeJson(file, report);
  out(values.json === true ? JSON.stringify(report, null, 2) : formatCheck(report, moduleSpec ?? ''));
  return report.passed ? 0 : 1;
}

/** Runs the command with arguments `argv` (without node and script); returns the exit code. */
export async function main(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s + '\n'), err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  const at = argv.findIndex((a) => !a.startsWith('-'));
  const command = at < 0 ? undefined : argv[at];
  const rest = at < 0 ? argv : [...argv.slice(0, at), ...argv.slice(at + 1)];
  try {
    if (command === undefined) {
      const { values } = parse(undefined, rest);
      if (values.version === true) {
        out(packageVersion());
        return 0;
      }
      if (values.help === true) {
        out(USAGE);
        return 0;
      }
      err(USAGE);
      return 2;
    }
    if (command === 'help') {
      const topic = rest.find((a) => !a.startsWith('-'));
      out(topic !== undefined && HELP[topic] !== undefined ? HELP[topic] : USAGE);
      return 0;
    }
    if (OPTIONS[command] === undefined) throw new UsageError(`exactdraw: unknown command '${command}' (commands: demo, bench, check, help)`);
    const { values, positionals } = parse(command, rest);
    if (values.help === true) {
      out(HELP[command]);
      return 0;
    }
    if (values.version === true) {
      out(packageVersion());
      return 0;
    }
    const [moduleSpec, extra] = positionals;
    if (extra !== undefined || (command === 'demo' && moduleSpec !== undefined)) throw new UsageError(`exactdraw ${command}: unexpected argument '${extra ?? moduleSpec}'`);
    if (command === 'demo') {
      runDemo(out, str(values, 'out') ?? 'out');
      return 0;
    }
    if (command === 'bench') return await bench(values, moduleSpec, out, err);
    return await check(values, moduleSpec, out);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const text = message.startsWith('exactdraw') ? message : `exactdraw${command === undefined ? '' : ` ${command}`}: ${message}`;
    if (e instanceof UsageError) {
      err(`${text}\n(exactdraw ${command !== undefined && HELP[command] !== undefined ? `${command} ` : ''}--help lists the options)`);
      return 2;
    }
    if (e instanceof BaselineError) {
      err(text);
      return 2;
    }
    err(text);
    return 2;
  }
}

const invoked = process.argv[1] !== undefined && /exactdraw$|main\.[cm]?[jt]s$/.test(process.argv[1]);
if (invoked) {
  if (process.argv[2] === '__bench-case') runBenchChild();
  else {
    main(process.argv.slice(2)).then((code) => {
      process.exitCode = code;
    });
  }
}
