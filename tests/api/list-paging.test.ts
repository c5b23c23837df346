import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { LIST_LIMIT_MAX } from '@shared/schemas/lists';
import { MATCH_FIRST_MAX } from '../../server/services/keyset';
import { EvaluationJob, Project, type Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

type Row = Record<string, unknown>;

// Every list answers { items, nextCursor }, takes limit (default 50, at most 200), cursor, q and
// sort, and pages by keyset: followed page by page at any page size, the pages hold every row
// once, in the list's order; q narrows in the server; a cursor that is not one the server gave,
// or one of another order, is a 400 naming the cursor.
describe('every list pages, sorts and searches on the server', () => {
  let workspace: Workspace;
  let other: Workspace;
  let asAdmin: SignedIn;
  let asOtherUser: SignedIn;
  const ws = (path: string) => `/api/v1/workspaces/${workspace.id}${path}`;
  const post = (path: string, body: object) =>
    asAdmin.agent.post(path).set('X-CSRF-Token', asAdmin.csrfToken).send(body);

  /** Every row of the list, following nextCursor at the given page size. */
  async function walk(who: SignedIn, path: string, limit: number, query = ''): Promise<Row[]> {
    const rows: Row[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const reply = await who.agent.get(
        `${path}?limit=${limit}${query}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`,
      );
      expect(reply.status, JSON.stringify(reply.body)).toBe(200);
      expect(Object.keys(reply.body).sort()).toEqual(['items', 'nextCursor']);
      expect(reply.body.items.length).toBeLessThanOrEqual(limit);
      rows.push(...reply.body.items);
      cursor = reply.body.nextCursor;
      pages += 1;
    } while (cursor && pages < 100);
    expect(cursor).toBeNull();
    return rows;
  }

  /** The list at page sizes 1, 2 and 3 reads the same rows as one page of the largest size. */
  async function expectStablePaging(who: SignedIn, path: string, key: string, query = '') {
    const whole = await walk(who, path, LIST_LIMIT_MAX, query);
    for (const limit of [1, 2, 3])
      expect((await walk(who, path, limit, query)).map((r) => r[key])).toEqual(
        whole.map((r) => r[key]),
      );
    expect(new Set(whole.map((r) => r[key])).size).toBe(whole.length);
    return whole;
  }

  async function expectCursorChecks(path: string, otherSort?: string) {
    const bad = await asAdmin.agent.get(`${path}?cursor=not-a-cursor`);
    expect(bad.status).toBe(400);
    apiErrorSchema.parse(bad.body);
    expect(bad.body.error.details[0].path).toBe('query.cursor');
    const tooMany = await asAdmin.agent.get(`${path}?limit=${LIST_LIMIT_MAX + 1}`);
    expect(tooMany.status).toBe(400);
    if (otherSort) {
      const first = await asAdmin.agent.get(`${path}?limit=1`);
      expect(first.body.nextCursor).toEqual(expect.any(String));
      const crossed = await asAdmin.agent.get(
        `${path}?limit=1&sort=${otherSort}&cursor=${encodeURIComponent(first.body.nextCursor)}`,
      );
      expect(crossed.status).toBe(400);
      expect(crossed.body.error.message).toMatch(/another order/);
    }
  }

  beforeAll(async () => {
    workspace = await buildWorkspace();
    other = await buildWorkspace();
    const admin = await buildMember(workspace, ['admin', 'chemist', 'engineer'], {
      name: 'Admin Aalto (invented)',
    });
    asAdmin = await signIn(server.app, admin.email);
    for (const [name, roles] of [
      ['beth Reviewer (invented)', ['reviewer']],
      ['Beth Reviewer (invented)', ['reviewer', 'engineer']],
      ['Cyrus Chemist (invented)', ['chemist']],
      ['dana %Percent (invented)', ['chemist']],
    ] as const)
      await buildMember(workspace, [...roles], { name });
    const outsider = await buildMember(other, ['chemist'], { name: 'Beth Outsider (invented)' });
    asOtherUser = await signIn(server.app, outsider.email);
    for (const name of ['Zeta (invented)', 'alpha (invented)', 'Alpha two (invented)', 'mu_x'])
      await Project.create({ workspaceId: workspace.id, name });
    await Project.create({ workspaceId: other.id, name: 'Alpha elsewhere (invented)' });
  });

  it('projects: by name ignoring case, every one once, searched by part of the name', async () => {
    const rows = await expectStablePaging(asAdmin, ws('/projects'), 'id');
    expect(rows.map((r) => r.name)).toEqual([
      'alpha (invented)',
      'Alpha two (invented)',
      'mu_x',
      'Zeta (invented)',
    ]);
    expect(rows.every((r) => r.routeCount === 0)).toBe(true);
    const found = await walk(asAdmin, ws('/projects'), 50, '&q=ALPHA');
    expect(found.map((r) => r.name)).toEqual(['alpha (invented)', 'Alpha two (invented)']);
    // The wildcard of LIKE is taken literally.
    expect((await walk(asAdmin, ws('/projects'), 50, '&q=_')).map((r) => r.name)).toEqual(['mu_x']);
    await expectCursorChecks(ws('/projects'));
  });

  it('a search finds the same rows whether its matches are few (looked up on the trigram index) or many (filtered on the order)', async () => {
    // Its own workspace: more matches than MATCH_FIRST_MAX, so "Batch" takes the other path.
    const big = await buildWorkspace();
    const admin = await buildMember(big, ['admin', 'chemist']);
    const asBig = await signIn(server.app, admin.email);
    const names = Array.from(
      { length: MATCH_FIRST_MAX + 20 },
      (_, i) => `Batch ${String(i).padStart(4, '0')} (invented)`,
    );
    await Project.bulkCreate(names.map((name) => ({ workspaceId: big.id, name })));
    await Project.create({ workspaceId: big.id, name: 'Other (invented)' });
    const path = `/api/v1/workspaces/${big.id}/projects`;
    const many = await walk(asBig, path, LIST_LIMIT_MAX, '&q=batch');
    expect(many.map((r) => r.name)).toEqual(names);
    const few = await walk(asBig, path, 7, '&q=batch%2000');
    expect(few.map((r) => r.name)).toEqual(names.filter((name) => name.includes('Batch 00')));
    expect(few).toHaveLength(100);
    expect(await walk(asBig, path, 50, '&q=no%20such%20batch')).toEqual([]);
  });

  it('members: by name, searched by name or e-mail, filtered by role', async () => {
    const rows = await expectStablePaging(asAdmin, ws('/members'), 'userId');
    const names = rows.map((r) => String(r.name).toLowerCase());
    expect(names).toEqual([...names].sort());
    expect(rows).toHaveLength(5);
    const beths = await walk(asAdmin, ws('/members'), 1, '&q=beth');
    expect(beths.map((r) => r.name).sort()).toEqual([
      'Beth Reviewer (invented)',
      'beth Reviewer (invented)',
    ]);
    const percent = await walk(asAdmin, ws('/members'), 50, `&q=${encodeURIComponent('%')}`);
    expect(percent.map((r) => r.name)).toEqual(['dana %Percent (invented)']);
    const reviewers = await walk(asAdmin, ws('/members'), 1, '&role=reviewer');
    expect(reviewers).toHaveLength(2);
    expect(reviewers.every((r) => (r.roles as string[]).includes('reviewer'))).toBe(true);
    await expectCursorChecks(ws('/members'));
  });

  it('equipment: vessels first, by name or largest first, keyset paged', async () => {
    const vessel = (name: string, maxWorkingL: number) => ({
      kind: 'vessel',
      name,
      nominalL: maxWorkingL + 100,
      minStirrableL: 10,
      maxWorkingL,
      minC: -20,
      maxC: 140,
      minMbar: 20,
      maxMbar: 4000,
      material: 'Glass-lined steel',
    });
    for (const body of [
      vessel('R-2 (invented)', 900),
      vessel('r-10 (invented)', 4000),
      vessel('R-3 (invented)', 250),
      { kind: 'filter', name: 'F-1 (invented)', areaM2: 0.5, capacityL: 200 },
      { kind: 'dryer', name: 'D-1 (invented)', areaM2: 1, capacityL: 500 },
    ])
      expect((await post(ws('/equipment'), body)).status).toBe(201);
    const byName = await expectStablePaging(asAdmin, ws('/equipment'), 'id');
    expect(byName.map((r) => r.name)).toEqual([
      'r-10 (invented)',
      'R-2 (invented)',
      'R-3 (invented)',
      'F-1 (invented)',
      'D-1 (invented)',
    ]);
    const bySize = await expectStablePaging(asAdmin, ws('/equipment'), 'id', '&sort=size');
    expect(bySize.map((r) => r.name)).toEqual([
      'r-10 (invented)',
      'R-2 (invented)',
      'R-3 (invented)',
      'F-1 (invented)',
      'D-1 (invented)',
    ]);
    expect(bySize.slice(0, 3).map((r) => r.maxWorkingL)).toEqual([4000, 900, 250]);
    expect((await walk(asAdmin, ws('/equipment'), 2, '&q=r-')).map((r) => r.name)).toEqual([
      'r-10 (invented)',
      'R-2 (invented)',
      'R-3 (invented)',
    ]);
    await expectCursorChecks(ws('/equipment'), 'size');
  });

  it('jobs: only your own, newest first, filtered by kind and status', async () => {
    const mine = asAdmin.session.user.id;
    const theirs = asOtherUser.session.user.id;
    const made: string[] = [];
    for (const [i, kind] of ['monte-carlo', 'optimise', 'monte-carlo'].entries()) {
      const job = await EvaluationJob.create({
        userId: mine,
        kind: kind as 'monte-carlo' | 'optimise',
        input: { invented: i },
        status: i === 2 ? 'done' : 'queued',
      });
      made.push(job.id);
    }
    await EvaluationJob.create({ userId: theirs, kind: 'optimise', input: {} });
    const rows = await expectStablePaging(asAdmin, '/api/v1/jobs', 'id');
    expect(rows.map((r) => r.id)).toEqual([...made].reverse());
    expect(rows.every((r) => !('result' in r))).toBe(true);
    const oldest = await walk(asAdmin, '/api/v1/jobs', 1, '&sort=oldest');
    expect(oldest.map((r) => r.id)).toEqual(made);
    expect((await walk(asAdmin, '/api/v1/jobs', 50, '&kind=optimise')).map((r) => r.id)).toEqual([
      made[1],
    ]);
    expect((await walk(asAdmin, '/api/v1/jobs', 50, '&status=done')).map((r) => r.id)).toEqual([
      made[2],
    ]);
    expect((await walk(asAdmin, '/api/v1/jobs', 50, '&q=optim')).map((r) => r.id)).toEqual([
      made[1],
    ]);
    // The status is searched too; another person's jobs never match (their optimise run neither).
    expect((await walk(asAdmin, '/api/v1/jobs', 50, '&q=DONE')).map((r) => r.id)).toEqual([
      made[2],
    ]);
    expect((await walk(asOtherUser, '/api/v1/jobs', 50, '&q=queued')).map((r) => r.kind)).toEqual([
      'optimise',
    ]);
    expect((await walk(asOtherUser, '/api/v1/jobs', 50)).map((r) => r.kind)).toEqual(['optimise']);
    expect((await request(server.app).get('/api/v1/jobs')).status).toBe(401);
    await expectCursorChecks('/api/v1/jobs', 'oldest');
  });
});
