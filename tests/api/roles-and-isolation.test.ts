import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/session';
import { User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

// One table of who may do what, checked against the running API for every role
// and for a member of the other workspace.
describe('status codes across roles and workspaces', () => {
  let home: Workspace;
  let away: Workspace;
  let target: User;
  const sessions = new Map<string, SignedIn>();
  const roles: Role[] = ['admin', 'chemist', 'reviewer', 'engineer'];

  beforeAll(async () => {
    home = await buildWorkspace({ name: 'Home group (invented)' });
    away = await buildWorkspace({ name: 'Away group (invented)' });
    target = await buildMember(home, ['chemist']);
    for (const role of roles) {
      const user = await buildMember(home, [role]);
      if (role === 'admin') await buildMember(home, ['admin']); // so demoting tests never hit the last-admin rule
      sessions.set(role, await signIn(server.app, user.email));
    }
    sessions.set('outsider', await signIn(server.app, (await buildMember(away, ['admin'])).email));
  });

  const operations = [
    {
      name: 'list members',
      call: (s: SignedIn) => s.agent.get(`/api/v1/workspaces/${home.id}/members`),
      adminOnly: false,
    },
    {
      name: 'invite',
      call: (s: SignedIn) =>
        s.agent
          .post(`/api/v1/workspaces/${home.id}/invitations`)
          .set('X-CSRF-Token', s.csrfToken)
          .send({ email: `inv-${Math.random()}@example.com`, roles: ['reviewer'] }),
      adminOnly: true,
    },
    {
      name: 'change roles',
      call: (s: SignedIn) =>
        s.agent
          .patch(`/api/v1/workspaces/${home.id}/members/${target.id}`)
          .set('X-CSRF-Token', s.csrfToken)
          .send({ roles: ['chemist'] }),
      adminOnly: true,
    },
  ];

  for (const operation of operations) {
    it(`${operation.name}: 401 signed out`, async () => {
      const anonymous = { agent: request.agent(server.app), csrfToken: '' } as unknown as SignedIn;
      expect((await operation.call(anonymous)).status).toBe(401);
    });
    for (const who of [...roles, 'outsider']) {
      const expected =
        who === 'outsider'
          ? 404
          : operation.adminOnly && who !== 'admin'
            ? 403
            : operation.name === 'invite'
              ? 201
              : 200;
      it(`${operation.name}: ${expected} for ${who}`, async () => {
        const response = await operation.call(sessions.get(who)!);
        expect(response.status).toBe(expected);
      });
    }
  }

  it('the session abilities match what the API allows', async () => {
    const chemist = (await sessions.get('chemist')!.agent.get('/api/v1/session')).body;
    expect(chemist.abilities.workspaces[home.id]).toMatchObject({
      'member.list': true,
      'member.invite': false,
      'member.updateRoles': false,
    });
    expect(chemist.abilities.workspaces[away.id]).toBeUndefined();
    expect(chemist.abilities.global['outbox.read']).toBe(false);
    const admin = (await sessions.get('admin')!.agent.get('/api/v1/session')).body;
    expect(admin.abilities.workspaces[home.id]).toMatchObject({
      'member.invite': true,
      'member.remove': true,
    });
    expect(admin.abilities.global['outbox.read']).toBe(true);
  });
});
