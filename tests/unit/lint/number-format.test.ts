import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';
import { formatSignificant, significant } from '@/lib/format';

// Numbers a chemist reads go through one formatter (src/lib/format.ts). Lint refuses a direct
// toExponential/toPrecision anywhere else in src: they write "1.2e-7", which no chemist reads
// and the unit parser's engineering form ("120 × 10⁻⁹") replaces.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const eslint = new ESLint({ cwd: root });

async function numberFindings(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result!.messages
    .filter((m) => m.ruleId === 'no-restricted-syntax' && /formatSignificant/.test(m.message))
    .map((m) => m.message);
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(entry.name) ? [full] : [];
  });
}

describe('one formatter for numbers', { timeout: 60_000 }, () => {
  it('refuses toExponential and toPrecision in features, pages, shared pieces and the API layer', async () => {
    const cases: Array<[string, string]> = [
      [
        'src/features/editor/components/lint-fixture.tsx',
        'export const t = (v: number) => <td>{v.toPrecision(3)}</td>;',
      ],
      [
        'src/routes/lint-fixture.tsx',
        'export const t = (v: number) => `${v.toExponential(2)} kg`;',
      ],
      [
        'src/components/lint-fixture.ts',
        'export const t = (v: number) => Number(v.toPrecision(4));',
      ],
      ['src/lib/lint-fixture.ts', 'export const t = (v: { x: number }) => v.x.toExponential();'],
      ['src/paths.ts', 'export const t = (v: number) => v.toPrecision(2);'],
      ['src/api/query-keys.ts', 'export const t = (v: number) => v.toPrecision(2);'],
    ];
    for (const [file, source] of cases) {
      expect(await numberFindings(file, source), `${file}: ${source}`).toHaveLength(1);
    }
  });

  it('allows the formatter itself and the calls that go through it', async () => {
    expect(
      await numberFindings(
        'src/lib/format.ts',
        'export const t = (v: number) => v.toPrecision(3);',
      ),
    ).toEqual([]);
    expect(
      await numberFindings(
        'src/features/editor/components/lint-fixture.tsx',
        "import { formatSignificant } from '@/lib/format';\nexport const t = (v: number) => <td>{formatSignificant(v, 3)}</td>;",
      ),
    ).toEqual([]);
  });

  it('no file in src calls them today, other than the formatter', () => {
    const offenders = sourceFiles(path.join(root, 'src'))
      .filter((f) => !f.endsWith(path.join('src', 'lib', 'format.ts')))
      .filter((f) => /\.(toExponential|toPrecision)\s*\(/.test(readFileSync(f, 'utf8')))
      .map((f) => path.relative(root, f));
    expect(offenders).toEqual([]);
  });
});

describe('formatSignificant, the display form of computed numbers', () => {
  it('rounds plainly in the readable range and writes powers of three outside it', () => {
    expect(formatSignificant(1234.5, 3)).toBe('1230');
    expect(formatSignificant(0.012345, 3)).toBe('0.0123');
    expect(formatSignificant(1.2e-7, 2)).toBe('120 × 10⁻⁹');
    expect(formatSignificant(3.1e12, 2)).toBe('3.1 × 10¹²');
    expect(formatSignificant(-4.5e-6, 2)).toBe('-4.5 × 10⁻⁶');
    expect(formatSignificant(0, 3)).toBe('0');
    expect(formatSignificant(Number.NaN, 3)).toBe('—');
    // Never the computer's exponent form, at any size.
    for (let e = -15; e <= 15; e++) {
      for (const m of [1, 2.345, 9.999]) {
        expect(formatSignificant(m * 10 ** e, 3)).not.toMatch(/e[-+]?\d/i);
        expect(formatSignificant(-m * 10 ** e, 2)).not.toMatch(/e[-+]?\d/i);
      }
    }
  });

  it('significant() keeps a number a number, for exports', () => {
    expect(significant(1.23456789e-7, 3)).toBe(1.23e-7);
    expect(significant(98765, 2)).toBe(99000);
  });
});
