import type { MigrationContext, SeedSignIn } from '../server/db/migrator';
import { Membership, User, Workspace } from '../server/models';
import { hashPassword } from '../server/services/passwords';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACES } from './data/demo-accounts';

/**
 * The invented demo: one process group with a chemist, a reviewer, a scale-up
 * engineer and an admin, and a second site with its own chemist to show that
 * workspaces are isolated. Runs once (umzug records it in SequelizeData);
 * findOrCreate also keeps it harmless if the record was lost.
 */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    const workspaceIds = new Map<string, string>();
    for (const ws of DEMO_WORKSPACES) {
      const [workspace] = await Workspace.findOrCreate({
        where: { slug: ws.slug },
        defaults: { name: ws.name, slug: ws.slug },
        transaction,
      });
      workspaceIds.set(ws.key, workspace.id);
    }
    for (const account of DEMO_ACCOUNTS) {
      const [user] = await User.findOrCreate({
        where: { email: account.email },
        defaults: { email: account.email, name: account.name, passwordHash },
        transaction,
      });
      await Membership.findOrCreate({
        where: { userId: user.id, workspaceId: workspaceIds.get(account.workspace)! },
        defaults: {
          userId: user.id,
          workspaceId: workspaceIds.get(account.workspace)!,
          roles: account.roles,
        },
        transaction,
      });
    }
  });
}

/** The demo accounts this seeder made that the seeded database holds, to print at start. */
export async function signIns({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<SeedSignIn[]> {
  const [rows] = (await sequelize.query('SELECT email FROM users WHERE email IN (:emails)', {
    replacements: { emails: DEMO_ACCOUNTS.map((a) => a.email) },
  })) as [Array<{ email: string }>, unknown];
  const present = new Set(rows.map((row) => row.email));
  return DEMO_ACCOUNTS.filter((a) => present.has(a.email)).map((a) => ({
    email: a.email,
    password: DEMO_PASSWORD,
    description: a.description,
  }));
}
