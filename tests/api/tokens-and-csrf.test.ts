import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiTokenListSchema, createdTokenSchema } from '@shared/schemas/tokens';
import { ApiToken, User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

let workspace: Workspace;
let admin: User;
let asAdmin: SignedIn;

beforeAll(async () => {
  workspace = await buildWorkspace();
  admin = await buildMember(workspace, ['admin']);
  asAdmin = await signIn(server.app, admin.email);
});

describe('personal API tokens', () => {
  it('requires authentication', async () => {
    expect((await request(server.app).get('/api/v1/tokens')).status).toBe(401);
    expect((await request(server.app).post('/api/v1/tokens').send({ name: 'x' })).status).toBe(401);
    expect(
      (await request(server.app).delete('/api/v1/tokens/00000000-0000-4000-8000-000000000000'))
        .status,
    ).toBe(401);
  });

  it('creates a token shown once, authenticates Bearer requests without CSRF, and stops working after revoke', async () => {
    const created = await asAdmin.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ name: 'lab script', scope: 'read-write' });
    expect(created.status).toBe(201);
    const { id, token } = createdTokenSchema.parse(created.body);
    const stored = await ApiToken.findByPk(id);
    expect(stored!.tokenHash).not.toContain(token);
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const listed = apiTokenListSchema.parse((await asAdmin.agent.get('/api/v1/tokens')).body);
    const entry = listed.find((t) => t.id === id)!;
    expect(entry.name).toBe('lab script');
    expect(JSON.stringify(listed)).not.toContain(token);

    const bearer = (req: request.Test) => req.set('Authorization', `Bearer ${token}`);
    const who = await bearer(request(server.app).get('/api/v1/session'));
    expect(who.status).toBe(200);
    expect(who.body.user.id).toBe(admin.id);
    expect(who.body.workspaces[0].roles).toEqual(['admin']);

    // A state change with the token and no CSRF header is fine.
    const change = await bearer(
      request(server.app).post(`/api/v1/workspaces/${workspace.id}/invitations`),
    ).send({ email: 'via-token@example.com', roles: ['chemist'] });
    expect(change.status).toBe(201);
    expect((await ApiToken.findByPk(id))!.lastUsedAt).not.toBeNull();

    const revoked = await asAdmin.agent
      .delete(`/api/v1/tokens/${id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken);
    expect(revoked.status).toBe(204);
    const after = await bearer(request(server.app).get('/api/v1/session'));
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('invalid_token');
  });

  it("a token authenticates with that user's roles only", async () => {
    const chemist = await buildMember(workspace, ['chemist']);
    const asChemist = await signIn(server.app, chemist.email);
    const { token } = (
      await asChemist.agent
        .post('/api/v1/tokens')
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send({ name: 'chemist script' })
    ).body;
    const response = await request(server.app)
      .post(`/api/v1/workspaces/${workspace.id}/invitations`)
      .set('Authorization', `Bearer ${token}`)
      .send({ email: 'x@example.com', roles: ['chemist'] });
    expect(response.status).toBe(403);
  });

  it("another user's token answers 404 on revoke and keeps working", async () => {
    const other = await buildMember(workspace, ['reviewer']);
    const asOther = await signIn(server.app, other.email);
    const { id, token } = (
      await asOther.agent
        .post('/api/v1/tokens')
        .set('X-CSRF-Token', asOther.csrfToken)
        .send({ name: 'theirs' })
    ).body;
    const response = await asAdmin.agent
      .delete(`/api/v1/tokens/${id}`)
      .set('X-CSRF-Token', asAdmin.csrfToken);
    expect(response.status).toBe(404);
    expect(
      (await request(server.app).get('/api/v1/session').set('Authorization', `Bearer ${token}`))
        .status,
    ).toBe(200);
  });

  it('an unknown Bearer token is a 401', async () => {
    const response = await request(server.app)
      .get('/api/v1/session')
      .set('Authorization', 'Bearer pwt_made-up');
    expect(response.status).toBe(401);
  });
});

describe('CSRF', () => {
  it('refuses a cookie-authenticated state change without X-CSRF-Token (403 csrf_failed)', async () => {
    const response = await asAdmin.agent.post('/api/v1/tokens').send({ name: 'no header' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('csrf_failed');
    expect(await ApiToken.count({ where: { name: 'no header' } })).toBe(0);
  });

  it('refuses a wrong token, and accepts the session token', async () => {
    const wrong = await asAdmin.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', 'x'.repeat(43))
      .send({ name: 'wrong header' });
    expect(wrong.status).toBe(403);
    const right = await asAdmin.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ name: 'right header' });
    expect(right.status).toBe(201);
  });

  it("one session's token does not work for another session", async () => {
    const other = await signIn(server.app, admin.email);
    const response = await asAdmin.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', other.csrfToken)
      .send({ name: 'crossed' });
    expect(response.status).toBe(403);
  });

  it('sign-in itself needs no CSRF token', async () => {
    const response = await asAdmin.agent
      .post('/api/v1/session')
      .send({ email: admin.email, password: 'correct-horse-battery' });
    expect(response.status).toBe(200);
    asAdmin = { ...asAdmin, csrfToken: response.body.csrfToken };
  });
});
