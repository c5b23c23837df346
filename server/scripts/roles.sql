-- The two roles of a local cluster, created once by the superuser:
--   phasewright_owner  owns the schema and runs the migrations
--   phasewright_app    the server's own role: owns nothing, granted only what it needs
-- (Run by `npm start`, `npm run dev` and the test setup; safe to run again.)
DO $$
BEGIN
  BEGIN
    CREATE ROLE phasewright_owner LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOBYPASSRLS;
  EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL;
  END;
  BEGIN
    CREATE ROLE phasewright_app LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOBYPASSRLS;
  EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL;
  END;
END $$;
