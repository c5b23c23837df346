import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage, PasswordReset, User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD, signIn } from '../support/factories';
import { tokenFromLink, waitForMail } from '../support/mail';

const server = useTestServer();

describe('password reset', () => {
  let workspace: Workspace;
  let user: User;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    user = await buildMember(workspace, ['chemist'], { name: 'Forgetful Chemist' });
  });

  it('end to end: request, read the link from the SMTP fake, set a new password; the old one stops working', async () => {
    const existingSession = await signIn(server.app, user.email);
    const before = new Date();
    const requested = await request(server.app)
      .post('/api/v1/password-resets')
      .send({ email: user.email.toUpperCase() });
    expect(requested.status).toBe(202);

    const mail = await waitForMail(user.email, {
      after: before,
      subject: /Reset your Phasewright password/,
    });
    expect(mail.text).toContain('Hello Forgetful Chemist');
    expect(mail.text).toContain('http://app.test/reset-password/');
    const token = tokenFromLink(mail.text, 'reset-password');

    const done = await request(server.app)
      .post(`/api/v1/password-resets/${token}`)
      .send({ password: 'brand-new-password' });
    expect(done.status).toBe(204);

    const old = await request(server.app)
      .post('/api/v1/session')
      .send({ email: user.email, password: DEFAULT_PASSWORD });
    expect(old.status).toBe(401);
    await signIn(server.app, user.email, 'brand-new-password');
    // Sessions opened before the reset are ended.
    expect((await existingSession.agent.get('/api/v1/session')).status).toBe(401);

    // Single use.
    const again = await request(server.app)
      .post(`/api/v1/password-resets/${token}`)
      .send({ password: 'another-new-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('reset_used');
  });

  it('answers 202 for an unknown address and sends nothing (no account enumeration)', async () => {
    const response = await request(server.app)
      .post('/api/v1/password-resets')
      .send({ email: 'ghost@example.com' });
    expect(response.status).toBe(202);
    expect(response.body).toEqual({});
    expect(
      await PasswordReset.count({
        include: [{ model: User, as: 'user', where: { email: 'ghost@example.com' } }],
      }),
    ).toBe(0);
    // Give the worker a moment: a mail would arrive within this time if one had been queued.
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    expect(await OutboxMessage.count({ where: { to: 'ghost@example.com' } })).toBe(0);
  });

  it('an expired link answers 410 and an unknown one 404', async () => {
    const before = new Date();
    await request(server.app).post('/api/v1/password-resets').send({ email: user.email });
    const token = tokenFromLink(
      (await waitForMail(user.email, { after: before })).text,
      'reset-password',
    );
    await PasswordReset.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { userId: user.id, usedAt: null } },
    );
    const expired = await request(server.app)
      .post(`/api/v1/password-resets/${token}`)
      .send({ password: 'brand-new-password-2' });
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('reset_expired');
    const unknown = await request(server.app)
      .post('/api/v1/password-resets/no-such-token-at-all-here')
      .send({ password: 'brand-new-password-2' });
    expect(unknown.status).toBe(404);
  });

  it('links expire after one hour', async () => {
    const before = Date.now();
    await request(server.app).post('/api/v1/password-resets').send({ email: user.email });
    const reset = await PasswordReset.findOne({
      where: { userId: user.id },
      order: [['createdAt', 'DESC']],
    });
    const minutes = (reset!.expiresAt.getTime() - before) / 60_000;
    expect(minutes).toBeGreaterThan(59);
    expect(minutes).toBeLessThanOrEqual(60.1);
  });

  it('a new password shorter than 10 characters is refused with its field path', async () => {
    const response = await request(server.app)
      .post('/api/v1/password-resets/some-token-that-is-long-enough')
      .send({ password: 'short' });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([
      { path: 'password', message: 'Use at least 10 characters.' },
    ]);
  });
});

describe('change password', () => {
  it('requires authentication', async () => {
    const response = await request(server.app)
      .post('/api/v1/account/password')
      .send({ currentPassword: 'x', newPassword: 'long-enough-pass' });
    expect(response.status).toBe(401);
  });

  it('checks the current password and then replaces it', async () => {
    const workspace = await buildWorkspace();
    const user = await buildMember(workspace, ['engineer']);
    const { agent, csrfToken } = await signIn(server.app, user.email);
    const wrong = await agent
      .post('/api/v1/account/password')
      .set('X-CSRF-Token', csrfToken)
      .send({ currentPassword: 'not-it', newPassword: 'changed-password-1' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details).toEqual([
      { path: 'currentPassword', message: 'The current password is incorrect.' },
    ]);

    const changed = await agent
      .post('/api/v1/account/password')
      .set('X-CSRF-Token', csrfToken)
      .send({ currentPassword: DEFAULT_PASSWORD, newPassword: 'changed-password-1' });
    expect(changed.status).toBe(204);
    expect(
      (
        await request(server.app)
          .post('/api/v1/session')
          .send({ email: user.email, password: DEFAULT_PASSWORD })
      ).status,
    ).toBe(401);
    await signIn(server.app, user.email, 'changed-password-1');
  });
});
