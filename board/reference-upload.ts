import "server-only";
import { db } from "@/db/client";
import { referenceBandSets } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { runEngine } from "@/lib/engine-pool/engine";
import { AppError } from "@/lib/errors";
import { REFERENCE_PROVENANCE_SCHEMA, type ReferenceIssue } from "@/lib/reference-bands";
import { REFERENCE_MAX_BYTES, REFERENCE_TOO_LARGE, utf8Length } from "@/lib/size-limits";
import { DEFAULT_PATH_POINTS } from "@/lib/tb/kpath";
import { getLatestRevision, lockProposal } from "./queries";
import { parseDocument } from "./revision-facts";
import { getProposalForRevision } from "./revision-intake";
import { decideRevise } from "./rules";

export interface ReferenceUpload {
  proposalId: string;
  name: string;
  fileName: string;
  content: string;
  provenance: unknown;
}

function refused(issues: ReferenceIssue[]): AppError {
  const lines = issues.map((i) => i.message);
  return new AppError("invalid:reference", `The reference file was not stored: ${lines.slice(0, 3).join("; ")}${lines.length > 3 ? `; and ${lines.length - 3} more` : ""}`, { file: lines });
}

function mayRevise(actor: SessionUser, proposal: Parameters<typeof decideRevise>[1]): void {
  const decision = decideRevise(actor, proposal);
  if (!decision.allowed) throw new AppError(decision.code, decision.reasons.join(" "));
}

/**
 * Store reference bands for a proposal: parsed, resolved onto the latest revision's default path and checksummed
 * first (on an engine thread, before the proposal is locked); a file with any problem stores nothing.
 */
export async function uploadReferenceBands(actor: SessionUser, input: ReferenceUpload): Promise<{ referenceId: string }> {
  const size = utf8Length(input.content);
  if (size > REFERENCE_MAX_BYTES) throw new AppError("too-large:reference", REFERENCE_TOO_LARGE, { file: [REFERENCE_TOO_LARGE] }, { bytes: size, limitBytes: REFERENCE_MAX_BYTES });
  if (size === 0) throw new AppError("invalid:reference", "The file is empty.", { file: ["The file is empty."] });
  const provenance = REFERENCE_PROVENANCE_SCHEMA.safeParse(input.provenance);
  if (!provenance.success) {
    const fieldErrors: Record<string, string[]> = {};
    for (const issue of provenance.error.issues) (fieldErrors[String(issue.path[0] ?? "provenance")] ??= []).push(issue.message);
    throw new AppError("invalid:provenance", "The reference bands need their provenance.", fieldErrors);
  }
  mayRevise(actor, await getProposalForRevision(input.proposalId));
  const latest = await getLatestRevision(db, input.proposalId);
  const doc = latest ? parseDocument(latest.document) : null;
  if (!doc || !doc.ok) throw new AppError("invalid:document", "Save a valid model document before attaching reference bands.");
  const pointsTotal = doc.doc.kPath.pointsTotal ?? DEFAULT_PATH_POINTS;
  const checked = await runEngine("referenceBands", input.fileName, input.content, doc.doc, pointsTotal);
  if (!checked.ok) throw refused(checked.issues);
  const { parsed, sha256 } = checked;
  return db.transaction(async (tx) => {
    const proposal = await lockProposal(tx, input.proposalId);
    if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
    mayRevise(actor, proposal);
    if ((await getLatestRevision(tx, proposal.id))?.id !== latest?.id) {
      throw new AppError("conflict:stale", "A new revision was saved while the file was checked against the latest one. Upload it again.");
    }
    const [row] = await tx
      .insert(referenceBandSets)
      .values({
        proposalId: proposal.id,
        name: input.name,
        fileName: input.fileName,
        content: input.content,
        sizeBytes: size,
        sha256,
        parsed: { ...parsed, pointsTotal },
        provenance: provenance.data,
        uploadedBy: actor.id,
      })
      .returning({ id: referenceBandSets.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "proposal.reference-uploaded",
      subjectType: "proposal",
      subjectId: proposal.id,
      after: { referenceId: row.id, fileName: input.fileName, points: parsed.pointCount, bands: parsed.bandCount },
    });
    return { referenceId: row.id };
  });
}
