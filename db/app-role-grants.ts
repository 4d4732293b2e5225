import { escapeIdentifier as id, type ClientBase } from "pg";

/**
 * Row access for the app role (the web app and the worker), granted by the owner role after every migration: read and
 * write rows, nothing else. No TRUNCATE, TRIGGER or REFERENCES, no DDL (it owns nothing and may create nothing), so
 * the triggers that guard releases and the audit trail stay out of its reach. Two tables get less than the rest: the
 * audit trail takes inserts and reads only, and releases are never deleted (their UPDATE stays, for deprecation and
 * withdrawal, which the release trigger limits to those columns). Default privileges give tables and queue partitions
 * created by later migrations the same row access.
 */
const ROW_ACCESS = "SELECT, INSERT, UPDATE, DELETE";
const NARROWER: { table: string; revoke: string }[] = [
  { table: "audit_events", revoke: "UPDATE, DELETE" },
  { table: "releases", revoke: "DELETE" },
];

export async function grantAppRole(client: ClientBase, appRole: string, jobSchema: string): Promise<void> {
  const [owner, app, jobs] = [id((await client.query<{ u: string }>("select current_user as u")).rows[0].u), id(appRole), id(jobSchema)];
  const statements = [
    // from scratch each time, so rights granted by hand earlier (ALL, TRUNCATE, TRIGGER…) do not linger
    `REVOKE ALL ON ALL TABLES IN SCHEMA public, ${jobs} FROM ${app}`,
    `REVOKE ALL ON ALL SEQUENCES IN SCHEMA public, ${jobs} FROM ${app}`,
    `GRANT USAGE ON SCHEMA public, ${jobs} TO ${app}`,
    `GRANT ${ROW_ACCESS} ON ALL TABLES IN SCHEMA public, ${jobs} TO ${app}`,
    `GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${app}`,
    ...NARROWER.map((n) => `REVOKE ${n.revoke} ON public.${id(n.table)} FROM ${app}`),
    `ALTER DEFAULT PRIVILEGES FOR ROLE ${owner} IN SCHEMA public GRANT ${ROW_ACCESS} ON TABLES TO ${app}`,
    `ALTER DEFAULT PRIVILEGES FOR ROLE ${owner} IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO ${app}`,
    `ALTER DEFAULT PRIVILEGES FOR ROLE ${owner} IN SCHEMA ${jobs} GRANT ${ROW_ACCESS} ON TABLES TO ${app}`,
  ];
  await client.query("BEGIN");
  try {
    for (const s of statements) await client.query(s);
    await client.query("COMMIT");
  } catch (err) {
    await client.query("ROLLBACK");
    throw err;
  }
}

export interface RoleFacts {
  name: string;
  superuser: boolean;
  bypassesRowSecurity: boolean;
  createsRoles: boolean;
  /** Tables, views and sequences it owns in the app's and the queue's schemas. */
  ownedRelations: number;
}

/** What a role may do that the app role must not (checked by the migration step, shown by the tests). */
export async function describeRole(client: ClientBase, role: string, jobSchema: string): Promise<RoleFacts | null> {
  const { rows } = await client.query<RoleFacts>(
    `select r.rolname as name, r.rolsuper as superuser, r.rolbypassrls as "bypassesRowSecurity", r.rolcreaterole as "createsRoles",
            (select count(*)::int from pg_class c join pg_namespace n on n.oid = c.relnamespace
              where c.relowner = r.oid and n.nspname in ('public', $2)) as "ownedRelations"
       from pg_roles r where r.rolname = $1`,
    [role, jobSchema],
  );
  return rows[0] ?? null;
}

/** Why a role is unfit to be the app role, or null when it is fit. */
export function appRoleProblem(facts: RoleFacts): string | null {
  if (facts.superuser) return `${facts.name} is a superuser (it can switch every trigger off with session_replication_role)`;
  if (facts.ownedRelations > 0) return `${facts.name} owns ${facts.ownedRelations} table(s) (an owner can disable or drop their triggers)`;
  if (facts.bypassesRowSecurity) return `${facts.name} bypasses row-level security`;
  if (facts.createsRoles) return `${facts.name} may create roles`;
  return null;
}
