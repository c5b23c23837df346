import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

// Each layer rule in eslint.config.js is proven to fire: a small source text is
// linted as if it sat at the given path, and the rule must report it. A clean
// counterpart shows the rule does not fire on the allowed form.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const eslint = new ESLint({ cwd: root });

async function problems(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result!.messages.map((m) => `${m.ruleId}: ${m.message}`);
}

const restricted = (list: string[]) =>
  list.filter((p) => p.startsWith('import-x/no-restricted-paths'));

describe('layer rules', { timeout: 60_000 }, () => {
  it('the engine may not import the server, the client, schemas or chemistry', async () => {
    for (const source of [
      "import { createApp } from '../../server/app';",
      "import { paths } from '@/paths';",
      "import { apiErrorSchema } from '@shared/schemas/errors';",
      "import { parseStructure } from '../chemistry';",
    ]) {
      const found = restricted(
        await problems('shared/engine/lint-fixture.ts', `${source}\nexport const x = 1;`),
      );
      expect(
        found.some((p) => /engine is pure/.test(p)),
        source,
      ).toBe(true);
    }
    const clean = await problems(
      'shared/engine/lint-fixture.ts',
      "import { PORTS } from './document';\nexport const x = PORTS;",
    );
    expect(clean).toEqual([]);
  });

  it('the engine may import no package but its declared pure ones', async () => {
    const found = await problems(
      'shared/engine/lint-fixture.ts',
      "import { readFileSync } from 'node:fs';\nimport { evaluate } from 'mathjs';\nexport const x = [readFileSync, evaluate];",
    );
    expect(found.filter((p) => p.startsWith('no-restricted-imports'))).toHaveLength(2);
    const clean = await problems(
      'shared/engine/lint-fixture.ts',
      "import { z } from 'zod';\nexport const x = z.number();",
    );
    expect(clean).toEqual([]);
  });

  it('shared code never imports the server or the client', async () => {
    const found = restricted(
      await problems(
        'shared/schemas/lint-fixture.ts',
        "import { AppError } from '../../server/errors';\nexport const x = AppError;",
      ),
    );
    expect(found).toHaveLength(1);
    // schemas → engine is the allowed direction
    const clean = await problems(
      'shared/schemas/lint-fixture.ts',
      "import { PORTS } from '../engine/document';\nexport const x = PORTS;",
    );
    expect(clean).toEqual([]);
  });

  it('a feature imports another feature only through its index', async () => {
    const found = restricted(
      await problems(
        'src/features/editor/lint-fixture.ts',
        "import { saveDraft } from '@/features/routes/api/save-draft';\nexport const x = saveDraft;",
      ),
    );
    expect(found).toHaveLength(1);
    expect(found[0]).toMatch(/public index/);
    const clean = await problems(
      'src/features/editor/lint-fixture.ts',
      "import { saveDraft } from '@/features/routes';\nexport const x = saveDraft;",
    );
    expect(clean).toEqual([]);
  });

  it('HTTP routes never import models', async () => {
    const found = restricted(
      await problems(
        'server/routes/lint-fixture.ts',
        "import { Route } from '../models';\nexport const x = Route;",
      ),
    );
    expect(found).toHaveLength(1);
    expect(found[0]).toMatch(/call services/);
  });

  it('the client never imports the server, and the server never imports the client', async () => {
    expect(
      restricted(
        await problems(
          'src/lib/lint-fixture.ts',
          "import { AppError } from '../../server/errors';\nexport const x = AppError;",
        ),
      ),
    ).toHaveLength(1);
    expect(
      restricted(
        await problems(
          'server/services/lint-fixture.ts',
          "import { paths } from '../../src/paths';\nexport const x = paths;",
        ),
      ),
    ).toHaveLength(1);
  });

  it('shared client pieces never import features, pages or the app', async () => {
    const found = restricted(
      await problems(
        'src/components/lint-fixture.ts',
        "import { saveDraft } from '@/features/routes';\nexport const x = saveDraft;",
      ),
    );
    expect(found).toHaveLength(1);
  });
});
