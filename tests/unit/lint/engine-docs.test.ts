/**
 * Engine documentation standard, checked with the TypeScript compiler API.
 *
 * Convention (docs/methods.md, "Documentation of engine functions"): every
 * exported function of the covered engine folders has a JSDoc comment that
 *  - states its source: a line starting "Source" (or "Sources", "Source and
 *    formula", "Source and validity") or an `@source` tag;
 *  - states its validity range: a line starting "Validity" (or "Source and
 *    validity") or a `@validity` tag;
 *  - documents every parameter with `@param name …`; a numeric parameter
 *    (number, number[], ArrayLike<number>, Float64Array) carries its unit in
 *    square brackets, `[–]` for dimensionless values; an options object may
 *    document its fields as `@param opts.field … [unit]`;
 *  - says what it returns (`@returns`) unless it returns nothing.
 * The formula goes in the description (or "Formula:"), or the function says
 * where it is ("see the module comment").
 *
 * Covered: every engine folder (NOT_YET_COVERED is empty: the optimiser and
 * the substitution advisor were the last brought up), and the top-level engine modules
 * (units, random, document, text, ...), so a new undocumented function there
 * fails; a new folder is covered from its first file. Exported arrow functions
 * and function expressions count as functions (their JSDoc is on the `export const`).
 * A plumbing function (stream helpers, validation, grouping) states
 * "this project's own bookkeeping (no external source)" as its source and
 * "any input the schema accepts" (or the like) as its validity.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import ts from 'typescript';

const ENGINE = fileURLToPath(new URL('../../../shared/engine/', import.meta.url));
/**
 * Engine folders not yet brought up to the standard: none. Every folder is
 * covered, so a new folder is covered from its first file; a folder listed
 * here must exist (the test below).
 */
const NOT_YET_COVERED: string[] = [];
const COVERED = readdirSync(ENGINE, { withFileTypes: true })
  .filter((e) => e.isDirectory() && !NOT_YET_COVERED.includes(e.name))
  .map((e) => e.name);

interface Finding {
  file: string;
  fn: string;
  problem: string;
}

type ExportedFunction = ts.FunctionDeclaration | ts.ArrowFunction | ts.FunctionExpression;

/**
 * Exported functions: declarations, and constants holding an arrow function or a
 * function expression (`export const f = (x: number) => …`), whose JSDoc sits on
 * the variable statement.
 */
function exportedFunctions(
  file: string,
): Array<{ name: string; node: ExportedFunction; docNode: ts.Node }> {
  const text = readFileSync(file, 'utf8');
  const sf = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
  const out: Array<{ name: string; node: ExportedFunction; docNode: ts.Node }> = [];
  const exported = (n: ts.Node) =>
    ts.canHaveModifiers(n) &&
    ts.getModifiers(n)?.some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
  sf.forEachChild((n) => {
    if (ts.isFunctionDeclaration(n) && n.name && exported(n))
      out.push({ name: n.name.text, node: n, docNode: n });
    if (ts.isVariableStatement(n) && exported(n))
      for (const d of n.declarationList.declarations)
        if (
          ts.isIdentifier(d.name) &&
          d.initializer &&
          (ts.isArrowFunction(d.initializer) || ts.isFunctionExpression(d.initializer))
        )
          out.push({ name: d.name.text, node: d.initializer, docNode: n });
  });
  return out;
}

function jsDocText(node: ts.Node): string {
  return ts
    .getJSDocCommentsAndTags(node)
    .map((d) => d.getText())
    .join('\n');
}

export function checkFile(file: string): Finding[] {
  const findings: Finding[] = [];
  const seen = new Set<string>();
  for (const { name, node, docNode } of exportedFunctions(file)) {
    // Overloads: document the implementation once.
    if (seen.has(name)) continue;
    seen.add(name);
    const doc = jsDocText(docNode);
    const add = (problem: string) => findings.push({ file, fn: name, problem });
    if (!doc) {
      add('no JSDoc comment');
      continue;
    }
    if (!/(^|\n)\s*\*?\s*(Sources?\b|Source and)|@source/.test(doc)) add('no source');
    if (!/(^|\n)\s*\*?\s*(Validity\b|Source and validity)|@validity|validity/i.test(doc))
      add('no validity range');
    for (const p of node.parameters) {
      const pname = p.name.getText();
      if (ts.isObjectBindingPattern(p.name)) continue;
      const re = new RegExp(`@param\\s+${pname.replace(/[$]/g, '\\$')}\\b[^\\n]*`, 'g');
      const lines = [...doc.matchAll(re)].map((m) => m[0]);
      // Fields of an options object: @param opts.field … [unit] counts for opts.
      const fieldLines = [...doc.matchAll(new RegExp(`@param\\s+${pname}\\.\\w+[^\\n]*`, 'g'))];
      if (lines.length === 0 && fieldLines.length === 0) {
        add(`parameter ${pname} undocumented`);
        continue;
      }
      const typeText = p.type?.getText() ?? '';
      const numeric =
        /\bnumber\b|Float64Array|ArrayLike<number>/.test(typeText) && !/=>|[{&]/.test(typeText);
      const all = [...lines, ...fieldLines.map((m) => m[0])].join('\n');
      if (numeric && !/\[[^\]]+\]/.test(all)) add(`parameter ${pname} has no unit in [brackets]`);
    }
    const returnsVoid =
      node.type?.kind === ts.SyntaxKind.VoidKeyword ||
      (!node.type &&
        // An arrow function with an expression body returns that expression.
        (node.body === undefined || ts.isBlock(node.body)) &&
        !/return\s+[^;]/.test(node.body?.getText() ?? ''));
    if (!returnsVoid && !/@returns?\b/.test(doc) && !/\bReturns\b/.test(doc))
      add('return value undocumented');
  }
  return findings;
}

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory()
      ? filesUnder(join(dir, e.name))
      : e.name.endsWith('.ts')
        ? [join(dir, e.name)]
        : [],
  );
}

describe('engine documentation standard', () => {
  for (const folder of COVERED) {
    it(`every exported function in shared/engine/${folder} states source, validity and units`, () => {
      const findings = filesUnder(join(ENGINE, folder)).flatMap(checkFile);
      expect(findings.map((f) => `${f.file.slice(ENGINE.length)} ${f.fn}: ${f.problem}`)).toEqual(
        [],
      );
    });
  }

  it('every exported function in the top-level engine modules states source, validity and units', () => {
    const findings = readdirSync(ENGINE)
      .filter((f) => f.endsWith('.ts'))
      .flatMap((f) => checkFile(join(ENGINE, f)));
    expect(findings.map((f) => `${f.file.slice(ENGINE.length)} ${f.fn}: ${f.problem}`)).toEqual([]);
  });

  it('lists only folders that exist as not yet covered', () => {
    const folders = readdirSync(ENGINE, { withFileTypes: true })
      .filter((e) => e.isDirectory())
      .map((e) => e.name);
    for (const f of NOT_YET_COVERED) expect(folders).toContain(f);
  });

  it('the check fails on a function that lacks them (the rule can fire)', () => {
    const tmp = fileURLToPath(new URL('./fixtures/undocumented.ts.txt', import.meta.url));
    const findings = checkFile(tmp);
    expect(findings.map((f) => f.problem)).toEqual(
      expect.arrayContaining([
        'no source',
        'no validity range',
        'parameter T_K has no unit in [brackets]',
        'parameter P undocumented',
      ]),
    );
    expect(findings.filter((f) => f.fn === 'undocumentedArrow').map((f) => f.problem)).toEqual([
      'no JSDoc comment',
    ]);
  });
});
