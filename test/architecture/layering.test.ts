/**
 * The layering of src/ (DEVELOPERS.md, "Layers"): every relative import of a
 * module under src/ (static, `import type`, `export … from`, dynamic
 * `import()`) must go to an area its own area may use, and the module graph
 * must have no circle. The table below is the one in DEVELOPERS.md; change
 * both together.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const SRC = join(ROOT, 'src');

/**
 * Areas, from the bottom up, and the areas each may import (besides itself).
 * The three envelope engines (hull, piecewise, table) and the
 * ratio-of-uniforms internals share only `methods/envelope`; they never
 * import each other. `methods` is the top-level factory files
 * (src/methods/*.ts).
 */
const MAY_IMPORT: Record<string, readonly string[]> = {
  // The deterministic elementary functions (src/vendor/math.ts and src/vendor/math/): the
  // bottom of the table, which every area may import (BELOW_ALL); they import nothing of src/.
  'vendor/math': [],
  vendor: [],
  core: [],
  random: ['core', 'vendor'],
  bounds: ['core'],
  discrete: ['core', 'random'],
  targets: ['core', 'vendor', 'discrete'],
  proposals: ['core'],
  'methods/envelope': ['core'],
  'methods/hull': ['core', 'random', 'bounds', 'methods/envelope'],
  'methods/piecewise': ['core', 'random', 'bounds', 'methods/envelope'],
  'methods/table': ['core', 'random', 'methods/envelope'],
  'methods/ratio-of-uniforms': ['core', 'random', 'bounds', 'methods/envelope'],
  'methods/certified': ['core', 'random', 'methods/envelope'],
  'methods/transform': ['core', 'random', 'bounds', 'targets', 'methods/envelope', 'methods/auto'],
  formula: ['core', 'vendor'],
  // The chooser's helpers: they may use the methods they choose between.
  'methods/auto': ['core', 'random', 'bounds', 'methods', 'methods/envelope', 'methods/certified', 'methods/piecewise'],
  methods: ['core', 'random', 'bounds', 'methods/envelope', 'methods/hull', 'methods/piecewise', 'methods/table', 'methods/ratio-of-uniforms', 'methods/certified', 'methods/auto', 'methods/transform'],
  checks: ['core', 'vendor', 'targets', 'methods/envelope'],
  index: ['core', 'random', 'bounds', 'targets', 'proposals', 'methods', 'methods/envelope', 'methods/table', 'methods/certified', 'methods/auto', 'methods/transform', 'checks', 'formula', 'discrete'],
  node: ['core', 'random', 'index', 'checks', 'methods', 'targets', 'proposals'],
  cli: ['core', 'random', 'vendor', 'bounds', 'targets', 'proposals', 'methods', 'checks', 'index', 'node', 'discrete'],
};

/**
 * Imports that break the table today, each named and explained; the test
 * fails when one disappears (remove it here) or when a new one appears.
 */
const KNOWN_EXCEPTIONS: readonly string[] = [];

/** Areas every area may import. */
const BELOW_ALL: readonly string[] = ['vendor/math'];

function areaOf(file: string): string {
  const rel = relative(SRC, file).split('\\').join('/');
  if (rel === 'index.ts') return 'index';
  const parts = rel.split('/');
  if (parts[0] === 'vendor' && (parts[1] === 'math.ts' || parts[1] === 'math')) return 'vendor/math';
  if (parts[0] === 'methods') return parts.length === 2 ? 'methods' : `methods/${parts[1]}`;
  if (parts[0] === 'proposals' || parts[0] === 'targets') return parts[0];
  return parts[0];
}

function listTs(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...listTs(p));
    else if (name.endsWith('.ts')) out.push(p);
  }
  return out;
}

/** Relative import specifiers of a module (comments stripped first). */
export function importsOf(source: string): string[] {
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`])\/\/.*$/gm, '$1');
  const out: string[] = [];
  const re = /(?:^|[\s;])(?:import|export)\s+(?:type\s+)?(?:[^'";]*?\s+from\s+)?['"](\.[^'"]+)['"]|import\(\s*['"](\.[^'"]+)['"]\s*\)/g;
  for (let m = re.exec(code); m !== null; m = re.exec(code)) out.push(m[1] ?? m[2]);
  return out;
}

function resolveTs(from: string, spec: string): string {
  const p = resolve(dirname(from), spec);
  return p.endsWith('.js') ? p.slice(0, -3) + '.ts' : p;
}

const files = listTs(SRC);
const graph = new Map<string, string[]>();
for (const f of files) graph.set(f, importsOf(readFileSync(f, 'utf8')).map((s) => resolveTs(f, s)));
const short = (f: string): string => relative(ROOT, f).split('\\').join('/');

/** Strongly connected components with more than one module, or a module importing itself (Tarjan). */
function circles(g: Map<string, string[]>): string[][] {
  let index = 0;
  const idx = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const on = new Set<string>();
  const out: string[][] = [];
  const visit = (v: string): void => {
    idx.set(v, index);
    low.set(v, index);
    index++;
    stack.push(v);
    on.add(v);
    for (const w of g.get(v) ?? []) {
      if (!g.has(w)) continue;
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v) as number, low.get(w) as number));
      } else if (on.has(w)) low.set(v, Math.min(low.get(v) as number, idx.get(w) as number));
    }
    if (low.get(v) === idx.get(v)) {
      const comp: string[] = [];
      for (;;) {
        const w = stack.pop() as string;
        on.delete(w);
        comp.push(w);
        if (w === v) break;
      }
      if (comp.length > 1 || (g.get(v) ?? []).includes(v)) out.push(comp.map(short).sort());
    }
  };
  for (const v of g.keys()) if (!idx.has(v)) visit(v);
  return out;
}

describe('layering of src/', () => {
  it('the import parser sees every form of import (self-check on a sample)', () => {
    const sample = [
      "import { a } from './a.js';",
      "import type { B } from '../b.js';",
      "export { c } from './c.js';",
      "export type { D } from './d/e.js';",
      "import './side.js';",
      "const m = await import('./lazy.js');",
      "// import { no } from './comment.js';",
      "/* import { no } from './block.js'; */",
      "import { x } from 'vitest';",
    ].join('\n');
    expect(importsOf(sample)).toEqual(['./a.js', '../b.js', './c.js', './d/e.js', './side.js', './lazy.js']);
  });

  it('every module resolves to a file in the repository and lies in an area of the table', () => {
    expect(files.length).toBeGreaterThan(50);
    for (const [f, deps] of graph) {
      expect(MAY_IMPORT[areaOf(f)], `${short(f)}: area ${areaOf(f)} is not in the table`).toBeDefined();
      for (const d of deps) expect(graph.has(d), `${short(f)} imports ${short(d)}, which does not exist`).toBe(true);
    }
  });

  it('no import goes against the table (besides the named KNOWN_EXCEPTIONS)', () => {
    const against: string[] = [];
    for (const [f, deps] of graph) {
      const a = areaOf(f);
      for (const d of deps) {
        const b = areaOf(d);
        if (b !== a && !MAY_IMPORT[a].includes(b) && !BELOW_ALL.includes(b)) against.push(`${short(f)} -> ${short(d)}`);
      }
    }
    const unexpected = against.filter((e) => !KNOWN_EXCEPTIONS.includes(e));
    expect(unexpected, 'imports against the layering table').toEqual([]);
    const gone = KNOWN_EXCEPTIONS.filter((e) => !against.includes(e));
    expect(gone, 'KNOWN_EXCEPTIONS that no longer occur: remove them').toEqual([]);
  });

  it('the module graph has no circle (type imports included)', () => {
    expect(circles(graph)).toEqual([]);
  });

  it('the checks can fail: a circle and an upward arrow in a made-up graph are found', () => {
    const g = new Map<string, string[]>([
      [join(SRC, 'methods/a.ts'), [join(SRC, 'methods/b.ts')]],
      [join(SRC, 'methods/b.ts'), [join(SRC, 'methods/a.ts')]],
      [join(SRC, 'core/c.ts'), []],
    ]);
    expect(circles(g)).toEqual([['src/methods/a.ts', 'src/methods/b.ts']]);
    expect(MAY_IMPORT[areaOf(join(SRC, 'core/x.ts'))].includes(areaOf(join(SRC, 'methods/hull/hull.ts')))).toBe(false);
    expect(MAY_IMPORT[areaOf(join(SRC, 'methods/table/build.ts'))].includes(areaOf(join(SRC, 'methods/hull/hull.ts')))).toBe(false);
    // the rest of vendor/ is not below everything: bounds may not import the @stdlib wrappers
    expect(areaOf(join(SRC, 'vendor/stdlib.ts'))).toBe('vendor');
    expect(BELOW_ALL.includes(areaOf(join(SRC, 'vendor/stdlib.ts')))).toBe(false);
    expect(MAY_IMPORT.bounds.includes(areaOf(join(SRC, 'vendor/stdlib.ts')))).toBe(false);
  });
});
