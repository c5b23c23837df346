import { Op } from 'sequelize';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { memberListSchema } from '@shared/schemas/members';
import { AppError } from '../../server/errors';
import { database } from '../../server/db/sequelize';
import { AuditEvent, Membership, User, Workspace } from '../../server/models';
import { loadMembership, updateRoles } from '../../server/services/members';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

describe('workspace members', () => {
  let workspace: Workspace;
  let otherWorkspace: Workspace;
  let admin: User;
  let chemist: User;
  let reviewer: User;
  let outsider: User;
  let asAdmin: SignedIn;
  let asChemist: SignedIn;
  let asOutsider: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    otherWorkspace = await buildWorkspace();
    admin = await buildMember(workspace, ['admin']);
    chemist = await buildMember(workspace, ['chemist']);
    reviewer = await buildMember(workspace, ['reviewer', 'engineer']);
    outsider = await buildMember(otherWorkspace, ['admin', 'chemist']);
    asAdmin = await signIn(server.app, admin.email);
    asChemist = await signIn(server.app, chemist.email);
    asOutsider = await signIn(server.app, outsider.email);
  });

  const membersPath = () => `/api/v1/workspaces/${workspace.id}/members`;

  it('requires authentication', async () => {
    expect((await request(server.app).get(membersPath())).status).toBe(401);
    expect(
      (
        await request(server.app)
          .patch(`${membersPath()}/${chemist.id}`)
          .send({ roles: ['admin'] })
      ).status,
    ).toBe(401);
    expect((await request(server.app).delete(`${membersPath()}/${chemist.id}`)).status).toBe(401);
    expect(
      (
        await request(server.app)
          .post(`/api/v1/workspaces/${workspace.id}/invitations`)
          .send({ email: 'x@example.com', roles: ['chemist'] })
      ).status,
    ).toBe(401);
  });

  it('lists members with their roles for any member', async () => {
    const response = await asChemist.agent.get(membersPath());
    expect(response.status).toBe(200);
    const members = memberListSchema.parse(response.body).items;
    expect(members.map((m) => m.userId).sort()).toEqual([admin.id, chemist.id, reviewer.id].sort());
    expect(members.find((m) => m.userId === reviewer.id)!.roles).toEqual(['reviewer', 'engineer']);
  });

  it("answers 404 for another workspace's members, the same as for a workspace that does not exist", async () => {
    const foreign = await asOutsider.agent.get(membersPath());
    expect(foreign.status).toBe(404);
    const missing = await asOutsider.agent.get(
      '/api/v1/workspaces/00000000-0000-4000-8000-000000000000/members',
    );
    expect(missing.status).toBe(404);
    expect(foreign.body).toEqual(missing.body);
  });

  it('forbids a chemist to change roles or remove members (403)', async () => {
    const patch = await asChemist.agent
      .patch(`${membersPath()}/${reviewer.id}`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ roles: ['chemist'] });
    expect(patch.status).toBe(403);
    expect(patch.body.error.code).toBe('forbidden');
    const remove = await asChemist.agent
      .delete(`${membersPath()}/${reviewer.id}`)
      .set('X-CSRF-Token', asChemist.csrfToken);
    expect(remove.status).toBe(403);
  });

  it("answers 404 when an admin of another workspace tries to change this workspace's members", async () => {
    const response = await asOutsider.agent
      .patch(`${membersPath()}/${chemist.id}`)
      .set('X-CSRF-Token', asOutsider.csrfToken)
      .send({ roles: ['admin'] });
    expect(response.status).toBe(404);
  });

  it('lets an admin change roles, and records it in the audit trail', async () => {
    const response = await asAdmin.agent
      .patch(`${membersPath()}/${reviewer.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: ['reviewer'] });
    expect(response.status).toBe(200);
    expect(response.body.roles).toEqual(['reviewer']);
    const event = await AuditEvent.findOne({
      where: { action: 'member.roles_changed', actorId: admin.id },
    });
    expect(event?.before).toEqual({ userId: reviewer.id, roles: ['reviewer', 'engineer'] });
    expect(event?.after).toEqual({ userId: reviewer.id, roles: ['reviewer'] });
  });

  it('validates roles: unknown role and empty list give 400 with the field path', async () => {
    const unknown = await asAdmin.agent
      .patch(`${membersPath()}/${reviewer.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: ['chemist', 'wizard'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details).toEqual([expect.objectContaining({ path: 'roles.1' })]);
    const empty = await asAdmin.agent
      .patch(`${membersPath()}/${reviewer.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.details[0].path).toBe('roles');
  });

  it('reports a malformed id in the path as a 400 on params', async () => {
    const response = await asAdmin.agent.get('/api/v1/workspaces/not-a-uuid/members');
    expect(response.status).toBe(400);
    expect(response.body.error.details[0].path).toBe('params.workspaceId');
  });

  it('refuses to demote or remove the last admin (409)', async () => {
    const demote = await asAdmin.agent
      .patch(`${membersPath()}/${admin.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: ['chemist'] });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_admin');
    const remove = await asAdmin.agent
      .delete(`${membersPath()}/${admin.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken);
    expect(remove.status).toBe(409);
  });

  it('of two admins demoting each other at once, one succeeds and the other is refused', async () => {
    const shared = await buildWorkspace();
    const first = await buildMember(shared, ['admin', 'chemist']);
    const second = await buildMember(shared, ['admin', 'chemist']);
    const asFirst = await signIn(server.app, first.email);
    const asSecond = await signIn(server.app, second.email);
    const demote = (as: SignedIn, other: User) =>
      as.agent
        .patch(`/api/v1/workspaces/${shared.id}/members/${other.id}`)
        .set('X-CSRF-Token', as.csrfToken)
        .send({ roles: ['chemist'] });
    const results = await Promise.all([demote(asFirst, second), demote(asSecond, first)]);
    // One wins. The other is refused: as the last admin (409) when the two overlap,
    // or as no longer an admin (403) when the first finished before it began.
    const statuses = results.map((r) => r.status).sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const refused = results.find((r) => r.status !== 200)!;
    if (refused.status === 409) expect(refused.body.error.code).toBe('last_admin');
    const admins = await Membership.count({
      where: { workspaceId: shared.id, roles: { [Op.contains]: ['admin'] } },
    });
    expect(admins).toBe(1);
  });

  it('counts admins only after the workspace is locked, so an interleaved demotion is refused', async () => {
    // The two demotions interleaved by hand, so the order is certain: the first
    // transaction demotes and stays open; the second starts its demotion while
    // the first holds the workspace; the first commits; the second must now see
    // that no other admin remains.
    const shared = await buildWorkspace();
    const first = await buildMember(shared, ['admin']);
    const second = await buildMember(shared, ['admin']);
    // The audit records name someone else as actor, so only the lock under test can order them.
    const recorder = await buildMember(shared, ['chemist']);
    const sequelize = database();
    const t1 = await sequelize.transaction();
    const t2 = await sequelize.transaction();
    try {
      await updateRoles(
        await loadMembership(shared.id, second.id, t1),
        ['chemist'],
        recorder.id,
        t1,
      );
      const target = await loadMembership(shared.id, first.id, t2);
      const { pid } = (await sequelize.query('SELECT pg_backend_pid() AS pid', {
        transaction: t2,
        plain: true,
      })) as { pid: number };
      const waitsOnLock = async (backend: number) =>
        (
          (await sequelize.query(
            'SELECT wait_event_type FROM pg_stat_activity WHERE pid = :backend',
            {
              replacements: { backend },
              plain: true,
            },
          )) as { wait_event_type: string | null } | null
        )?.wait_event_type === 'Lock';
      const racing = updateRoles(target, ['chemist'], recorder.id, t2).then(
        () => 'updated',
        (error: unknown) => error,
      );
      // Commit only once the second demotion is under way: waiting on a lock, or done.
      let settled = false;
      void racing.then(() => (settled = true));
      while (!settled && !(await waitsOnLock(pid))) await new Promise((r) => setImmediate(r));
      await t1.commit();
      const outcome = await racing;
      expect(outcome).toBeInstanceOf(AppError);
      expect((outcome as AppError).body.code).toBe('last_admin');
    } finally {
      await t2.rollback();
      if (!(t1 as unknown as { finished?: string }).finished) await t1.rollback();
    }
    const admins = await Membership.findAll({
      where: { workspaceId: shared.id, roles: { [Op.contains]: ['admin'] } },
    });
    expect(admins.map((m) => m.userId)).toEqual([first.id]);
  });

  it('lets an admin remove a member, who then no longer sees the workspace', async () => {
    const leaving = await buildMember(workspace, ['chemist']);
    const asLeaving = await signIn(server.app, leaving.email);
    const remove = await asAdmin.agent
      .delete(`${membersPath()}/${leaving.id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken);
    expect(remove.status).toBe(204);
    expect(await Membership.count({ where: { userId: leaving.id } })).toBe(0);
    expect((await asLeaving.agent.get(membersPath())).status).toBe(404);
  });

  it('the audit trail cannot be edited or deleted', async () => {
    const event = await AuditEvent.findOne({ where: { actorId: admin.id } });
    expect(event).not.toBeNull();
    await expect(
      AuditEvent.update({ action: 'tampered' }, { where: { id: event!.id } }),
    ).rejects.toThrow(/permission denied/);
    await expect(AuditEvent.destroy({ where: { id: event!.id } })).rejects.toThrow(
      /permission denied/,
    );
  });
});
