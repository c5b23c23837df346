import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditListSchema, auditVerifySchema } from '@shared/schemas/audit';
import { database } from '../../server/db/sequelize';
import { describeConnectedRole, openRoleConnection, roleWarning } from '../../server/db/roles';
import { AuditEvent, type User, type Workspace } from '../../server/models';
import { recordAudit, verifyChain } from '../../server/services/audit';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, DEFAULT_PASSWORD } from '../support/factories';

const server = useTestServer();

/** A connection as the schema owner, to play someone editing the table behind the server's back. */
let owner: Sequelize;
beforeAll(() => {
  owner = openRoleConnection(process.env.DATABASE_OWNER_URL!);
});
afterAll(async () => {
  await owner?.close();
});

const auditRow = (workspaceId: string, action = 'test.event') => ({
  workspaceId,
  actorId: null,
  action,
  entityType: 'test',
  entityId: null,
  after: { n: Math.random() },
});

async function refusal(sql: string): Promise<string> {
  try {
    await database().query(sql);
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe("the server's database role", () => {
  let workspace: Workspace;
  beforeAll(async () => {
    workspace = await buildWorkspace();
    for (let i = 0; i < 3; i += 1) await recordAudit(auditRow(workspace.id), null);
  });

  it('is an ordinary role that owns nothing', async () => {
    const report = await describeConnectedRole(database());
    expect(report).toMatchObject({
      name: 'phasewright_app',
      superuser: false,
      bypassesRowSecurity: false,
      ownedObjects: 0,
      ownsAuditTrail: false,
    });
    expect(roleWarning(report)).toBeNull();
    // The owner, by contrast, owns the schema and would be warned about.
    expect(roleWarning(await describeConnectedRole(owner))).toMatch(/owns/);
  });

  it('cannot UPDATE, DELETE or TRUNCATE the audit trail', async () => {
    expect(await refusal(`UPDATE audit_events SET action = 'x'`)).toMatch(/permission denied/);
    expect(await refusal(`DELETE FROM audit_events`)).toMatch(/permission denied/);
    expect(await refusal(`TRUNCATE audit_events`)).toMatch(/permission denied/);
    expect(await AuditEvent.count({ where: { workspaceId: workspace.id } })).toBe(3);
  });

  it('cannot switch the triggers off, by table or by replication role', async () => {
    expect(await refusal(`ALTER TABLE audit_events DISABLE TRIGGER audit_events_link`)).toMatch(
      /must be owner/,
    );
    expect(await refusal(`ALTER TABLE audit_events DISABLE TRIGGER ALL`)).toMatch(/must be owner/);
    expect(await refusal(`SET session_replication_role = replica`)).toMatch(/permission denied/);
    expect(await refusal(`DROP TRIGGER audit_events_append_only ON audit_events`)).toMatch(
      /must be owner/,
    );
  });

  it('cannot move the chain head or create tables', async () => {
    expect(await refusal(`UPDATE audit_chain_heads SET position = 0`)).toMatch(/permission denied/);
    expect(await refusal(`DELETE FROM audit_chain_heads`)).toMatch(/permission denied/);
    expect(await refusal(`CREATE TABLE public.sneaky (id int)`)).toMatch(/permission denied/);
  });

  it('cannot back-date a row or forge its place in the chain: the database sets them', async () => {
    const before = new Date();
    await database().query(
      `INSERT INTO audit_events (id, workspace_id, action, entity_type, at, chain, position, prev_hash, hash)
       VALUES (gen_random_uuid(), :ws, 'test.backdated', 'test', '2001-01-01T00:00:00Z', 'forged', 1, repeat('a', 64), repeat('b', 64))`,
      { replacements: { ws: workspace.id } },
    );
    const row = await AuditEvent.findOne({ where: { action: 'test.backdated' } });
    expect(row!.at.getTime()).toBeGreaterThanOrEqual(before.getTime() - 1000);
    expect(row!.chain).toBe(workspace.id);
    expect(Number(row!.position)).toBe(4);
    expect(row!.hash).not.toBe('b'.repeat(64));
    expect(await verifyChain(workspace.id)).toEqual({ ok: true, checked: 4 });
  });
});

describe('the hash chain', () => {
  it('stays one unbroken line under concurrent inserts', async () => {
    const workspace = await buildWorkspace();
    await Promise.all(
      Array.from({ length: 24 }, (_, i) =>
        database().transaction(async (transaction) => {
          await recordAudit(auditRow(workspace.id, `test.concurrent.${i}`), transaction);
          await recordAudit(auditRow(workspace.id, `test.concurrent.${i}.b`), transaction);
        }),
      ),
    );
    const rows = await AuditEvent.findAll({
      where: { workspaceId: workspace.id },
      order: [['position', 'ASC']],
    });
    expect(rows.map((r) => Number(r.position))).toEqual(
      Array.from({ length: 48 }, (_, i) => i + 1),
    );
    for (let i = 1; i < rows.length; i += 1) {
      expect(rows[i].prevHash).toBe(rows[i - 1].hash);
      expect(rows[i].at.getTime()).toBeGreaterThanOrEqual(rows[i - 1].at.getTime());
    }
    expect(await verifyChain(workspace.id)).toEqual({ ok: true, checked: 48 });
  });

  it('detects a row edited by the owner behind the server\u2019s back, and names it', async () => {
    const workspace = await buildWorkspace();
    for (let i = 0; i < 5; i += 1) await recordAudit(auditRow(workspace.id), null);
    const third = await AuditEvent.findOne({ where: { workspaceId: workspace.id, position: 3 } });
    await owner.transaction(async (transaction) => {
      await owner.query('ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only', {
        transaction,
      });
      await owner.query(`UPDATE audit_events SET after = '{"n": 42}' WHERE id = :id`, {
        replacements: { id: third!.id },
        transaction,
      });
      await owner.query('ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only', {
        transaction,
      });
    });
    const result = await verifyChain(workspace.id);
    expect(result.ok).toBe(false);
    expect(result.firstBroken).toMatchObject({ id: third!.id, position: 3 });
    expect(result.firstBroken!.reason).toMatch(/changed after it was written/);
  });

  it('detects a re-hashed row by the next link, and removed rows by the gap or the head', async () => {
    const workspace = await buildWorkspace();
    for (let i = 0; i < 4; i += 1) await recordAudit(auditRow(workspace.id), null);
    const tamper = (sql: string) =>
      owner.transaction(async (transaction) => {
        await owner.query('ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only', {
          transaction,
        });
        await owner.query(sql, { replacements: { ws: workspace.id }, transaction });
        await owner.query('ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only', {
          transaction,
        });
      });
    // The last row removed: only the chain head still knows it existed.
    await tamper(`DELETE FROM audit_events WHERE chain = :ws AND position = 4`);
    let result = await verifyChain(workspace.id);
    expect(result).toMatchObject({ ok: false, firstBroken: { position: 3 } });
    expect(result.firstBroken!.reason).toMatch(/newer rows are missing/);
    // A row rewritten with a freshly computed hash: the next row's link no longer matches.
    await tamper(
      `UPDATE audit_events SET after = '{"n": 7}',
         hash = audit_event_digest(prev_hash, id, chain, position, workspace_id, actor_id, action, entity_type, entity_id, before, '{"n": 7}', at)
       WHERE chain = :ws AND position = 2`,
    );
    result = await verifyChain(workspace.id);
    expect(result).toMatchObject({ ok: false, firstBroken: { position: 3 } });
    expect(result.firstBroken!.reason).toMatch(/previous-row hash/);
  });
});

describe('GET /workspaces/{id}/audit, verify and export', () => {
  let workspace: Workspace;
  let other: Workspace;
  let admin: User;
  let chemist: User;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    other = await buildWorkspace();
    admin = await buildMember(workspace, ['admin']);
    chemist = await buildMember(workspace, ['chemist']);
    await buildMember(other, ['admin'], { email: `outsider-${workspace.id}@example.com` });
  });

  it('requires authentication', async () => {
    expect((await request(server.app).get(`/api/v1/workspaces/${workspace.id}/audit`)).status).toBe(
      401,
    );
  });

  it('lists changes and account events with actor, time and values; filters and pages', async () => {
    const chemistSession = await signIn(server.app, chemist.email);
    // A wrong password first: a failed sign-in is an account event of this member.
    await request(server.app)
      .post('/api/v1/session')
      .send({ email: chemist.email, password: 'not-the-password' });
    const created = await chemistSession.agent
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('X-CSRF-Token', chemistSession.csrfToken)
      .send({ name: '=HYPERLINK("http://example.invalid","click") (invented)' });
    expect(created.status).toBe(201);
    await chemistSession.agent
      .patch(`/api/v1/workspaces/${workspace.id}/routes/${created.body.id}`)
      .set('X-CSRF-Token', chemistSession.csrfToken)
      .send({ name: 'Renamed route (invented)', baseVersion: 1 });
    await chemistSession.agent
      .delete('/api/v1/session')
      .set('X-CSRF-Token', chemistSession.csrfToken);

    const adminSession = await signIn(server.app, admin.email);
    const all = await adminSession.agent.get(`/api/v1/workspaces/${workspace.id}/audit`);
    expect(all.status).toBe(200);
    const page = auditListSchema.parse(all.body);
    const actions = page.items.map((e) => e.action);
    for (const action of [
      'session.signed_in',
      'session.sign_in_failed',
      'route.create',
      'route.rename',
      'session.signed_out',
    ])
      expect(actions).toContain(action);
    const rename = page.items.find((e) => e.action === 'route.rename')!;
    expect(rename).toMatchObject({
      actor: { id: chemist.id, email: chemist.email },
      entityType: 'route',
      entityId: created.body.id,
      before: { name: '=HYPERLINK("http://example.invalid","click") (invented)' },
      after: { name: 'Renamed route (invented)' },
      chain: workspace.id,
    });
    // Newest first, by the database clock.
    const times = page.items.map((e) => Date.parse(e.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);

    const filtered = await adminSession.agent
      .get(`/api/v1/workspaces/${workspace.id}/audit`)
      .query({ entityType: 'route', entityId: created.body.id });
    expect(filtered.body.items.map((e: { action: string }) => e.action).sort()).toEqual([
      'route.create',
      'route.rename',
    ]);
    const byActor = await adminSession.agent
      .get(`/api/v1/workspaces/${workspace.id}/audit`)
      .query({ actorId: admin.id });
    expect(
      byActor.body.items.every((e: { actor: { id: string } }) => e.actor.id === admin.id),
    ).toBe(true);
    const future = await adminSession.agent
      .get(`/api/v1/workspaces/${workspace.id}/audit`)
      .query({ from: '2999-01-01' });
    expect(future.body).toEqual({ items: [], nextCursor: null });

    // Paging: two at a time covers the same events as one page, without repeats.
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const reply: request.Response = await adminSession.agent
        .get(`/api/v1/workspaces/${workspace.id}/audit`)
        .query({ limit: 2, ...(cursor ? { cursor } : {}) });
      expect(reply.status).toBe(200);
      expect(reply.body.items.length).toBeLessThanOrEqual(2);
      seen.push(...reply.body.items.map((e: { id: string }) => e.id));
      cursor = reply.body.nextCursor;
    } while (cursor);
    expect(seen).toEqual(page.items.map((e) => e.id));

    const bad = await adminSession.agent
      .get(`/api/v1/workspaces/${workspace.id}/audit`)
      .query({ limit: 500, from: 'yesterday' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'query.from',
      'query.limit',
    ]);
  });

  it('exports CSV with spreadsheet formulas neutralised', async () => {
    const adminSession = await signIn(server.app, admin.email);
    const reply = await adminSession.agent
      .get(`/api/v1/workspaces/${workspace.id}/audit/export.csv`)
      .query({ entityType: 'route' });
    expect(reply.status).toBe(200);
    expect(reply.headers['content-type']).toMatch(/text\/csv/);
    expect(reply.headers['content-disposition']).toMatch(/attachment; filename="?audit-trail-/);
    const lines = reply.text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'at_utc,actor,actor_email,action,entity_type,entity_id,old_value,new_value,chain,position,hash,event_id',
    );
    expect(lines).toHaveLength(3);
    // The JSON cell starts with "{", so it is safe; a cell of the bare name would start with "=".
    expect(reply.text).not.toMatch(/(^|,)"?=HYPERLINK/m);
  });

  it('verifies the chain for admins', async () => {
    const adminSession = await signIn(server.app, admin.email);
    const reply = await adminSession.agent.get(`/api/v1/workspaces/${workspace.id}/audit/verify`);
    expect(reply.status).toBe(200);
    const result = auditVerifySchema.parse(reply.body);
    expect(result.ok).toBe(true);
    expect(result.checked).toBeGreaterThan(3);
  });

  it('is for admins: 403 for other roles, 404 for another workspace', async () => {
    const chemistSession = await signIn(server.app, chemist.email, DEFAULT_PASSWORD);
    for (const path of ['audit', 'audit/verify', 'audit/export.csv'])
      expect(
        (await chemistSession.agent.get(`/api/v1/workspaces/${workspace.id}/${path}`)).status,
      ).toBe(403);
    const outsider = await signIn(server.app, `outsider-${workspace.id}@example.com`);
    for (const path of ['audit', 'audit/verify', 'audit/export.csv'])
      expect((await outsider.agent.get(`/api/v1/workspaces/${workspace.id}/${path}`)).status).toBe(
        404,
      );
  });
});
