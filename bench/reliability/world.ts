import { eq } from "drizzle-orm";
import { uploadReferenceBands } from "@/board/reference-upload";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { createApiToken } from "@/lib/registry/token-service";
import { addWebhook } from "@/lib/registry/subscription-service";
import { createFitWorld, diamondDocument, DIAMOND_START, proposalToFit, syntheticReference } from "@/tests/integration/fit-world";
import { acceptedProposal } from "@/tests/integration/registry-world";
import { createBoardWorld, draftProposal, type BoardWorld } from "@/tests/support/board-fixtures";
import { createPerson } from "@/tests/support/people";

export const HOOKS_PER_FAMILY = 16;
export const HOOK_SECRET = "reliability-webhook-secret";
/** k-points of the refits that get interrupted: long enough (several seconds per start) to be caught running. */
export const FIT_POINTS = 2500;

export interface ReleaseScene {
  board: BoardWorld;
  proposalId: string;
  subscriptionIds: string[];
}

export type World = Awaited<ReturnType<typeof seedWorld>>;

/** One family with `HOOKS_PER_FAMILY` webhook subscribers (one each) and an accepted proposal ready to release. */
async function releaseScene(hookBase: string): Promise<ReleaseScene> {
  const { world, proposalId } = await acceptedProposal();
  const subscriptionIds: string[] = [];
  for (let i = 0; i < HOOKS_PER_FAMILY; i++) {
    const person = await createPerson(["consumer"], `hook${i}`);
    const { id } = await addWebhook(person, { familySlug: world.familySlug, url: `${hookBase}/hook/${i}`, secret: HOOK_SECRET });
    subscriptionIds.push(id);
  }
  return { board: world, proposalId, subscriptionIds };
}

/** Everything the figures need, made with the test fixtures and the app's own services. */
export async function seedWorld(hookBase: string) {
  const board = await createBoardWorld();
  const load = await createApiToken(board.stranger, { name: "reliability load" });
  const wide = await createApiToken(board.stranger, { name: "reliability wide" });
  // Raised far above what the harness sends, so the PostgreSQL restart and bad queries never meet the rate limit.
  await db.update(apiTokens).set({ requestsPerMinute: 1_000_000_000 }).where(eq(apiTokens.id, wide.id));

  const queries = await draftProposal(board);
  await uploadReferenceBands(board.author, {
    proposalId: queries,
    name: "reference for queries",
    fileName: "reference.json",
    content: syntheticReference(board.base, 0.002, 21),
    provenance: { method: "synthetic", code: "reliability harness", structureSource: "the model's own lattice" },
  });
  const proposals = { revisions: await draftProposal(board), remarks: await draftProposal(board), uploads: await draftProposal(board), creations: board.familySlug, queries };

  const diamond = diamondDocument();
  const fitWorld = await createFitWorld(diamond);
  const reference = syntheticReference(diamond, 0.003, 9, FIT_POINTS);
  const fits = [await proposalToFit(fitWorld, diamond, DIAMOND_START, reference, FIT_POINTS), await proposalToFit(fitWorld, diamond, DIAMOND_START, reference, FIT_POINTS)];

  return {
    board,
    tokens: { load: load.token, wide: wide.token },
    documentPath: `/api/v1/families/${board.familySlug}/releases/1.0.0/document`,
    proposals,
    fit: { world: fitWorld, runs: fits },
    scenes: { kill: await releaseScene(hookBase), term: await releaseScene(hookBase), restart: await releaseScene(hookBase) },
  };
}
