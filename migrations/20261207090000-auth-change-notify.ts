import type { MigrationContext } from '../server/db/migrator';

// Each server keeps the sessions it has read (with their users and memberships) in memory for a
// short while and listens on this channel for what to drop (server/auth/session-cache.ts). The
// triggers announce every change, whoever makes it: a sign-out or a password change ending
// sessions, a role change, a removal, a new membership, an account edited or deleted. A rolling
// expiry pushed forward is not announced (the cache keeps the expiry it read and asks the
// database again once that has passed); an expiry moved back is.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.query(`
    CREATE FUNCTION notify_auth_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_TABLE_NAME = 'session' THEN
        PERFORM pg_notify('phasewright_auth_changes', 's:' || OLD.sid);
      ELSIF TG_TABLE_NAME = 'users' THEN
        PERFORM pg_notify('phasewright_auth_changes', 'u:' || OLD.id);
      ELSE
        IF TG_OP <> 'INSERT' THEN
          PERFORM pg_notify('phasewright_auth_changes', 'u:' || OLD.user_id);
        END IF;
        IF TG_OP <> 'DELETE' THEN
          PERFORM pg_notify('phasewright_auth_changes', 'u:' || NEW.user_id);
        END IF;
      END IF;
      RETURN NULL;
    END $$;

    CREATE TRIGGER session_rewritten_notify AFTER UPDATE ON session FOR EACH ROW
      WHEN (OLD.sess::text IS DISTINCT FROM NEW.sess::text OR NEW.expire < OLD.expire) EXECUTE FUNCTION notify_auth_change();
    CREATE TRIGGER session_ended_notify AFTER DELETE ON session FOR EACH ROW
      EXECUTE FUNCTION notify_auth_change();
    CREATE TRIGGER users_changed_notify AFTER UPDATE OR DELETE ON users FOR EACH ROW
      EXECUTE FUNCTION notify_auth_change();
    CREATE TRIGGER memberships_changed_notify AFTER INSERT OR UPDATE OR DELETE ON memberships
      FOR EACH ROW EXECUTE FUNCTION notify_auth_change();
  `);
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`
    DROP TRIGGER IF EXISTS memberships_changed_notify ON memberships;
    DROP TRIGGER IF EXISTS users_changed_notify ON users;
    DROP TRIGGER IF EXISTS session_ended_notify ON session;
    DROP TRIGGER IF EXISTS session_rewritten_notify ON session;
    DROP FUNCTION IF EXISTS notify_auth_change();
  `);
}
