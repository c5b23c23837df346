import { beforeAll, describe, expect, it } from 'vitest';
import { routeDetailSchema, routeListSchema, type RouteSummary } from '@shared/schemas/routes';
import type { Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

// The routes list pages by keyset: each page starts after the last row's (sort key, id). Walked
// page by page under each sort, the pages hold every route once, in the sort's order, also when
// routes are added or edited while paging; a cursor that is not one the server gave is a 400.
describe('routes list paging', () => {
  let workspace: Workspace;
  let asChemist: SignedIn;
  const names = [
    'beta wash (invented)',
    'Alpha quench (invented)',
    'alpha quench (invented)',
    'Gamma crystallisation (invented)',
    'Delta extraction (invented)',
    'Alpha quench (invented)',
    'epsilon drying (invented)',
  ];
  const ids: string[] = [];

  const routesPath = (query = '') => `/api/v1/workspaces/${workspace.id}/routes${query}`;
  const post = (path: string, body: object) =>
    asChemist.agent.post(path).set('X-CSRF-Token', asChemist.csrfToken).send(body);

  /** Every page, following nextCursor, with the given query. */
  async function walk(query: string, limit: number): Promise<RouteSummary[][]> {
    const pages: RouteSummary[][] = [];
    let cursor: string | null = null;
    do {
      const suffix = `?limit=${limit}${query}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`;
      const reply = await asChemist.agent.get(routesPath(suffix));
      expect(reply.status).toBe(200);
      const page = routeListSchema.parse(reply.body);
      expect(page.items.length).toBeLessThanOrEqual(limit);
      pages.push(page.items);
      cursor = page.nextCursor;
    } while (cursor && pages.length < 50);
    return pages;
  }

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const chemist = await buildMember(workspace, ['chemist']);
    asChemist = await signIn(server.app, chemist.email);
    for (const [i, name] of names.entries()) {
      const created = await post(routesPath(), {
        name,
        ...(i % 3 === 0 ? { projectName: 'Project Wombat (invented)' } : {}),
      });
      expect(created.status).toBe(201);
      ids.push(routeDetailSchema.parse(created.body).id);
    }
  });

  it('by name: every route once, A to Z ignoring case, equal names in id order, at any page size', async () => {
    for (const limit of [1, 2, 3, 7, 200]) {
      const pages = await walk('&sort=name', limit);
      const rows = pages.flat();
      expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
      const keys = rows.map((r) => [r.name.toLowerCase(), r.id] as const);
      const sorted = [...keys].sort(([a, x], [b, y]) =>
        a === b ? (x < y ? -1 : 1) : a < b ? -1 : 1,
      );
      expect(keys).toEqual(sorted);
      // Only the last page may be short, and none is empty but the only one.
      expect(pages.slice(0, -1).every((p) => p.length === limit)).toBe(true);
    }
  });

  it('by last change (the default): every route once, newest first', async () => {
    for (const limit of [1, 2, 4, 200]) {
      const rows = (await walk('', limit)).flat();
      expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
      const times = rows.map((r) => Date.parse(r.updatedAt));
      expect(times).toEqual([...times].sort((a, b) => b - a));
    }
    // The newest route comes first: the last created.
    const [first] = (await walk('', 1))[0]!;
    expect(first!.id).toBe(ids.at(-1));
  });

  it('a draft saved moves its route to the top of the last-change order', async () => {
    const oldest = ids[0]!;
    const detail = routeDetailSchema.parse(
      (await asChemist.agent.get(routesPath(`/${oldest}`))).body,
    );
    const saved = await asChemist.agent
      .put(routesPath(`/${oldest}/draft`))
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ baseVersion: detail.draft.version, document: detail.draft.document });
    expect(saved.status).toBe(200);
    const page = routeListSchema.parse((await asChemist.agent.get(routesPath('?limit=1'))).body);
    expect(page.items[0]!.id).toBe(oldest);
  });

  it('routes added while paging neither repeat nor hide the rows not yet shown', async () => {
    const first = routeListSchema.parse(
      (await asChemist.agent.get(routesPath('?limit=3&sort=name'))).body,
    );
    // Sorts before every page already shown, and one after.
    const early = await post(routesPath(), { name: 'Aardvark rinse (invented)' });
    const late = await post(routesPath(), { name: 'Zeta filtration (invented)' });
    const rest: RouteSummary[] = [];
    let cursor = first.nextCursor;
    while (cursor) {
      const page = routeListSchema.parse(
        (
          await asChemist.agent.get(
            routesPath(`?limit=3&sort=name&cursor=${encodeURIComponent(cursor)}`),
          )
        ).body,
      );
      rest.push(...page.items);
      cursor = page.nextCursor;
    }
    const seen = [...first.items, ...rest].map((r) => r.id);
    expect(new Set(seen).size).toBe(seen.length);
    expect(seen).toEqual(expect.arrayContaining(ids));
    expect(seen).toContain(late.body.id);
    expect(seen).not.toContain(early.body.id);
    ids.push(early.body.id, late.body.id);
  });

  it('searches route and project names in SQL, with paging', async () => {
    const byName = (await walk('&q=ALPHA&sort=name', 1)).flat();
    expect(byName.map((r) => r.name.toLowerCase())).toEqual([
      'alpha quench (invented)',
      'alpha quench (invented)',
      'alpha quench (invented)',
    ]);
    const byProject = (await walk('&q=wombat', 2)).flat();
    expect(byProject.length).toBe(3);
    expect(byProject.every((r) => r.project?.name === 'Project Wombat (invented)')).toBe(true);
    expect((await walk('&q=%25', 5)).flat()).toEqual([]);
  });

  it('refuses a cursor it did not give, or one of another order, naming the cursor (400)', async () => {
    const bad = await asChemist.agent.get(routesPath('?cursor=not-a-cursor'));
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('bad_request');
    expect(bad.body.error.details[0].path).toBe('query.cursor');
    const forged = Buffer.from(JSON.stringify(['changed', 'yesterday', 'x'])).toString('base64url');
    expect((await asChemist.agent.get(routesPath(`?cursor=${forged}`))).status).toBe(400);

    const byName = routeListSchema.parse(
      (await asChemist.agent.get(routesPath('?limit=1&sort=name'))).body,
    );
    const mixed = await asChemist.agent.get(
      routesPath(`?sort=changed&cursor=${encodeURIComponent(byName.nextCursor!)}`),
    );
    expect(mixed.status).toBe(400);
    expect(mixed.body.error.details[0]).toMatchObject({ path: 'query.cursor' });
    expect(mixed.body.error.message).toMatch(/first page/);
  });

  it('takes limit 1 to 200 (default 50) and a known sort', async () => {
    for (const [query, path] of [
      ['?limit=0', 'query.limit'],
      ['?limit=201', 'query.limit'],
      ['?sort=owner', 'query.sort'],
    ] as const) {
      const reply = await asChemist.agent.get(routesPath(query));
      expect(reply.status, query).toBe(400);
      expect(reply.body.error.details[0].path).toBe(path);
    }
    const all = routeListSchema.parse((await asChemist.agent.get(routesPath())).body);
    expect(all.items.length).toBe(ids.length);
    expect(all.nextCursor).toBeNull();
  });
});
