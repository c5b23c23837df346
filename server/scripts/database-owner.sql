-- Hands a database made before the two roles existed to phasewright_owner:
-- every table, sequence, function and type of the public and pgboss schemas
-- (run by the superuser, connected to that database; safe to run again).
REVOKE CREATE ON SCHEMA public FROM PUBLIC;
GRANT CREATE, USAGE ON SCHEMA public TO phasewright_owner;
DO $$
DECLARE
  r record;
BEGIN
  IF EXISTS (SELECT 1 FROM pg_namespace WHERE nspname = 'pgboss') THEN
    ALTER SCHEMA pgboss OWNER TO phasewright_owner;
  END IF;
  FOR r IN
    SELECT n.nspname, c.relname, c.relkind
      FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
     WHERE n.nspname IN ('public', 'pgboss') AND c.relkind IN ('r', 'p', 'v', 'm', 'S')
       AND pg_get_userbyid(c.relowner) <> 'phasewright_owner'
       -- a sequence that belongs to a column moves with its table
       AND NOT (c.relkind = 'S' AND EXISTS (
             SELECT 1 FROM pg_depend d WHERE d.objid = c.oid AND d.deptype IN ('a', 'i')))
  LOOP
    EXECUTE format('ALTER %s %I.%I OWNER TO phasewright_owner',
      CASE r.relkind WHEN 'S' THEN 'SEQUENCE' WHEN 'v' THEN 'VIEW'
                     WHEN 'm' THEN 'MATERIALIZED VIEW' ELSE 'TABLE' END,
      r.nspname, r.relname);
  END LOOP;
  FOR r IN
    SELECT p.oid::regprocedure AS signature
      FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
     WHERE n.nspname IN ('public', 'pgboss') AND pg_get_userbyid(p.proowner) <> 'phasewright_owner'
  LOOP
    EXECUTE format('ALTER ROUTINE %s OWNER TO phasewright_owner', r.signature);
  END LOOP;
  FOR r IN
    SELECT n.nspname, t.typname
      FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
     WHERE n.nspname IN ('public', 'pgboss') AND t.typtype IN ('e', 'd')
       AND pg_get_userbyid(t.typowner) <> 'phasewright_owner'
  LOOP
    EXECUTE format('ALTER TYPE %I.%I OWNER TO phasewright_owner', r.nspname, r.typname);
  END LOOP;
END $$;
