import { readdirSync } from 'node:fs';
import { Sequelize } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { database } from '../../server/db/sequelize';
import { runMigrations, runSeeders } from '../../server/db/migrator';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { clusterAdminUrl, ownerDatabaseUrl, useTestServer } from '../support/app';
import { signIn } from '../support/factories';

const server = useTestServer();
const filesIn = (folder: string) =>
  readdirSync(new URL(`../../${folder}/`, import.meta.url))
    .filter((name) => name.endsWith('.ts'))
    .sort();

describe('migrations and the demo seed', () => {
  it('migrations are recorded and do not run twice', async () => {
    expect(await runMigrations(database())).toEqual([]);
  });

  it('refuses to seed in production', async () => {
    await expect(runSeeders(database(), 'production')).rejects.toThrow(/production/);
  });

  it('seeds the invented demo once: two workspaces, the five demo accounts, isolated from each other', async () => {
    // Seeds run as the schema owner, like migrations.
    const owner = new Sequelize(ownerDatabaseUrl(), { dialect: 'postgres', logging: false });
    try {
      const first = await runSeeders(owner, 'test');
      expect(first.applied).toEqual(filesIn('seeders'));
      // The sign-ins printed at start come from the seed run: the five demo accounts it made,
      // also on a later start when nothing is left to seed.
      const signIns = first.signIns.map((s) => s.email).sort();
      expect(signIns).toEqual([
        'admin@example.com',
        'chemist@example.com',
        'engineer@example.com',
        'other@example.com',
        'reviewer@example.com',
      ]);
      expect(new Set(first.signIns.map((s) => s.password))).toEqual(new Set([DEMO_PASSWORD]));
      const again = await runSeeders(owner, 'test');
      expect(again.applied).toEqual([]);
      expect(again.signIns.map((s) => s.email).sort()).toEqual(signIns);
    } finally {
      await owner.close();
    }

    const chemist = await signIn(server.app, 'chemist@example.com', DEMO_PASSWORD);
    expect(chemist.session.workspaces).toEqual([
      expect.objectContaining({ name: 'Demo process group (invented)', roles: ['chemist'] }),
    ]);
    const demoId = chemist.session.workspaces[0].id;
    const members = (await chemist.agent.get(`/api/v1/workspaces/${demoId}/members`)).body
      .items as {
      email: string;
      roles: string[];
    }[];
    expect(Object.fromEntries(members.map((m) => [m.email, m.roles]))).toEqual({
      'admin@example.com': ['admin'],
      'chemist@example.com': ['chemist'],
      'engineer@example.com': ['engineer'],
      'reviewer@example.com': ['reviewer'],
    });

    const other = await signIn(server.app, 'other@example.com', DEMO_PASSWORD);
    expect(other.session.workspaces).toEqual([
      expect.objectContaining({ name: 'Second site (invented)', roles: ['chemist'] }),
    ]);
    expect((await other.agent.get(`/api/v1/workspaces/${demoId}/members`)).status).toBe(404);
  });
});

describe('concurrent start-up', () => {
  it('two servers migrating a fresh database at once: one applies, the other waits and finds nothing to do', async () => {
    const baseUrl = new URL(process.env.DATABASE_URL!);
    const freshName = `${baseUrl.pathname.slice(1)}_fresh`;
    const admin = new Sequelize(clusterAdminUrl(), {
      dialect: 'postgres',
      logging: false,
    });
    await admin.query(`CREATE DATABASE ${freshName}`);
    const connect = () =>
      new Sequelize(clusterAdminUrl(freshName), {
        dialect: 'postgres',
        logging: false,
      });
    const first = connect();
    const second = connect();
    try {
      const results = await Promise.all([runMigrations(first), runMigrations(second)]);
      expect(results.map((names) => names.length).sort((a, b) => a - b)).toEqual([
        0,
        filesIn('migrations').length,
      ]);
    } finally {
      await first.close();
      await second.close();
      await admin.query(`DROP DATABASE IF EXISTS ${freshName} WITH (FORCE)`);
      await admin.close();
    }
  });
});
