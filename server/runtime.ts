import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config';
import { closeDatabase, connectDatabase } from './db/sequelize';
import { runMigrations, runSeeders, type SeedResult } from './db/migrator';
import {
  describeConnectedRole,
  grantServerRole,
  openRoleConnection,
  roleWarning,
} from './db/roles';
import { prepareJobQueue, startJobQueue, stopJobQueue } from './services/jobs';
import type { MailSettings } from './services/mail';
import { startSmtpFake, type SmtpFake } from './services/smtp-fake';
import { startWorkers } from './services/workers';
import { startEnginePool, stopEnginePool, type EnginePool } from './pool';

export interface Runtime {
  sequelize: Sequelize;
  mail: MailSettings;
  smtpFake: SmtpFake | null;
  /** What the demo seed ran and the sign-ins it made; null when the demo is not seeded. */
  seeded: SeedResult | null;
  pool: EnginePool;
  close(): Promise<void>;
}

/**
 * Everything the app needs besides HTTP: the database (migrated, and seeded
 * when asked), the mail fake when no SMTP server is configured, the job queue
 * and its workers. Shared by server start-up and the API tests.
 */
export async function startRuntime(config: AppConfig): Promise<Runtime> {
  const pool = startEnginePool(config.pool);
  const sequelize = connectDatabase(config.databaseUrl, config.databasePool.max);
  // Schema work runs as the owner; the server itself connects as a role that owns nothing.
  const owner = openRoleConnection(config.databaseOwnerUrl);
  let seeded: SeedResult | null = null;
  try {
    await runMigrations(owner);
    await prepareJobQueue(config.databaseOwnerUrl);
    await grantServerRole(owner, config.databaseUrl);
    if (config.seedDemo) seeded = await runSeeders(owner, config.env);
  } finally {
    await owner.close();
  }
  const warning = roleWarning(await describeConnectedRole(sequelize));
  if (warning && config.env !== 'test') console.warn(`[database] ${warning}`);
  const smtpFake = config.smtpUrl ? null : await startSmtpFake(config.smtpFakePort);
  const mail: MailSettings = {
    smtpUrl: config.smtpUrl ?? smtpFake!.url,
    from: config.mailFrom,
    ignoreTLS: !config.smtpUrl,
    tagWorkspaces: !config.smtpUrl,
  };
  await startJobQueue(config.databaseUrl);
  const stopWorkers = await startWorkers({
    mail,
    pollSeconds: config.jobPollSeconds,
    staleSeconds: config.jobStaleSeconds,
  });
  return {
    sequelize,
    mail,
    smtpFake,
    seeded,
    pool,
    close: async () => {
      // Workers first (they may be using the mail fake and the engine pool), the database last.
      await stopWorkers().catch(() => undefined);
      await stopJobQueue().catch(() => undefined);
      await stopEnginePool().catch(() => undefined);
      await smtpFake?.close();
      await closeDatabase();
    },
  };
}
