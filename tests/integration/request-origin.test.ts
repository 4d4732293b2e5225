import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { moveProposal, assignReviewer } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { apiTokens, remarks } from "@/db/schema";
import { createBoardWorld, draftProposal, versionOf } from "../support/board-fixtures";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";
import { actionResult, callServerAction, serverActionId } from "../support/server-action";

afterAll(closeDb);

const UNSAFE = ["POST", "PUT", "PATCH", "DELETE"];
/** next-auth checks its own double-submit CSRF token on its POSTs. */
const OWN_CSRF = ["app/api/auth/[...nextauth]/route.ts"];

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return routeFiles(path);
    return e.name === "route.ts" ? [path] : [];
  });
}

/** Every unsafe method a route file exports, however it is written. */
function unsafeMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:const|let|var|async\s+function|function)\s+(\w+)/g)) found.add(m[1]);
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) for (const part of m[1].split(",")) found.add(part.trim().split(/\s+as\s+/).pop() ?? "");
  return UNSAFE.filter((method) => found.has(method));
}

function urlOf(file: string): string {
  return `/${file.replace(/^app\//, "").replace(/\/route\.ts$/, "")}`
    .replace(/\[id\]/g, randomUUID())
    .replace(/\[slug\]/g, "some-family")
    .replace(/\[version\]/g, "1.0.0");
}

async function signedIn(roles: Parameters<typeof createPerson>[0]) {
  const person = await createPerson(roles);
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

const otherPort = () => `http://127.0.0.1:${Number(new URL(appUrl()).port) + 1}`;

describe("every state-changing route handler checks where the request comes from and what it carries", () => {
  const targets = routeFiles("app/api")
    .filter((f) => !OWN_CSRF.includes(f))
    .flatMap((file) => unsafeMethods(readFileSync(file, "utf8")).map((method) => ({ file, method })));

  it("finds the route handlers that change state", () => {
    expect(targets.length).toBeGreaterThanOrEqual(14);
    expect(targets).toContainEqual({ file: "app/api/proposals/[id]/remarks/route.ts", method: "POST" });
    expect(targets).toContainEqual({ file: "app/api/remarks/[id]/route.ts", method: "PATCH" });
  });

  for (const { file, method } of targets) {
    it(`${method} ${file}: another origin, no origin, a cross-site fetch and a non-JSON body are refused`, async () => {
      const session = await signedIn(["author", "reviewer", "curator", "admin"]);
      const url = urlOf(file);
      const json = JSON.stringify({ version: 1 });
      const foreign = await session.fetch(url, { method, headers: { origin: "https://evil.example", "content-type": "text/plain" }, body: json });
      expect(foreign.status).toBe(403);
      expect((await foreign.json()).error.code).toBe("forbidden:origin");

      const anonymous = await session.fetch(url, { method, headers: { origin: "", "content-type": "application/json" }, body: json });
      expect(anonymous.status).toBe(403);
      expect((await anonymous.json()).error.code).toBe("forbidden:origin");

      const crossSite = await session.fetch(url, { method, headers: { "sec-fetch-site": "same-site", "content-type": "application/json" }, body: json });
      expect(crossSite.status).toBe(403);

      const plain = await session.fetch(url, { method, headers: { "content-type": "text/plain" }, body: json });
      expect(plain.status).toBe(415);
      expect((await plain.json()).error.code).toBe("unsupported:media-type");
    });
  }
});

describe("a page on another port of the same site cannot post a remark as the signed-in reviewer", () => {
  it("refuses a text/plain form post from another origin and stores nothing; the app's own JSON request works", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    await moveProposal(world.author, { proposalId: id, version: await versionOf(id), to: "submitted" });
    await assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: world.reviewers[0].id });
    const session = new HttpSession(appUrl());
    expect(await session.signIn(world.reviewers[0].email, world.reviewers[0].password)).toBeNull();

    // What <form enctype="text/plain"> sends: name=value, with the JSON hidden in the name.
    const forged = await session.fetch(`/api/proposals/${id}/remarks`, {
      method: "POST",
      headers: { origin: otherPort(), "sec-fetch-site": "same-site", "content-type": "text/plain" },
      body: '{"body":"forged remark","anchor":{"kind":"proposal"},"x":"="}',
    });
    expect(forged.status).toBe(403);
    // The same request without an Origin header (a browser never omits it on POST) is refused too.
    const noOrigin = await session.fetch(`/api/proposals/${id}/remarks`, {
      method: "POST",
      headers: { origin: "", "content-type": "application/json" },
      body: JSON.stringify({ body: "forged remark", anchor: { kind: "proposal" } }),
    });
    expect(noOrigin.status).toBe(403);
    expect(await db.select().from(remarks).where(eq(remarks.proposalId, id))).toHaveLength(0);

    const own = await session.json(`/api/proposals/${id}/remarks`, "POST", { body: "a real remark", anchor: { kind: "proposal" } }, { "sec-fetch-site": "same-origin" });
    expect(own.status).toBe(201);
    expect((await db.select().from(remarks).where(eq(remarks.proposalId, id))).map((r) => r.body)).toEqual(["a real remark"]);
  });
});

describe("server actions (Next compares Origin with Host before running one)", () => {
  it("a token-creating action posted from another origin runs nothing; from the app's own origin it works", async () => {
    const person = await createPerson(["consumer"]);
    const session = new HttpSession(appUrl());
    expect(await session.signIn(person.email, person.password)).toBeNull();
    const action = serverActionId("app/(workspace)/settings/actions.ts", "createTokenAction");
    const foreign = await callServerAction(session, "/settings/tokens", action, { name: "forged token" }, { origin: otherPort() });
    expect(foreign.status).toBeGreaterThanOrEqual(400);
    expect(actionResult(foreign.text)).toBeNull();
    expect(await db.select().from(apiTokens).where(eq(apiTokens.userId, person.id))).toHaveLength(0);

    const own = await callServerAction(session, "/settings/tokens", action, { name: "real token" });
    expect(actionResult(own.text)).toMatchObject({ ok: true });
    expect(await db.select().from(apiTokens).where(eq(apiTokens.userId, person.id))).toHaveLength(1);
  });
});
