import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

// No markup is injected into the page: lint refuses dangerouslySetInnerHTML,
// innerHTML/outerHTML assignments and insertAdjacentHTML, in a feature, in the
// shared client pieces and on the server alike. Each fixture must be reported;
// the clean counterpart (a structure drawing as an <img> data URL) must not.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const eslint = new ESLint({ cwd: root });

async function markup(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result!.messages
    .filter((m) => m.ruleId === 'no-restricted-syntax' && /inject markup/.test(m.message))
    .map((m) => m.message);
}

describe('no injected markup', { timeout: 60_000 }, () => {
  it('refuses dangerouslySetInnerHTML, innerHTML, outerHTML and insertAdjacentHTML', async () => {
    const cases: Array<[string, string]> = [
      [
        'src/features/compounds/components/lint-fixture.tsx',
        'export const S = ({ svg }: { svg: string }) => <div dangerouslySetInnerHTML={{ __html: svg }} />;',
      ],
      [
        'src/components/lint-fixture.tsx',
        "import { createElement } from 'react';\nexport const S = (svg: string) => createElement('div', { dangerouslySetInnerHTML: { __html: svg } });",
      ],
      [
        'src/paths-lint-fixture.ts',
        'export const put = (el: HTMLElement, svg: string) => {\n  el.innerHTML = svg;\n};',
      ],
      [
        'src/api/query-keys.ts',
        'export const put = (el: HTMLElement, svg: string) => {\n  el.outerHTML = svg;\n};',
      ],
      [
        'src/paths.ts',
        "export const put = (el: HTMLElement, svg: string) => el.insertAdjacentHTML('beforeend', svg);",
      ],
      [
        'server/services/lint-fixture.ts',
        'export const put = (el: { innerHTML: string }, svg: string) => {\n  el.innerHTML = svg;\n};',
      ],
    ];
    for (const [file, source] of cases) {
      const found = await markup(file, source);
      expect(found.length, `${file}: ${source}`).toBe(1);
    }
  });

  it('accepts a drawing shown as an image and reading innerHTML', async () => {
    const found = await markup(
      'src/features/compounds/components/lint-fixture.tsx',
      [
        'export const S = ({ svg }: { svg: string }) => (',
        '  <img alt="structure" src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`} />',
        ');',
        'export const read = (el: HTMLElement) => el.innerHTML.length;',
      ].join('\n'),
    );
    expect(found).toEqual([]);
  });
});
