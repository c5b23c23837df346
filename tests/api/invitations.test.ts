import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { invitationInfoSchema, pendingInvitationListSchema } from '@shared/schemas/members';
import { sessionSchema } from '@shared/schemas/session';
import { AuditEvent, Invitation, User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import {
  buildMember,
  buildWorkspace,
  DEFAULT_PASSWORD,
  signIn,
  type SignedIn,
} from '../support/factories';
import { tokenFromLink, waitForMail } from '../support/mail';

const server = useTestServer();

describe('invitations', () => {
  let workspace: Workspace;
  let admin: User;
  let asAdmin: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace({ name: 'Pilot plant group (invented)' });
    admin = await buildMember(workspace, ['admin'], { name: 'Inviting Admin' });
    asAdmin = await signIn(server.app, admin.email);
  });

  const invite = (body: object, as: SignedIn = asAdmin) =>
    as.agent
      .post(`/api/v1/workspaces/${workspace.id}/invitations`)
      .set('X-CSRF-Token', as.csrfToken)
      .send(body);

  it('requires authentication', async () => {
    const response = await request(server.app)
      .post(`/api/v1/workspaces/${workspace.id}/invitations`)
      .send({ email: 'a@example.com', roles: ['chemist'] });
    expect(response.status).toBe(401);
  });

  it('only admins may invite (403 for a chemist)', async () => {
    const chemist = await buildMember(workspace, ['chemist']);
    const asChemist = await signIn(server.app, chemist.email);
    const response = await invite({ email: 'someone@example.com', roles: ['chemist'] }, asChemist);
    expect(response.status).toBe(403);
  });

  it('end to end: invite, read the e-mail from the SMTP fake, open the link, accept, and be signed in', async () => {
    const before = new Date();
    const response = await invite({
      email: 'New.Chemist@Example.com',
      roles: ['chemist', 'reviewer'],
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      email: 'new.chemist@example.com',
      roles: ['chemist', 'reviewer'],
    });

    const mail = await waitForMail('new.chemist@example.com', { after: before });
    expect(mail.subject).toBe('You are invited to Pilot plant group (invented) on Phasewright');
    expect(mail.text).toContain('Inviting Admin invited you');
    expect(mail.text).toContain('http://app.test/invitations/');
    expect(mail.html).toContain('Accept the invitation');
    const token = tokenFromLink(mail.text, 'invitations');

    const info = await request(server.app).get(`/api/v1/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(invitationInfoSchema.parse(info.body)).toMatchObject({
      workspaceName: 'Pilot plant group (invented)',
      email: 'new.chemist@example.com',
      roles: ['chemist', 'reviewer'],
      existingUser: false,
    });

    const agent = request.agent(server.app);
    const accepted = await agent
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ name: 'New Chemist', password: 'a-long-new-password' });
    expect(accepted.status).toBe(200);
    const session = sessionSchema.parse(accepted.body);
    expect(session.user).toMatchObject({ email: 'new.chemist@example.com', name: 'New Chemist' });
    expect(session.workspaces).toEqual([
      expect.objectContaining({ id: workspace.id, roles: ['chemist', 'reviewer'] }),
    ]);
    expect((await agent.get(`/api/v1/workspaces/${workspace.id}/members`)).status).toBe(200);

    // Single use.
    const reused = await request(server.app).get(`/api/v1/invitations/${token}`);
    expect(reused.status).toBe(410);
    expect(reused.body.error.code).toBe('invitation_used');
    const reaccept = await request(server.app)
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ name: 'Again', password: 'a-long-new-password' });
    expect(reaccept.status).toBe(410);

    // The new password works for a normal sign-in.
    await signIn(server.app, 'new.chemist@example.com', 'a-long-new-password');
  });

  it('an existing account joins with its own password', async () => {
    const elsewhere = await buildWorkspace();
    const existing = await buildMember(elsewhere, ['chemist']);
    const before = new Date();
    expect((await invite({ email: existing.email, roles: ['engineer'] })).status).toBe(201);
    const token = tokenFromLink(
      (await waitForMail(existing.email, { after: before })).text,
      'invitations',
    );
    const info = await request(server.app).get(`/api/v1/invitations/${token}`);
    expect(info.body.existingUser).toBe(true);

    const wrong = await request(server.app)
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ password: 'not-my-password' });
    expect(wrong.status).toBe(401);
    const accepted = await request(server.app)
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ password: DEFAULT_PASSWORD });
    expect(accepted.status).toBe(200);
    expect(accepted.body.workspaces.map((w: { id: string }) => w.id).sort()).toEqual(
      [workspace.id, elsewhere.id].sort(),
    );
  });

  it('a new person must give a name', async () => {
    const before = new Date();
    await invite({ email: 'nameless@example.com', roles: ['chemist'] });
    const token = tokenFromLink(
      (await waitForMail('nameless@example.com', { after: before })).text,
      'invitations',
    );
    const response = await request(server.app)
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ password: 'a-long-new-password' });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([{ path: 'name', message: 'Enter a name.' }]);
  });

  it('an expired invitation answers 410 and an unknown one 404', async () => {
    const before = new Date();
    await invite({ email: 'late@example.com', roles: ['chemist'] });
    const token = tokenFromLink(
      (await waitForMail('late@example.com', { after: before })).text,
      'invitations',
    );
    await Invitation.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { email: 'late@example.com' } },
    );
    const expired = await request(server.app).get(`/api/v1/invitations/${token}`);
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('invitation_expired');
    const unknown = await request(server.app).get(
      '/api/v1/invitations/this-token-does-not-exist-anywhere',
    );
    expect(unknown.status).toBe(404);
  });

  it('refuses to invite someone who is already a member (409)', async () => {
    const response = await invite({ email: admin.email, roles: ['chemist'] });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('already_member');
  });

  it('validates the invitation payload with every field path', async () => {
    const response = await invite({ email: 'nope', roles: [] });
    expect(response.status).toBe(400);
    expect(response.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'email',
      'roles',
    ]);
  });

  describe('pending invitations: list, resend, revoke', () => {
    const base = () => `/api/v1/workspaces/${workspace.id}/invitations`;
    const pending = async (as: SignedIn = asAdmin) =>
      as.agent.get(base()).set('X-CSRF-Token', as.csrfToken);

    it('lists the pending ones with who sent them; resending mails a new link and the old one stops working; revoking ends the link; each leaves an audit entry', async () => {
      const before = new Date();
      const created = await invite({ email: 'pending.one@example.com', roles: ['reviewer'] });
      expect(created.status).toBe(201);
      const firstToken = tokenFromLink(
        (await waitForMail('pending.one@example.com', { after: before })).text,
        'invitations',
      );

      const listed = await pending();
      expect(listed.status).toBe(200);
      const parsed = pendingInvitationListSchema.parse(listed.body);
      const mine = parsed.items.find((i) => i.id === created.body.id);
      expect(mine).toMatchObject({
        email: 'pending.one@example.com',
        roles: ['reviewer'],
        invitedBy: { id: admin.id, name: 'Inviting Admin' },
      });
      // Accepted invitations are not pending.
      expect(parsed.items.some((i) => i.email === 'new.chemist@example.com')).toBe(false);

      const resentAt = new Date();
      const resent = await asAdmin.agent
        .post(`${base()}/${created.body.id}/resend`)
        .set('X-CSRF-Token', asAdmin.csrfToken);
      expect(resent.status).toBe(200);
      expect(Date.parse(resent.body.expiresAt)).toBeGreaterThanOrEqual(
        Date.parse(created.body.expiresAt),
      );
      const secondToken = tokenFromLink(
        (await waitForMail('pending.one@example.com', { after: resentAt })).text,
        'invitations',
      );
      expect(secondToken).not.toBe(firstToken);
      expect((await request(server.app).get(`/api/v1/invitations/${firstToken}`)).status).toBe(404);
      expect((await request(server.app).get(`/api/v1/invitations/${secondToken}`)).status).toBe(
        200,
      );

      const revoked = await asAdmin.agent
        .delete(`${base()}/${created.body.id}`)
        .set('X-CSRF-Token', asAdmin.csrfToken);
      expect(revoked.status).toBe(204);
      const gone = await request(server.app).get(`/api/v1/invitations/${secondToken}`);
      expect(gone.status).toBe(410);
      const after = pendingInvitationListSchema.parse((await pending()).body);
      expect(after.items.some((i) => i.id === created.body.id)).toBe(false);
      // Neither can be done twice: the invitation is no longer pending.
      const again = await asAdmin.agent
        .delete(`${base()}/${created.body.id}`)
        .set('X-CSRF-Token', asAdmin.csrfToken);
      expect(again.status).toBe(404);

      const audit = await AuditEvent.findAll({
        where: { entityId: created.body.id },
        order: [['position', 'ASC']],
      });
      expect(audit.map((a) => a.action)).toEqual([
        'member.invited',
        'member.invitation-resent',
        'member.invitation-revoked',
      ]);
      expect(audit.every((a) => a.actorId === admin.id)).toBe(true);
    });

    it('only admins may list, resend or revoke; another workspace’s invitation is not found', async () => {
      const created = await invite({ email: 'pending.two@example.com', roles: ['chemist'] });
      const chemist = await buildMember(workspace, ['chemist']);
      const asChemist = await signIn(server.app, chemist.email);
      expect((await pending(asChemist)).status).toBe(403);
      const resend = await asChemist.agent
        .post(`${base()}/${created.body.id}/resend`)
        .set('X-CSRF-Token', asChemist.csrfToken);
      expect(resend.status).toBe(403);
      const revoke = await asChemist.agent
        .delete(`${base()}/${created.body.id}`)
        .set('X-CSRF-Token', asChemist.csrfToken);
      expect(revoke.status).toBe(403);

      const other = await buildWorkspace();
      const otherAdmin = await buildMember(other, ['admin']);
      const asOther = await signIn(server.app, otherAdmin.email);
      const foreign = await asOther.agent
        .delete(`/api/v1/workspaces/${other.id}/invitations/${created.body.id}`)
        .set('X-CSRF-Token', asOther.csrfToken);
      expect(foreign.status).toBe(404);
      expect(
        pendingInvitationListSchema.parse((await pending()).body).items.map((i) => i.id),
      ).toContain(created.body.id);
    });
  });
});
