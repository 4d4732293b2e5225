import { and, eq, isNull } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { apiTokens, referenceBandSets, remarks } from "@/db/schema";
import { API_TOKEN_LIMIT } from "@/lib/registry/tokens";
import { createBoardWorld, draftProposal } from "../support/board-fixtures";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";
import { actionResult, callServerAction, serverActionId } from "../support/server-action";

afterAll(closeDb);

async function sessionFor(person: { email: string; password: string }) {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

const createToken = () => serverActionId("app/(workspace)/settings/actions.ts", "createTokenAction");
const revokeToken = () => serverActionId("app/(workspace)/settings/actions.ts", "revokeTokenAction");

async function newToken(session: HttpSession, name: string) {
  return actionResult((await callServerAction(session, "/settings/tokens", createToken(), { name })).text);
}

async function expectInvalid(res: Response) {
  expect(res.status).toBe(400);
  const body = await res.json();
  expect(body.error.code).toMatch(/^invalid:/);
  return body;
}

describe("bad input in addresses is a 400 with a coded error, never a 500", () => {
  it("a NUL byte in the board's family filter, on the board page and in a v1 family slug", async () => {
    const world = await createBoardWorld();
    const author = await sessionFor(world.author);
    await expectInvalid(await author.fetch(`/api/board?family=${world.familySlug}%00x`));
    const page = await author.fetch(`/board?family=${world.familySlug}%00x`);
    expect(page.status).toBe(400);
    expect((await author.fetch(`/registry/${world.familySlug}%00`)).status).toBe(400);

    const token = (await newToken(author, "nul probe"))?.data as { token: string };
    const auth = { authorization: `Bearer ${token.token}` };
    await expectInvalid(await author.fetch(`/api/v1/families/${world.familySlug}%00/releases`, { headers: auth }));
    await expectInvalid(await author.fetch(`/api/v1/families/a%00b/releases/latest/document`, { headers: auth }));
  });

  it("k-points too large to mean anything (1e308, -1e308, 1e20) are refused before any computation", async () => {
    const world = await createBoardWorld();
    const author = await sessionFor(world.author);
    const token = (await newToken(author, "k probe"))?.data as { token: string };
    const auth = { authorization: `Bearer ${token.token}` };
    const bands = `/api/v1/families/${world.familySlug}/releases/1.0.0/bands`;
    for (const k of ["1e308", "-1e308", "1e20", "0.1;1e300", "Infinity", "1e400"]) {
      const body = await expectInvalid(await author.fetch(`${bands}?k=${encodeURIComponent(k)}`, { headers: auth }));
      expect(body.error.code).toBe("invalid:kpoints");
    }
    expect((await author.fetch(`${bands}?k=0.25;-3.5`, { headers: auth })).status).toBe(200);
  });
});

describe("NUL in text that would reach PostgreSQL", () => {
  it("a remark body holding \\u0000 is a 400 and stores nothing", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await sessionFor(world.author);
    const res = await author.json(`/api/proposals/${id}/remarks`, "POST", { body: "gap\u0000 closes", anchor: { kind: "proposal" } });
    const body = await expectInvalid(res);
    expect(body.error.message).toMatch(/NUL/);
    const keyed = await author.json(`/api/proposals/${id}/remarks`, "POST", { body: "fine", anchor: { kind: "parameter", key: "shell\u0000" } });
    await expectInvalid(keyed);
    expect(await db.select().from(remarks).where(eq(remarks.proposalId, id))).toHaveLength(0);
  });

  it("an upload with a NUL in a comment line, its file name or its name is refused with a message, and nothing is stored", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await sessionFor(world.author);
    const good = "k_index,E1 (eV)\n0,-7.8\n1,-7.79\n";
    const provenance = { method: "DFT-PBE", code: "fixture 1.0", structureSource: "fixture chain" };
    const send = (fields: { name?: string; fileName?: string; content?: string }) =>
      author.json(`/api/proposals/${id}/reference-bands`, "POST", { name: "nul probe", fileName: "ref.csv", content: good, provenance, ...fields });

    for (const [field, fields] of [
      ["content", { content: `# made by hand \u0000\n${good}` }],
      ["fileName", { fileName: "ref\u0000.csv" }],
      ["name", { name: "nul\u0000name" }],
    ] as const) {
      const body = await expectInvalid(await send(fields));
      expect(body.error.message, field).toMatch(/NUL/);
      expect(body.error.fieldErrors?.[field]?.join(" "), field).toMatch(/NUL/);
    }
    expect(await db.select().from(referenceBandSets).where(eq(referenceBandSets.proposalId, id))).toHaveLength(0);
    expect((await send({})).status).toBe(201);
  });
});

describe("API tokens per person are capped", () => {
  const active = (userId: string) => db.select().from(apiTokens).where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));

  it(`allows ${API_TOKEN_LIMIT} active tokens, refuses the next with a clear message, even when requests race`, async () => {
    const person = await createPerson(["consumer"]);
    const session = await sessionFor(person);
    const results = await Promise.all(Array.from({ length: API_TOKEN_LIMIT + 3 }, (_, i) => newToken(session, `token ${i}`)));
    expect(results.filter((r) => r?.ok)).toHaveLength(API_TOKEN_LIMIT);
    const refused = results.filter((r) => r && !r.ok);
    expect(refused).toHaveLength(3);
    for (const r of refused) {
      expect(r?.code).toBe("refused:token-limit");
      expect(r?.error).toContain(`${API_TOKEN_LIMIT} active API tokens`);
    }
    const tokens = await active(person.id);
    expect(tokens).toHaveLength(API_TOKEN_LIMIT);

    const revoked = actionResult((await callServerAction(session, "/settings/tokens", revokeToken(), { tokenId: tokens[0].id })).text);
    expect(revoked).toMatchObject({ ok: true });
    expect(await newToken(session, "after a revoke")).toMatchObject({ ok: true });
    expect(await newToken(session, "one too many")).toMatchObject({ ok: false, code: "refused:token-limit" });
    expect(await active(person.id)).toHaveLength(API_TOKEN_LIMIT);
  });

  it("a token name holding NUL is refused as bad input", async () => {
    const person = await createPerson(["consumer"]);
    const session = await sessionFor(person);
    const result = await newToken(session, "ci\u0000bot");
    expect(result).toMatchObject({ ok: false, code: "invalid:input" });
    expect(await active(person.id)).toHaveLength(0);
  });
});
