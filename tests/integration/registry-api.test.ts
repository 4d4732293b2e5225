import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { stopJobQueue } from "@/lib/jobs/boss";
import { createApiToken, revokeApiToken } from "@/lib/registry/token-service";
import type { BoardWorld } from "@/tests/support/board-fixtures";
import { appUrl } from "@/tests/support/http-session";
import { createPerson } from "@/tests/support/people";
import { acceptedProposal, releaseAccepted } from "./registry-world";

let world: BoardWorld;
let token: string;
let tokenId: string;
let consumer: Awaited<ReturnType<typeof createPerson>>;

const api = (path: string, init: RequestInit & { token?: string | null } = {}) => {
  const headers = new Headers(init.headers);
  const t = init.token === undefined ? token : init.token;
  if (t) headers.set("authorization", `Bearer ${t}`);
  return fetch(`${appUrl()}/api/v1${path}`, { ...init, headers });
};

beforeAll(async () => {
  const accepted = await acceptedProposal();
  world = accepted.world;
  await releaseAccepted(world, accepted.proposalId, "1.1.0");
  consumer = await createPerson(["consumer"]);
  ({ token, id: tokenId } = await createApiToken(consumer, { name: "integration" }));
});
afterAll(stopJobQueue);

describe("pulling a release (the README's steps, in Node)", () => {
  it("downloads the document and its bytes hash to the published checksum", async () => {
    const meta = await api(`/families/${world.familySlug}/releases/1.1.0`);
    expect(meta.status).toBe(200);
    const release = (await meta.json()) as { sha256: string; status: string; links: { document: string } };
    expect(release.status).toBe("current");
    const doc = await fetch(appUrl() + release.links.document, { headers: { authorization: `Bearer ${token}` } });
    expect(doc.status).toBe(200);
    const bytes = Buffer.from(await doc.arrayBuffer());
    expect(createHash("sha256").update(bytes).digest("hex")).toBe(release.sha256);
    expect(doc.headers.get("etag")).toBe(`"${release.sha256}"`);
    const [row] = await db.select({ lastUsedAt: apiTokens.lastUsedAt }).from(apiTokens).where(eq(apiTokens.id, tokenId));
    expect(row.lastUsedAt).not.toBeNull();
  });

  it("lists families with their latest release and a family's releases, newest first", async () => {
    const families = (await (await api("/families")).json()) as { families: { slug: string; latest: { version: string } | null }[] };
    expect(families.families.find((f) => f.slug === world.familySlug)?.latest?.version).toBe("1.1.0");
    const list = (await (await api(`/families/${world.familySlug}/releases`)).json()) as { releases: { version: string }[] };
    expect(list.releases.map((r) => r.version)).toEqual(["1.1.0", "1.0.0"]);
    const latest = await api(`/families/${world.familySlug}/releases/latest/document`);
    expect(latest.headers.get("bandgate-release-version")).toBe("1.1.0");
  });
});

describe("ETag and If-None-Match", () => {
  it("answers 304 without a body for the current ETag and 200 for another", async () => {
    const first = await api(`/families/${world.familySlug}/releases/1.1.0/document`);
    const etag = first.headers.get("etag")!;
    const again = await api(`/families/${world.familySlug}/releases/1.1.0/document`, { headers: { "if-none-match": etag } });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
    expect(again.headers.get("etag")).toBe(etag);
    const older = await api(`/families/${world.familySlug}/releases/1.1.0/document`, { headers: { "if-none-match": '"0000"' } });
    expect(older.status).toBe(200);
  });
});

describe("tokens", () => {
  const expect401 = async (res: Response) => {
    expect(res.status).toBe(401);
    expect(res.headers.get("www-authenticate")).toMatch(/^Bearer/);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("unauthenticated:token");
    return body.error.message;
  };

  it("refuses a missing, malformed, unknown or revoked token with a JSON 401", async () => {
    const path = `/families/${world.familySlug}/releases`;
    expect(await expect401(await api(path, { token: null }))).toMatch(/Send an API token/);
    expect(await expect401(await api(path, { token: "not-a-token" }))).toMatch(/not a Bandgate API token/);
    expect(await expect401(await api(path, { token: `bgt_${"A".repeat(43)}` }))).toMatch(/Unknown/);
    const other = await createApiToken(consumer, { name: "to revoke" });
    expect((await api(path, { token: other.token })).status).toBe(200);
    await revokeApiToken(consumer, { tokenId: other.id });
    expect(await expect401(await api(path, { token: other.token }))).toMatch(/revoked/);
  });

  it("does not accept a session cookie instead of a token", async () => {
    const res = await fetch(`${appUrl()}/api/v1/families`, { headers: { cookie: "next-auth.session-token=anything" } });
    await expect401(res);
  });

  it("answers 404 for an unknown family or version", async () => {
    expect((await api("/families/no-such-family/releases")).status).toBe(404);
    const res = await api(`/families/${world.familySlug}/releases/7.7.7/document`);
    expect(res.status).toBe(404);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("not-found:release");
    expect((await api(`/families/${world.familySlug}/releases/banana`)).status).toBe(404);
  });

  it("limits requests per token with 429 and Retry-After; other tokens are unaffected", async () => {
    const limited = await createApiToken(consumer, { name: "limited" });
    await db.update(apiTokens).set({ requestsPerMinute: 3 }).where(eq(apiTokens.id, limited.id));
    const path = `/families/${world.familySlug}/releases/1.1.0`;
    const statuses: number[] = [];
    let last: Response | undefined;
    for (let i = 0; i < 5; i++) {
      last = await api(path, { token: limited.token });
      statuses.push(last.status);
    }
    // The two windows of a minute boundary may split the five requests; at least one must be refused either way.
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(1);
    const refused = statuses.indexOf(429);
    expect(statuses.slice(0, refused).every((s) => s === 200)).toBe(true);
    if (last?.status === 429) {
      const retry = Number(last.headers.get("retry-after"));
      expect(retry).toBeGreaterThanOrEqual(1);
      expect(retry).toBeLessThanOrEqual(60);
      expect(((await last.json()) as { error: { code: string } }).error.code).toBe("rate-limited:token");
    }
    expect((await api(path)).status).toBe(200);
  });
});

describe("computed downloads", () => {
  it("serve the hopping list as JSON and CSV with the same rows", async () => {
    const json = (await (await api(`/families/${world.familySlug}/releases/1.1.0/hoppings`)).json()) as { hoppings: unknown[] };
    const csv = await api(`/families/${world.familySlug}/releases/1.1.0/hoppings?format=csv`);
    expect(csv.headers.get("content-type")).toMatch(/text\/csv/);
    expect((await csv.text()).trim().split("\n").length).toBe(json.hoppings.length + 1);
  });

  it("serve bands on the default path and at given k-points, and refuse malformed points", async () => {
    const path = (await (await api(`/families/${world.familySlug}/releases/1.1.0/bands?points=21`)).json()) as { energies: number[][]; ticks: unknown[] };
    expect(path.energies.length).toBeGreaterThanOrEqual(21);
    expect(path.ticks.length).toBeGreaterThan(1);
    const at = (await (await api(`/families/${world.familySlug}/releases/1.1.0/bands?k=0;0.5`)).json()) as { energies: number[][] };
    expect(at.energies).toHaveLength(2);
    // Γ of the chain is the first point of its default path (both start at k = 0).
    expect(at.energies[0][0]).toBeCloseTo(path.energies[0][0], 12);
    expect((await api(`/families/${world.familySlug}/releases/1.1.0/bands?k=0,0`)).status).toBe(400);
  });

  it("publishes the JSON Schema and the OpenAPI description without a token", async () => {
    const schema = await fetch(`${appUrl()}/api/v1/schema/model-document`);
    expect(schema.status).toBe(200);
    expect(((await schema.json()) as { type?: string }).type).toBe("object");
    const openapi = (await (await fetch(`${appUrl()}/api/v1/openapi.json`)).json()) as { paths: Record<string, unknown> };
    expect(Object.keys(openapi.paths)).toContain("/families/{slug}/releases/{version}/document");
  });
});
