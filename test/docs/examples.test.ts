/**
 * Every exported function of the public entries (exactdraw, exactdraw/node)
 * carries an @example in its TSDoc: read with the TypeScript compiler API
 * from the sources, following re-exports to the declaration.
 */
import { describe, expect, it } from 'vitest';
import ts from 'typescript';
import { resolve } from 'node:path';

const ENTRIES = [resolve('src/index.ts'), resolve('src/node/index.ts')];

/** Names of the exported functions of `entries` whose declarations have no @example tag, and the count of exported functions. */
export function functionsWithoutExample(program: ts.Program, entries: string[]): { missing: string[]; functions: number } {
  const checker = program.getTypeChecker();
  const missing: string[] = [];
  let functions = 0;
  for (const entry of entries) {
    const sf = program.getSourceFile(entry);
    if (sf === undefined) throw new Error(`no source file ${entry}`);
    const mod = checker.getSymbolAtLocation(sf);
    if (mod === undefined) throw new Error(`${entry} is not a module`);
    for (const exp of checker.getExportsOfModule(mod)) {
      const sym = exp.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exp) : exp;
      if (!(sym.flags & ts.SymbolFlags.Function)) continue;
      functions++;
      const decls = sym.getDeclarations() ?? [];
      const has = decls.some((d) => ts.getJSDocTags(d).some((t) => t.tagName.text === 'example'));
      if (!has) missing.push(`${entry.endsWith('node/index.ts') ? 'exactdraw/node' : 'exactdraw'}: ${exp.getName()}`);
    }
  }
  return { missing, functions };
}

describe('API docs', () => {
  it('every exported function of exactdraw and exactdraw/node has an @example', () => {
    const program = ts.createProgram(ENTRIES, { module: ts.ModuleKind.NodeNext, moduleResolution: ts.ModuleResolutionKind.NodeNext, target: ts.ScriptTarget.ES2022, types: ['node'], noEmit: true });
    const { missing, functions } = functionsWithoutExample(program, ENTRIES);
    expect(functions).toBeGreaterThan(30); // the walk saw the API
    expect(missing).toEqual([]);
  });

  it('twin: a function without @example is reported, one with it and a non-function are not', () => {
    const file = resolve('virtual-entry.ts');
    const text = [
      '/** Has one. @example\n * ```ts\n * a();\n * ```\n */',
      'export function a(): number { return 1; }',
      '/** Has none. */',
      'export function b(): number { return 2; }',
      '/** A constant. */',
      'export const C = 3;',
    ].join('\n');
    const host = ts.createCompilerHost({});
    const orig = host.getSourceFile.bind(host);
    host.getSourceFile = (name, lang) => (resolve(name) === file ? ts.createSourceFile(name, text, lang) : orig(name, lang));
    const program = ts.createProgram([file], { noEmit: true, types: [] }, host);
    expect(functionsWithoutExample(program, [file])).toEqual({ missing: ['exactdraw: b'], functions: 2 });
  });
});
