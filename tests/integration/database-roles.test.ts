import { eq } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { describeRole } from "@/db/app-role-grants";
import { auditEvents, releases } from "@/db/schema";
import { JOB_SCHEMA } from "@/lib/jobs/queues";
import { chainDocument } from "@/tests/support/board-fixtures";
import { appUrl } from "@/tests/support/http-session";
import { createFitWorld } from "./fit-world";

/*
 * The web app and the worker connect as the app role (DATABASE_URL); migrations run as the owner
 * (MIGRATION_DATABASE_URL). Everything the app role tries here would undo release immutability or the append-only
 * audit trail if it worked. Each attempt runs in a transaction that is rolled back, so a role that can do it (the
 * superuser the app used to connect as) fails the test without breaking the database for the tests after it.
 */
const ownerUrl = process.env.MIGRATION_DATABASE_URL;
let app: pg.Client;
let owner: pg.Client;
let appRole: string;
let ownerRole: string;
let releaseId: string;
let auditId: number;

async function connect(url: string | undefined): Promise<pg.Client> {
  if (!url) throw new Error("MIGRATION_DATABASE_URL is not set: run the integration tests through `npm test` (scripts/test.sh sets both roles up)");
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  return client;
}

/** Runs a statement and rolls it back: "done" when it went through, else the SQLSTATE and message it failed with. */
async function attempt(client: pg.Client, statement: string): Promise<string> {
  await client.query("BEGIN");
  try {
    await client.query(statement);
    return "done";
  } catch (err) {
    const e = err as { code?: string; message: string };
    return `${e.code}: ${e.message}`;
  } finally {
    await client.query("ROLLBACK");
  }
}

const currentUser = async (client: pg.Client) => (await client.query<{ u: string }>("select current_user as u")).rows[0].u;

beforeAll(async () => {
  app = await connect(process.env.DATABASE_URL);
  owner = await connect(ownerUrl);
  [appRole, ownerRole] = [await currentUser(app), await currentUser(owner)];
  const world = await createFitWorld(chainDocument());
  releaseId = world.releaseId;
  const [event] = await db
    .insert(auditEvents)
    .values({ actorId: world.curator.id, action: "test.guarded", subjectType: "release", subjectId: releaseId })
    .returning({ id: auditEvents.id });
  auditId = event.id;
});

afterAll(async () => {
  await app?.end();
  await owner?.end();
  await closeDb();
});

describe("the role the app connects as", () => {
  it("is not a superuser, owns no table, and is not the migration role", async () => {
    expect(appRole).not.toBe(ownerRole);
    expect(await describeRole(app, appRole, JOB_SCHEMA)).toEqual({ name: appRole, superuser: false, bypassesRowSecurity: false, createsRoles: false, ownedRelations: 0 });
    const { rows } = await app.query<{ inherits: boolean }>("select pg_has_role(current_user, $1, 'MEMBER') as inherits", [ownerRole]);
    expect(rows[0].inherits).toBe(false);
  });

  it("cannot switch off, drop or replace the guards of releases and of the audit trail, nor truncate either table", async () => {
    const statements = [
      "SET session_replication_role = replica",
      "ALTER TABLE releases DISABLE TRIGGER releases_immutable",
      "ALTER TABLE releases DISABLE TRIGGER ALL",
      "DROP TRIGGER releases_immutable ON releases",
      "DROP TRIGGER releases_no_truncate ON releases",
      "TRUNCATE releases",
      "ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only",
      "DROP TRIGGER audit_events_append_only ON audit_events",
      "DROP TRIGGER audit_events_no_truncate ON audit_events",
      "TRUNCATE audit_events",
      "CREATE OR REPLACE FUNCTION bandgate_guard_release() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RETURN NEW; END $$",
      "CREATE OR REPLACE FUNCTION bandgate_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RETURN NEW; END $$",
      "CREATE TRIGGER let_through BEFORE UPDATE ON releases FOR EACH ROW EXECUTE FUNCTION suppress_redundant_updates_trigger()",
      "ALTER TABLE releases RENAME TO releases_old",
      "CREATE TABLE public.scratch (id int)",
      "CREATE SCHEMA scratch",
      `SET ROLE ${pg.escapeIdentifier(ownerRole)}`,
    ];
    for (const statement of statements) {
      expect(await attempt(app, statement), statement).toMatch(/^42501: /);
    }
    const { rows } = await app.query<{ tgname: string; tgenabled: string }>(
      "select tgname, tgenabled from pg_trigger where tgrelid in ('releases'::regclass, 'audit_events'::regclass) and not tgisinternal order by tgname",
    );
    expect(rows).toEqual([
      { tgname: "audit_events_append_only", tgenabled: "O" },
      { tgname: "audit_events_no_truncate", tgenabled: "O" },
      { tgname: "releases_immutable", tgenabled: "O" },
      { tgname: "releases_no_truncate", tgenabled: "O" },
    ]);
  });

  it("has every change to a release row or an audit row refused, and the rows stay as they were", async () => {
    const before = await app.query("select * from releases where id = $1", [releaseId]);
    const refusedByTrigger = /^42501: bandgate: release .* is immutable/;
    expect(await attempt(app, `UPDATE releases SET changelog = 'rewritten' WHERE id = '${releaseId}'`)).toMatch(refusedByTrigger);
    expect(await attempt(app, `UPDATE releases SET document = jsonb_set(document, '{name}', '"edited"') WHERE id = '${releaseId}'`)).toMatch(refusedByTrigger);
    expect(await attempt(app, `UPDATE releases SET version = '9.9.9' WHERE id = '${releaseId}'`)).toMatch(refusedByTrigger);
    // Rows the app never deletes or edits: the app role lacks the privilege before any trigger is reached.
    expect(await attempt(app, `DELETE FROM releases WHERE id = '${releaseId}'`)).toMatch(/^42501: permission denied for table releases/);
    expect(await attempt(app, `UPDATE audit_events SET action = 'tampered' WHERE id = ${auditId}`)).toMatch(/^42501: permission denied for table audit_events/);
    expect(await attempt(app, `DELETE FROM audit_events WHERE id = ${auditId}`)).toMatch(/^42501: permission denied for table audit_events/);
    expect((await app.query("select * from releases where id = $1", [releaseId])).rows).toEqual(before.rows);
    expect(await db.select({ action: auditEvents.action }).from(auditEvents).where(eq(auditEvents.id, auditId))).toEqual([{ action: "test.guarded" }]);
    // What the app does need still works: a deprecation is recorded (once) through the same role.
    expect(await attempt(app, `UPDATE releases SET deprecated_at = now(), deprecation_reason = 'superseded' WHERE id = '${releaseId}'`)).toBe("done");
  });

  it("is what the running web app connects as", async () => {
    expect((await fetch(`${appUrl()}/api/health`)).status).toBe(200);
    const { rows } = await owner.query<{ usename: string }>(
      // (another role's sessions show their user and database, not their backend type)
      "select distinct usename from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()",
    );
    expect(rows.map((r) => r.usename)).toEqual([appRole]);
  });
});

describe("the triggers themselves", () => {
  it("refuse UPDATE, DELETE and TRUNCATE of releases and of the audit trail even to the owner, who holds every privilege", async () => {
    const releaseRule = /^42501: bandgate: (release .* is immutable|DELETE on releases is not allowed|TRUNCATE on releases is not allowed)/;
    const auditRule = /^42501: bandgate: (UPDATE|DELETE|TRUNCATE) on audit_events is not allowed \(append-only\)/;
    expect(await attempt(owner, `UPDATE releases SET changelog = 'rewritten' WHERE id = '${releaseId}'`)).toMatch(releaseRule);
    expect(await attempt(owner, `DELETE FROM releases WHERE id = '${releaseId}'`)).toMatch(releaseRule);
    expect(await attempt(owner, "TRUNCATE releases CASCADE")).toMatch(releaseRule);
    expect(await attempt(owner, `UPDATE audit_events SET action = 'tampered' WHERE id = ${auditId}`)).toMatch(auditRule);
    expect(await attempt(owner, `DELETE FROM audit_events WHERE id = ${auditId}`)).toMatch(auditRule);
    expect(await attempt(owner, "TRUNCATE audit_events")).toMatch(auditRule);
    const [row] = await db.select({ changelog: releases.changelog }).from(releases).where(eq(releases.id, releaseId));
    expect(row.changelog).toBe("fixture");
  });
});
