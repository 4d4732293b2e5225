import "server-only";
import { db } from "@/db/client";
import { referenceBandSets } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { parseReferenceBands, referenceChecksum, REFERENCE_LIMITS, REFERENCE_PROVENANCE_SCHEMA, resolveReferenceBands, ReferenceBandsError } from "@/lib/reference-bands";
import { DEFAULT_PATH_POINTS } from "@/lib/tb/kpath";
import { getLatestRevision, lockProposal } from "./queries";
import { parseDocument } from "./revision-facts";
import { decideRevise } from "./rules";

export interface ReferenceUpload {
  proposalId: string;
  name: string;
  fileName: string;
  content: string;
  provenance: unknown;
}

function refused(err: ReferenceBandsError): AppError {
  const lines = err.issues.map((i) => i.message);
  return new AppError("invalid:reference", `The reference file was not stored: ${lines.slice(0, 3).join("; ")}${lines.length > 3 ? `; and ${lines.length - 3} more` : ""}`, { file: lines });
}

/**
 * Store reference bands for a proposal: parsed, resolved onto the latest revision's default path and checksummed
 * first; a file with any problem stores nothing.
 */
export async function uploadReferenceBands(actor: SessionUser, input: ReferenceUpload): Promise<{ referenceId: string }> {
  const size = new TextEncoder().encode(input.content).length;
  if (size > REFERENCE_LIMITS.maxBytes) throw new AppError("invalid:reference", `The file is ${(size / 1048576).toFixed(1)} MiB; the limit is ${REFERENCE_LIMITS.maxBytes / 1048576} MiB.`);
  if (size === 0) throw new AppError("invalid:reference", "The file is empty.", { file: ["The file is empty."] });
  const provenance = REFERENCE_PROVENANCE_SCHEMA.safeParse(input.provenance);
  if (!provenance.success) {
    const fieldErrors: Record<string, string[]> = {};
    for (const issue of provenance.error.issues) (fieldErrors[String(issue.path[0] ?? "provenance")] ??= []).push(issue.message);
    throw new AppError("invalid:provenance", "The reference bands need their provenance.", fieldErrors);
  }
  return db.transaction(async (tx) => {
    const proposal = await lockProposal(tx, input.proposalId);
    if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
    const decision = decideRevise(actor, proposal);
    if (!decision.allowed) throw new AppError(decision.code, decision.reasons.join(" "));
    const latest = await getLatestRevision(tx, proposal.id);
    const doc = latest ? parseDocument(latest.document) : null;
    if (!doc || !doc.ok) throw new AppError("invalid:document", "Save a valid model document before attaching reference bands.");
    const pointsTotal = doc.doc.kPath.pointsTotal ?? DEFAULT_PATH_POINTS;
    let parsed;
    try {
      parsed = parseReferenceBands(input.fileName, input.content);
      resolveReferenceBands(doc.doc, parsed, pointsTotal);
    } catch (err) {
      if (err instanceof ReferenceBandsError) throw refused(err);
      throw err;
    }
    const [row] = await tx
      .insert(referenceBandSets)
      .values({
        proposalId: proposal.id,
        name: input.name,
        fileName: input.fileName,
        content: input.content,
        sizeBytes: size,
        sha256: referenceChecksum(input.content),
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
