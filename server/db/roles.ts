/**
 * Two database roles: the owner (owns the schema, runs migrations) and the
 * server's own role (reads and writes data, owns nothing). The server role
 * may only INSERT and SELECT on the audit trail, so a compromised or buggy
 * server can neither rewrite nor back-date history: UPDATE, DELETE and
 * TRUNCATE are not granted, and switching the trigger off needs ownership.
 */
import { QueryTypes, Sequelize } from 'sequelize';

/** Tables the server role reaches only as listed here (everything else: full DML). */
const RESTRICTED_TABLES = {
  audit_events: 'SELECT, INSERT',
  audit_chain_heads: 'SELECT',
  route_revisions: 'SELECT, INSERT',
  review_decisions: 'SELECT, INSERT',
  SequelizeMeta: 'SELECT',
  SequelizeData: 'SELECT',
} as const;

/** A connection as the given role, without the application's models bound to it. */
export function openRoleConnection(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, { dialect: 'postgres', logging: false, pool: { max: 2 } });
}

export function roleNameOf(databaseUrl: string): string {
  const user = decodeURIComponent(new URL(databaseUrl).username);
  if (!user) throw new Error('The database URL must name its role (postgres://ROLE@host/db).');
  return user;
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

async function tableExists(owner: Sequelize, schema: string, table: string): Promise<boolean> {
  const rows = await owner.query<{ found: boolean }>(
    'SELECT to_regclass(:name) IS NOT NULL AS found',
    {
      replacements: { name: `${quoteIdent(schema)}.${quoteIdent(table)}` },
      type: QueryTypes.SELECT,
    },
  );
  return rows[0]?.found ?? false;
}

// Arbitrary but fixed: identifies "grants to the server role" among advisory locks.
const GRANT_LOCK_KEY = 724_551_902;

/**
 * Grants the server role what it needs and no more. Runs as the owner after
 * every migration (idempotent), so new tables are covered. Does nothing when
 * both URLs name the same role (a single-role deployment).
 */
export async function grantServerRole(owner: Sequelize, serverUrl: string): Promise<boolean> {
  const server = roleNameOf(serverUrl);
  const [{ current }] = await owner.query<{ current: string }>('SELECT current_user AS current', {
    type: QueryTypes.SELECT,
  });
  if (current === server) return false;
  const role = quoteIdent(server);
  await owner.transaction(async (transaction) => {
    const run = (sql: string) => owner.query(sql, { transaction });
    // Instances starting together would grant at once, and PostgreSQL refuses concurrent
    // changes to one table's privileges ("tuple concurrently updated"): one at a time.
    await run(`SELECT pg_advisory_xact_lock(${GRANT_LOCK_KEY})`);
    await run(`GRANT USAGE ON SCHEMA public TO ${role}`);
    await run(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${role}`);
    await run(`GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${role}`);
    for (const [table, privileges] of Object.entries(RESTRICTED_TABLES)) {
      if (!(await tableExists(owner, 'public', table))) continue;
      await run(`REVOKE ALL ON ${quoteIdent(table)} FROM ${role}`);
      if (privileges) await run(`GRANT ${privileges} ON ${quoteIdent(table)} TO ${role}`);
    }
    const [{ hasJobs }] = await owner.query<{ hasJobs: boolean }>(
      `SELECT EXISTS (SELECT 1 FROM pg_namespace WHERE nspname = 'pgboss') AS "hasJobs"`,
      { type: QueryTypes.SELECT, transaction },
    );
    if (hasJobs) {
      // The job queue: the server sends, fetches, completes and archives jobs; the owner made its tables.
      await run(`GRANT USAGE ON SCHEMA pgboss TO ${role}`);
      await run(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA pgboss TO ${role}`);
      await run(`GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA pgboss TO ${role}`);
    }
  });
  return true;
}

export interface ServerRoleReport {
  name: string;
  superuser: boolean;
  bypassesRowSecurity: boolean;
  ownedObjects: number;
  ownsAuditTrail: boolean;
}

/** What the connected role can do that an ordinary server role should not. */
export async function describeConnectedRole(sequelize: Sequelize): Promise<ServerRoleReport> {
  const [row] = await sequelize.query<ServerRoleReport>(
    `SELECT r.rolname AS name, r.rolsuper AS superuser, r.rolbypassrls AS "bypassesRowSecurity",
            (SELECT count(*)::int FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
              WHERE c.relowner = r.oid AND n.nspname NOT IN ('pg_catalog', 'information_schema')) AS "ownedObjects",
            COALESCE((SELECT c.relowner = r.oid FROM pg_class c WHERE c.oid = to_regclass('public.audit_events')), false) AS "ownsAuditTrail"
       FROM pg_roles r WHERE r.rolname = current_user`,
    { type: QueryTypes.SELECT },
  );
  return row;
}

/** A warning for the start-up log when the server connects with more power than it should. */
export function roleWarning(report: ServerRoleReport): string | null {
  if (report.superuser)
    return `The server connects to PostgreSQL as the superuser "${report.name}": it could rewrite the audit trail. Set DATABASE_URL to an ordinary role and DATABASE_OWNER_URL to the schema owner (see docs/deployment.md).`;
  if (report.ownsAuditTrail || report.ownedObjects > 0)
    return `The server's database role "${report.name}" owns ${report.ownedObjects} tables: it could switch the audit trigger off. Run the server as a role that owns nothing (DATABASE_URL) and migrations as the owner (DATABASE_OWNER_URL).`;
  return null;
}
