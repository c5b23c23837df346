import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { outboxMessageListSchema } from '@shared/schemas/outbox';
import type { User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildMembership, buildWorkspace, signIn } from '../support/factories';
import { waitForMail } from '../support/mail';

const server = useTestServer();

describe('GET /api/v1/outbox', () => {
  let admin: User;
  let chemist: User;
  let workspace: Workspace;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    admin = await buildMember(workspace, ['admin']);
    chemist = await buildMember(workspace, ['chemist']);
  });

  it('requires authentication', async () => {
    expect((await request(server.app).get('/api/v1/outbox')).status).toBe(401);
  });

  it('is for admins: 403 for a chemist', async () => {
    const { agent } = await signIn(server.app, chemist.email);
    const response = await agent.get('/api/v1/outbox');
    expect(response.status).toBe(403);
  });

  it('shows the mail of the admin’s own workspace, newest first', async () => {
    const before = new Date();
    await request(server.app).post('/api/v1/password-resets').send({ email: chemist.email });
    await request(server.app).post('/api/v1/password-resets').send({ email: admin.email });
    await waitForMail(chemist.email, { after: before });
    await waitForMail(admin.email, { after: before });
    const { agent } = await signIn(server.app, admin.email);
    const response = await agent.get('/api/v1/outbox');
    expect(response.status).toBe(200);
    const messages = outboxMessageListSchema.parse(response.body);
    const ours = messages.filter((m) => m.to === admin.email || m.to === chemist.email);
    expect(ours).toHaveLength(2);
    const times = messages.map((m) => Date.parse(m.receivedAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(ours[0].subject).toBe('Reset your Phasewright password');
  });

  it('never shows another workspace’s mail: reset links and invitations of other groups stay hidden', async () => {
    const elsewhere = await buildWorkspace();
    const stranger = await buildMember(elsewhere, ['chemist']);
    const otherAdmin = await buildMember(elsewhere, ['admin']);
    // Someone in both groups: their reset link would open the other group too.
    const both = await buildMember(elsewhere, ['chemist']);
    await buildMembership(both, workspace, ['chemist']);
    const before = new Date();
    await request(server.app).post('/api/v1/password-resets').send({ email: stranger.email });
    await request(server.app).post('/api/v1/password-resets').send({ email: both.email });
    const asOtherAdmin = await signIn(server.app, otherAdmin.email);
    await asOtherAdmin.agent
      .post(`/api/v1/workspaces/${elsewhere.id}/invitations`)
      .set('X-CSRF-Token', asOtherAdmin.csrfToken)
      .send({ email: 'newcomer-elsewhere@example.com', roles: ['chemist'] });
    await waitForMail(stranger.email, { after: before });
    await waitForMail(both.email, { after: before });
    await waitForMail('newcomer-elsewhere@example.com', { after: before });

    const { agent } = await signIn(server.app, admin.email);
    const mine = outboxMessageListSchema.parse((await agent.get('/api/v1/outbox')).body);
    const recipients = mine.map((m) => m.to);
    expect(recipients).not.toContain(stranger.email);
    expect(recipients).not.toContain(both.email);
    expect(recipients).not.toContain('newcomer-elsewhere@example.com');
    expect(
      mine.some(
        (m) =>
          m.text.includes('/reset-password/') && m.to !== admin.email && m.to !== chemist.email,
      ),
    ).toBe(false);

    // The other group's admin sees their own group's mail, and not the shared member's link.
    const theirs = outboxMessageListSchema.parse(
      (await asOtherAdmin.agent.get('/api/v1/outbox')).body,
    );
    const theirRecipients = theirs.map((m) => m.to);
    expect(theirRecipients).toContain(stranger.email);
    expect(theirRecipients).toContain('newcomer-elsewhere@example.com');
    expect(theirRecipients).not.toContain(both.email);
    expect(theirRecipients).not.toContain(chemist.email);
  });

  it('does not exist in production (404)', async () => {
    const production = server.anotherApp({ ...server.config, outboxEnabled: false });
    const { agent } = await signIn(production, admin.email);
    const response = await agent.get('/api/v1/outbox');
    expect(response.status).toBe(404);
  });
});
