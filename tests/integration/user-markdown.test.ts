import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { releaseProposal } from "@/board/release";
import { assignReviewer, moveProposal } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { auditEvents, markdownRenders, remarks, revisions } from "@/db/schema";
import { RENDERER_VERSION } from "@/lib/markdown/bounds";
import { createBoardWorld, draftProposal, versionOf } from "@/tests/support/board-fixtures";
import { appUrl, HttpSession } from "@/tests/support/http-session";
import { MACRO_BOMB, TOO_LARGE } from "@/tests/support/user-math";
import { acceptedProposal } from "./registry-world";

afterAll(closeDb);

/**
 * Ceilings, far above what a bounded render costs and far below what the unbounded one took: on one busy core the
 * three bombs below kept the review page rendering for 20 s and more, with /api/health waiting all that time.
 */
const PAGE_CEILING_MS = 8_000;
const HEALTH_CEILING_MS = 4_000;

const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

async function sessionFor(person: { email: string; password: string }) {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

async function underReview() {
  const world = await createBoardWorld();
  const id = await draftProposal(world);
  await moveProposal(world.author, { proposalId: id, version: await versionOf(id), to: "submitted" });
  await assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: world.reviewers[0].id });
  await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "under_review" });
  return { world, id, reviewer: await sessionFor(world.reviewers[0]) };
}

async function storedHtml(text: string): Promise<string | null> {
  const [row] = await db
    .select({ html: markdownRenders.html })
    .from(markdownRenders)
    .where(and(eq(markdownRenders.sourceSha256, sha256(text)), eq(markdownRenders.renderer, RENDERER_VERSION)));
  return row?.html ?? null;
}

async function postRemark(session: HttpSession, proposalId: string, body: string): Promise<string> {
  const res = await session.json(`/api/proposals/${proposalId}/remarks`, "POST", { body, anchor: { kind: "proposal" } });
  expect(res.status).toBe(201);
  return ((await res.json()) as { remarkId: string }).remarkId;
}

/** Loads a page while asking /api/health one request after another until the page has answered. */
async function viewWhileProbingHealth(session: HttpSession, path: string) {
  const started = Date.now();
  let done = false;
  const page = session
    .fetch(path)
    .then(async (res) => ({ status: res.status, html: await res.text(), ms: Date.now() - started }))
    .finally(() => {
      done = true;
    });
  const health: number[] = [];
  while (!done) {
    const asked = Date.now();
    const res = await fetch(`${appUrl()}/api/health`);
    await res.arrayBuffer();
    expect(res.status).toBe(200);
    health.push(Date.now() - asked);
  }
  return { ...(await page), health };
}

const imgSources = (html: string) => [...html.matchAll(/<img\b[^>]*\bsrc="([^"]*)"/g)].map((m) => m[1]);

describe("user markdown through the real routes", () => {
  it("stores a remark full of macro bombs bounded; its review page answers promptly and /api/health keeps answering", { timeout: 180_000 }, async () => {
    const { id, reviewer } = await underReview();
    // A first view loads the page's code, so the measured one below is about the remark alone.
    expect((await reviewer.fetch(`/proposals/${id}/review`)).status).toBe(200);
    const body = `Why does the gap move?\n\n${MACRO_BOMB}\n${MACRO_BOMB}\n${MACRO_BOMB}`.trim();
    await postRemark(reviewer, id, body);

    const view = await viewWhileProbingHealth(reviewer, `/proposals/${id}/review`);
    expect(view.status).toBe(200);
    expect(view.html).toContain("Why does the gap move?");
    // The page with three unbounded bombs weighed over 20 MB; bounded, the remark adds about 2 KB.
    expect(view.html.length).toBeLessThan(1_000_000);
    expect(view.ms).toBeLessThan(PAGE_CEILING_MS);
    expect(Math.max(...view.health)).toBeLessThan(HEALTH_CEILING_MS);

    const stored = await storedHtml(body);
    expect(stored!.split(TOO_LARGE).length - 1).toBe(3);
    expect(stored!.length).toBeLessThan(3_000);
    expect(view.html).toContain(stored!);
  });

  it("shows images only from this origin: remote and protocol-relative ones become links or text", async () => {
    const { id, reviewer } = await underReview();
    const body = [
      "![pixel](//tracker.example/p.gif)",
      "![slash](/\\tracker.example/p.gif)",
      "![tab](</\t/tracker.example/p.gif>)",
      "![remote](https://tracker.example/p.gif)",
      "![script](javascript:alert(1))",
      "![mark](/icon.svg)",
    ].join("\n\n");
    await postRemark(reviewer, id, body);
    const res = await reviewer.fetch(`/proposals/${id}/review`);
    const html = await res.text();
    expect(res.status).toBe(200);
    const sources = imgSources(html);
    expect(sources.filter((src) => src.includes("tracker.example") && !/^\/%/.test(src))).toEqual([]);
    expect(sources.some((src) => /^(https?:)?\/\//.test(src) || src.startsWith("javascript"))).toBe(false);
    expect(sources).toContain("/icon.svg");
    expect(html).toContain("remote (image at tracker.example, not loaded)");
  });

  it("renders an edited remark's new text once; the audit trail keeps the previous one", async () => {
    const { id, reviewer } = await underReview();
    const remarkId = await postRemark(reviewer, id, "First: $E_g = 1.1$ eV");
    const edited = `Second:\n\n${MACRO_BOMB}`.trim();
    const res = await reviewer.json(`/api/remarks/${remarkId}`, "PATCH", { version: 1, body: edited });
    expect(res.status).toBe(200);
    expect(await storedHtml(edited)).toContain(TOO_LARGE);
    const html = await (await reviewer.fetch(`/proposals/${id}/review`)).text();
    expect(html).toContain("Second:");
    expect(html).not.toContain("First:");
    const edits = (await db.select().from(auditEvents).where(eq(auditEvents.subjectId, id))).filter((e) => e.action === "remark.edited");
    expect(edits[0]).toMatchObject({ before: { remarkId, body: "First: $E_g = 1.1$ eV" }, after: { body: edited } });
  });

  it("bounds verdict summaries and rationales too, posted through their routes", async () => {
    const world = await createBoardWorld();
    const author = await sessionFor(world.author);
    const rationale = `Rationale:\n\n${MACRO_BOMB}`.trim();
    const created = await author.json("/api/proposals", "POST", { familySlug: world.familySlug, baseReleaseId: world.releaseId, title: "Bounded rationale", rationale });
    expect(created.status).toBe(201);
    const { proposalId } = (await created.json()) as { proposalId: string };
    expect(await storedHtml(rationale)).toContain(TOO_LARGE);

    const { id, reviewer } = await underReview();
    const summary = `Verdict:\n\n${MACRO_BOMB}`.trim();
    const verdict = await reviewer.json(`/api/proposals/${id}/verdicts`, "POST", { verdict: "minor_revision", summary });
    expect(verdict.status).toBe(201);
    expect(await storedHtml(summary)).toContain(TOO_LARGE);

    const page = await (await author.fetch(`/proposals/${proposalId}`)).text();
    expect(page).toContain("Rationale:");
    expect(page).toContain(TOO_LARGE);
    const review = await (await reviewer.fetch(`/proposals/${id}`)).text();
    expect(review).toContain("Verdict:");
    expect(review).toContain(TOO_LARGE);
  });

  it("bounds a release changelog on the release page", async () => {
    const { world, proposalId } = await acceptedProposal();
    const changelog = `Changelog:\n\n${MACRO_BOMB}`.trim();
    await releaseProposal(world.curator, { proposalId, version: await versionOf(proposalId), releaseVersion: "1.1.0", changelog });
    expect(await storedHtml(changelog)).toContain(TOO_LARGE);
    const reader = await sessionFor(world.stranger);
    const res = await reader.fetch(`/registry/${world.familySlug}/1.1.0`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain("Changelog:");
    expect(html).toContain(TOO_LARGE);
  });

  it("renders a text stored before HTML was kept on its first view, stores it, and reads it back after", async () => {
    const { world, id, reviewer } = await underReview();
    const [latest] = await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.proposalId, id));
    const body = `Written before ${Date.now()}, with $x$:\n\n${MACRO_BOMB}`.trim();
    await db.insert(remarks).values({ proposalId: id, revisionId: latest.id, authorId: world.reviewers[0].id, body });
    expect(await storedHtml(body)).toBeNull();
    const first = await (await reviewer.fetch(`/proposals/${id}/review`)).text();
    expect(first).toContain("Written before ");
    expect(first).toContain(TOO_LARGE);
    const stored = await storedHtml(body);
    expect(stored).toContain(TOO_LARGE);
    const second = await (await reviewer.fetch(`/proposals/${id}/review`)).text();
    expect(second).toContain(stored!);
  });
});
