import { eq } from "drizzle-orm";
import { moveProposal, assignReviewer, createProposal, giveVerdict, saveRevision } from "@/board/service";
import { notifications } from "@/board/notify";
import type { Stage } from "@/board/stages";
import type { SessionUser } from "@/lib/auth/session-user";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { getParameter, setParameters } from "@/lib/tb/parameters";
import { db } from "../client";
import { attachDemoReference, demoRefit } from "./demo-fits";
import { proposals, releases, users } from "../schema";

/**
 * Demo proposals in every stage of every family, created through the same use-cases and rules as the app
 * (so the demo itself passes the gate). All values are invented.
 */
const CHANGES: Record<string, [string, number][]> = {
  "sp-chain": [
    ["shell/A-A/1/sp_sigma", 1.03],
    ["shell/A-A/1/ss_sigma", 1.04],
    ["shell/A-A/1/pp_sigma", 0.97],
    ["onsite/A/pz", 1.05],
    ["shell/A-A/1/sp_sigma", 0.96],
    ["onsite/A/s", 1.02],
    ["shell/A-A/1/pp_sigma", 1.05],
    ["shell/A-A/1/ss_sigma", 0.95],
  ],
  "honeycomb-pz": [
    ["shell/C-C/1/pp_pi", 1.02],
    ["shell/C-C/1/pp_pi", 0.97],
    ["shell/C-C/1/pp_pi", 1.04],
    ["shell/C-C/1/pp_pi", 0.99],
    ["shell/C-C/1/pp_pi", 1.01],
    ["shell/C-C/1/pp_pi", 0.98],
    ["shell/C-C/1/pp_pi", 1.03],
    ["shell/C-C/1/pp_pi", 0.96],
  ],
  "diamond-sp3s": [
    ["shell/X-X/1/sp_sigma", 1.02],
    ["shell/X-X/1/pp_pi", 1.04],
    ["onsite/X/s*", 0.98],
    ["shell/X-X/1/pp_sigma", 0.98],
    ["shell/X-X/1/s*p_sigma", 1.03],
    ["onsite/X/px", 1.01],
    ["shell/X-X/1/ss_sigma", 1.03],
    ["shell/X-X/1/sp_sigma", 0.98],
  ],
};

/** Proposals that get invented reference bands (and, in revision, a finished refit) so a refit can be tried at once. */
const REFERENCE_STAGES: Stage[] = ["draft", "submitted", "revision"];

const STAGE_ORDER: Stage[] = ["draft", "submitted", "under_review", "revision", "accepted", "released", "declined", "withdrawn"];

const TITLES: Record<Stage, string> = {
  draft: "Explore a stiffer bond",
  submitted: "Refit against new reference bands",
  under_review: "Correct the band width near the zone edge",
  revision: "Adjust the conduction-band curvature",
  accepted: "Tune the gap to the reference",
  released: "Move the upper band down",
  declined: "Trade bandwidth for a closer gap",
  withdrawn: "Trial: soften the s–p coupling",
};

function proposedDocument(base: ModelDocument, key: string, factor: number): ModelDocument {
  const value = Math.round(getParameter(base, key) * factor * 1000) / 1000;
  const doc = setParameters(base, { [key]: value });
  return {
    ...doc,
    provenance: {
      ...doc.provenance,
      referenceCode: "none (invented demo values)",
      functional: "not applicable: invented demo values",
      kMesh: "not applicable: invented demo values",
      citations: { ...doc.provenance.citations, [key]: `invented demo change: ×${factor} of the released value` },
    },
  };
}

async function person(email: string): Promise<SessionUser> {
  const [row] = await db.select({ id: users.id, email: users.email, name: users.name, roles: users.roles }).from(users).where(eq(users.email, email));
  if (!row) throw new Error(`demo person ${email} is missing`);
  return row;
}

async function versionOf(id: string): Promise<number> {
  const [row] = await db.select({ version: proposals.version }).from(proposals).where(eq(proposals.id, id));
  return row.version;
}

async function walkTo(target: Stage, ids: { proposalId: string }, people: Record<string, SessionUser>, familyId: string, doc: ModelDocument): Promise<void> {
  const { author, curator, reviewerA, reviewerB } = people;
  const move = async (actor: SessionUser, to: Stage, reason?: string) =>
    moveProposal(actor, { proposalId: ids.proposalId, version: await versionOf(ids.proposalId), to, reason });
  if (target === "draft") return;
  if (target === "withdrawn") return void (await move(author, "withdrawn"));
  await move(author, "submitted");
  if (target === "submitted") return;
  if (target === "declined") return void (await move(curator, "declined", "Demo: the gap improves but the valence bandwidth drifts outside the family's tolerance."));
  for (const reviewer of [reviewerA, reviewerB]) {
    await assignReviewer(curator, { proposalId: ids.proposalId, version: await versionOf(ids.proposalId), reviewerId: reviewer.id });
  }
  await move(curator, "under_review");
  if (target === "under_review") {
    await giveVerdict(reviewerA, { proposalId: ids.proposalId, verdict: "minor_revision", summary: "Demo: please cite the reference for the changed integral." });
    return;
  }
  if (target === "revision") {
    await giveVerdict(reviewerA, { proposalId: ids.proposalId, verdict: "major_revision", summary: "Demo: the change moves the band edge more than the rationale says." });
    return void (await move(curator, "revision", "Demo: answer the reviewer's remark on the band edge."));
  }
  for (const reviewer of [reviewerA, reviewerB]) {
    await giveVerdict(reviewer, { proposalId: ids.proposalId, verdict: "accept", summary: "Demo: the parameter change and its band shifts are as described." });
  }
  await move(curator, "accepted");
  if (target === "accepted") return;
  await db.transaction(async (tx) => {
    const [release] = await tx
      .insert(releases)
      .values({ familyId, version: "1.1.0", document: doc, sha256: documentHash(doc), physicsHash: physicsHash(doc), changelog: "Demo: one parameter adjusted (invented values).", proposalId: ids.proposalId, releasedBy: curator.id })
      .returning({ id: releases.id });
    await moveProposal(curator, { proposalId: ids.proposalId, version: await versionOf(ids.proposalId), to: "released", reason: `released as ${release.id}` }, { viaRelease: true, tx });
  });
}

export async function seedDemoProposals(families: { id: string; slug: string }[]): Promise<number> {
  // The demo's people are invented; nobody is told about its workflow steps.
  notifications.enabled = false;
  const people = {
    author: await person("noor.haddad@meridian.example"),
    curator: await person("akira.sato@meridian.example"),
    reviewerA: await person("tomasz.wierzbicki@meridian.example"),
    reviewerB: await person("ines.carvalho@meridian.example"),
  };
  let created = 0;
  for (const family of families) {
    const [base] = await db.select().from(releases).where(eq(releases.familyId, family.id)).orderBy(releases.createdAt).limit(1);
    const baseDoc = parseModelDocument(base.document);
    for (const [i, stage] of STAGE_ORDER.entries()) {
      const [key, factor] = CHANGES[family.slug][i];
      const ids = await createProposal(people.author, {
        familySlug: family.slug,
        baseReleaseId: base.id,
        title: `${TITLES[stage]} (demo)`,
        rationale: `Invented demo proposal: scale \`${key}\` by ${factor}. The change in the band energy is $\\Delta E \\approx \\frac{\\partial E}{\\partial p}\\,\\Delta p$.`,
      });
      const doc = proposedDocument(baseDoc, key, factor);
      await saveRevision(people.author, { proposalId: ids.proposalId, version: await versionOf(ids.proposalId), document: doc, note: `scale ${key} by ${factor}` });
      const referenceId = REFERENCE_STAGES.includes(stage) ? await attachDemoReference(people.author, ids.proposalId, doc, family.slug, created + 1) : null;
      await walkTo(stage, ids, people, family.id, doc);
      if (stage === "revision" && referenceId) await demoRefit(people.author, ids.proposalId, referenceId, family.slug);
      created++;
    }
  }
  return created;
}
