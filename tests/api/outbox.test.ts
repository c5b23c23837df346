import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { outboxMessageListSchema } from '@shared/schemas/outbox';
import { User } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn } from '../support/factories';
import { waitForMail } from '../support/mail';

const server = useTestServer();

describe('GET /api/v1/outbox', () => {
  let admin: User;
  let chemist: User;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
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

  it('shows the mail the SMTP fake caught, newest first', async () => {
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

  it('does not exist in production (404)', async () => {
    const production = server.anotherApp({ ...server.config, outboxEnabled: false });
    const { agent } = await signIn(production, admin.email);
    const response = await agent.get('/api/v1/outbox');
    expect(response.status).toBe(404);
  });
});
