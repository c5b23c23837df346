import type { MigrationContext } from '../server/db/migrator';

/**
 * Saved revisions of a route (immutable snapshots with the server's own
 * evaluation and a content hash), review requests to named reviewers, signed
 * decisions (immutable), comment threads on a revision or one of its steps,
 * and an optimistic version on routes and compounds so a stale PATCH is
 * refused instead of overwriting someone else's change.
 */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE route_revisions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        route_id uuid NOT NULL REFERENCES routes (id) ON DELETE RESTRICT,
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE RESTRICT,
        number integer NOT NULL CHECK (number >= 1),
        message text NOT NULL CHECK (length(btrim(message)) > 0),
        document jsonb NOT NULL,
        result jsonb,
        evaluation_error jsonb,
        totals jsonb,
        engine_version varchar(40) NOT NULL,
        content_hash char(64) NOT NULL,
        draft_version integer NOT NULL,
        author_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        created_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX route_revisions_route_number_key ON route_revisions (route_id, number);

      CREATE TABLE review_requests (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        revision_id uuid NOT NULL REFERENCES route_revisions (id) ON DELETE RESTRICT,
        route_id uuid NOT NULL REFERENCES routes (id) ON DELETE RESTRICT,
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE RESTRICT,
        submitted_by_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        note text NOT NULL DEFAULT '',
        status varchar(20) NOT NULL DEFAULT 'in_review'
          CHECK (status IN ('in_review', 'approved', 'returned', 'superseded')),
        closed_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX review_requests_revision_idx ON review_requests (revision_id, created_at DESC);
      -- At most one open review per revision.
      CREATE UNIQUE INDEX review_requests_open_key ON review_requests (revision_id) WHERE status = 'in_review';

      CREATE TABLE review_request_reviewers (
        review_request_id uuid NOT NULL REFERENCES review_requests (id) ON DELETE RESTRICT,
        reviewer_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        PRIMARY KEY (review_request_id, reviewer_id)
      );
      CREATE INDEX review_request_reviewers_reviewer_idx ON review_request_reviewers (reviewer_id);

      CREATE TABLE review_decisions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        review_request_id uuid NOT NULL REFERENCES review_requests (id) ON DELETE RESTRICT,
        revision_id uuid NOT NULL REFERENCES route_revisions (id) ON DELETE RESTRICT,
        decision varchar(10) NOT NULL CHECK (decision IN ('approve', 'return')),
        signer_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        signer_name varchar(120) NOT NULL,
        signer_email varchar(254) NOT NULL,
        meaning text NOT NULL CHECK (length(btrim(meaning)) > 0),
        reason text,
        content_hash char(64) NOT NULL,
        signed_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        CONSTRAINT review_decisions_return_reason CHECK (decision = 'approve' OR length(btrim(coalesce(reason, ''))) > 0)
      );
      CREATE UNIQUE INDEX review_decisions_one_per_signer ON review_decisions (review_request_id, signer_id);
      CREATE INDEX review_decisions_revision_idx ON review_decisions (revision_id);

      CREATE TABLE review_comments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        revision_id uuid NOT NULL REFERENCES route_revisions (id) ON DELETE RESTRICT,
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE RESTRICT,
        parent_id uuid REFERENCES review_comments (id) ON DELETE RESTRICT,
        step_id varchar(80),
        author_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        body text NOT NULL CHECK (length(btrim(body)) > 0),
        resolved_at timestamptz,
        resolved_by_id uuid REFERENCES users (id) ON DELETE RESTRICT,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX review_comments_revision_idx ON review_comments (revision_id, created_at);

      -- A saved revision and a signed decision never change.
      CREATE FUNCTION refuse_change_of_record() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION '% is a signed or saved record: % refused', TG_TABLE_NAME, TG_OP
          USING ERRCODE = 'insufficient_privilege';
      END;
      $$;
      CREATE TRIGGER route_revisions_immutable BEFORE UPDATE OR DELETE ON route_revisions
        FOR EACH ROW EXECUTE FUNCTION refuse_change_of_record();
      CREATE TRIGGER review_decisions_immutable BEFORE UPDATE OR DELETE ON review_decisions
        FOR EACH ROW EXECUTE FUNCTION refuse_change_of_record();

      ALTER TABLE routes ADD COLUMN version integer NOT NULL DEFAULT 1 CHECK (version >= 1);
      ALTER TABLE compounds ADD COLUMN version integer NOT NULL DEFAULT 1 CHECK (version >= 1);
      `,
      { transaction },
    );
  });
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`
    ALTER TABLE compounds DROP COLUMN IF EXISTS version;
    ALTER TABLE routes DROP COLUMN IF EXISTS version;
    DROP TABLE IF EXISTS review_comments, review_decisions, review_request_reviewers, review_requests, route_revisions CASCADE;
    DROP FUNCTION IF EXISTS refuse_change_of_record();
  `);
}
