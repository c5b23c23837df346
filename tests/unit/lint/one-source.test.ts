import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { allQueriesExcept, queryKeys } from '@/api/query-keys';

// Query keys and API addresses have one source each (src/api/query-keys.ts and
// src/paths.ts). Lint refuses a hand-typed key or address anywhere else in src;
// each fixture below is linted as if it sat in a feature and must be reported.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const eslint = new ESLint({ cwd: root });

async function restricted(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result!.messages.filter((m) => m.ruleId === 'no-restricted-syntax').map((m) => m.message);
}

const feature = 'src/features/compounds/api/lint-fixture.ts';

describe('one source for query keys', { timeout: 60_000 }, () => {
  it('refuses an array literal as a query key, in options and in invalidations', async () => {
    for (const source of [
      "export const o = { queryKey: ['workspaces', 'w1', 'compounds'] };",
      "export const o = { queryKey: ['workspaces', 'w1', 'compounds'] as const };",
      "declare const qc: { invalidateQueries(f: object): void };\nqc.invalidateQueries({ queryKey: ['workspaces', 'w1', 'routes'] });",
      "declare const qc: { setQueryData(k: unknown, v: unknown): void };\nqc.setQueryData(['session'], null);",
      "declare const qc: { getQueryData(k: unknown): void };\nqc.getQueryData(['session']);",
      "export const keep = (q: { queryKey: unknown[] }) => q.queryKey[0] !== 'invitations';",
    ]) {
      const found = await restricted(feature, source);
      expect(found.length, source).toBe(1);
      expect(found[0]).toMatch(/query-keys/);
    }
  });

  it('accepts keys built by the factory', async () => {
    const found = await restricted(
      feature,
      "import { queryKeys } from '@/api/query-keys';\nexport const o = { queryKey: queryKeys.compounds.list('w1') };",
    );
    expect(found).toEqual([]);
  });

  it('nests keys so that invalidating a resource reaches its lists and details', () => {
    const client = new QueryClient();
    client.setQueryData(queryKeys.routes.list('w1', { archived: false }), []);
    client.setQueryData(queryKeys.routes.detail('w1', 'r1'), {});
    client.setQueryData(queryKeys.routes.list('w2', { archived: false }), []);
    client.setQueryData(queryKeys.compounds.list('w1'), []);
    client.invalidateQueries({ queryKey: queryKeys.routes.all('w1') });
    const stale = client
      .getQueryCache()
      .getAll()
      .filter((q) => q.isStale())
      .map((q) => q.queryKey);
    expect(stale).toEqual([
      queryKeys.routes.list('w1', { archived: false }),
      queryKeys.routes.detail('w1', 'r1'),
    ]);
  });

  it('keeps only the named queries when the person signed in changes', () => {
    const client = new QueryClient();
    client.setQueryData(queryKeys.session(), null);
    client.setQueryData(queryKeys.invitations.one('t1'), {});
    client.setQueryData(queryKeys.members.list('w1'), []);
    client.setQueryData(queryKeys.tokens(), []);
    client.removeQueries({
      predicate: allQueriesExcept(queryKeys.session(), queryKeys.invitations.all()),
    });
    expect(
      client
        .getQueryCache()
        .getAll()
        .map((q) => q.queryKey),
    ).toEqual([queryKeys.session(), queryKeys.invitations.one('t1')]);
  });
});

describe('one source for API addresses', { timeout: 60_000 }, () => {
  it('refuses an /api/ address written outside src/paths.ts', async () => {
    for (const source of [
      "export const url = '/api/v1/evaluate';",
      'export const url = (id: string) => `/api/v1/jobs/${id}`;',
    ]) {
      const found = await restricted(feature, source);
      expect(found.length, source).toBe(1);
      expect(found[0]).toMatch(/src\/paths\.ts/);
    }
    expect(await restricted('src/paths.ts', "export const url = '/api/v1/evaluate';")).toEqual([]);
  });
});
