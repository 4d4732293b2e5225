-- Bandgate's two database roles, for an administrator to run once per database (and again at any time: every step is
-- idempotent). `npm start` and `npm test` run it on their local clusters as the postgres superuser; a deployment with
-- its own database runs it as its administrator (see "Database roles" in the README):
--
--   psql "$ADMIN_URL" -v owner=bandgate_owner -v app=bandgate_app -v db=bandgate -f db/roles.sql
--
-- owner: owns the database, its schemas and tables; migrations run as this role (MIGRATION_DATABASE_URL).
-- app:   the web app and the worker (DATABASE_URL). Owns nothing, so it cannot alter, disable or drop the triggers
--        that keep releases immutable and the audit trail append-only; the migration step grants it row access only.
-- Neither role is a superuser, may create roles or databases, bypasses row security or replicates, so neither can
-- SET session_replication_role (which turns every trigger off). Passwords are set separately (ALTER ROLE … PASSWORD);
-- the local clusters use trust authentication on 127.0.0.1 and need none.
\set ON_ERROR_STOP on

SELECT format('CREATE ROLE %I LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS', r)
  FROM unnest(ARRAY[:'owner', :'app']) AS r
 WHERE NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = r)
\gexec

-- The app role must not inherit the owner's rights, in either direction.
SELECT format('REVOKE %I FROM %I', g.rolname, m.rolname)
  FROM pg_auth_members am JOIN pg_roles g ON g.oid = am.roleid JOIN pg_roles m ON m.oid = am.member
 WHERE (g.rolname, m.rolname) IN ((:'owner', :'app'), (:'app', :'owner'))
\gexec

SELECT format('ALTER DATABASE %I OWNER TO %I', :'db', :'owner')
  FROM pg_database d WHERE d.datname = :'db' AND pg_get_userbyid(d.datdba) <> :'owner'
\gexec

\connect :"db"

-- A database set up before there were two roles has its objects owned by whoever ran the migrations then: hand them
-- to the owner role (the app role must own none of them).
SELECT format('ALTER SCHEMA %I OWNER TO %I', n.nspname, :'owner')
  FROM pg_namespace n
 WHERE n.nspname IN ('drizzle', 'pgboss') AND pg_get_userbyid(n.nspowner) <> :'owner'
\gexec

SELECT format('ALTER %s %I.%I OWNER TO %I', CASE c.relkind WHEN 'S' THEN 'SEQUENCE' WHEN 'v' THEN 'VIEW' WHEN 'm' THEN 'MATERIALIZED VIEW' ELSE 'TABLE' END,
              n.nspname, c.relname, :'owner')
  FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
 WHERE n.nspname IN ('public', 'drizzle', 'pgboss') AND c.relkind IN ('r', 'p', 'v', 'm', 'S')
   AND pg_get_userbyid(c.relowner) <> :'owner'
   -- a sequence that belongs to a column changes owner with its table
   AND NOT (c.relkind = 'S' AND EXISTS (SELECT 1 FROM pg_depend d WHERE d.objid = c.oid AND d.classid = 'pg_class'::regclass AND d.deptype IN ('a', 'i')))
\gexec

SELECT format('ALTER TYPE %I.%I OWNER TO %I', n.nspname, t.typname, :'owner')
  FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
 WHERE n.nspname IN ('public', 'pgboss') AND t.typtype IN ('e', 'd') AND pg_get_userbyid(t.typowner) <> :'owner'
\gexec

SELECT format('ALTER ROUTINE %I.%I(%s) OWNER TO %I', n.nspname, p.proname, pg_get_function_identity_arguments(p.oid), :'owner')
  FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
 WHERE n.nspname IN ('public', 'pgboss') AND pg_get_userbyid(p.proowner) <> :'owner'
\gexec
