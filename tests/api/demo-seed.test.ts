import { describe, expect, it } from 'vitest';
import { database } from '../../server/db/sequelize';
import { runMigrations, runSeeders } from '../../server/db/migrator';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useTestServer } from '../support/app';
import { signIn } from '../support/factories';

const server = useTestServer();

describe('migrations and the demo seed', () => {
  it('migrations are recorded and do not run twice', async () => {
    expect(await runMigrations(database())).toEqual([]);
  });

  it('refuses to seed in production', async () => {
    await expect(runSeeders(database(), 'production')).rejects.toThrow(/production/);
  });

  it('seeds the invented demo once: two workspaces, the five demo accounts, isolated from each other', async () => {
    expect(await runSeeders(database(), 'test')).toEqual(['20261201000000-demo-workspaces.ts']);
    expect(await runSeeders(database(), 'test')).toEqual([]);

    const chemist = await signIn(server.app, 'chemist@example.com', DEMO_PASSWORD);
    expect(chemist.session.workspaces).toEqual([
      expect.objectContaining({ name: 'Demo process group (invented)', roles: ['chemist'] }),
    ]);
    const demoId = chemist.session.workspaces[0].id;
    const members = (await chemist.agent.get(`/api/v1/workspaces/${demoId}/members`)).body as { email: string; roles: string[] }[];
    expect(Object.fromEntries(members.map((m) => [m.email, m.roles]))).toEqual({
      'admin@example.com': ['admin'],
      'chemist@example.com': ['chemist'],
      'engineer@example.com': ['engineer'],
      'reviewer@example.com': ['reviewer'],
    });

    const other = await signIn(server.app, 'other@example.com', DEMO_PASSWORD);
    expect(other.session.workspaces).toEqual([expect.objectContaining({ name: 'Second site (invented)', roles: ['chemist'] })]);
    expect((await other.agent.get(`/api/v1/workspaces/${demoId}/members`)).status).toBe(404);
  });
});
