import "server-only";
import { z } from "zod";
import { db } from "@/db/client";
import { AppError } from "@/lib/errors";
import { NUL_MESSAGE, withoutNul } from "@/lib/pg-text";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { getFamilyIdentity, getReleaseById, getReleaseDocument, getReleaseMeta } from "./queries";
import { rateHeaders, type RateDecision } from "./rate-limit";
import { releaseStatus } from "./status";

/** Loading steps shared by the v1 route handlers; anything unknown is a 404 with a JSON error, a NUL a 400. */
const familyParams = z.object({ slug: withoutNul(z.string().min(1).max(200)) });
const releaseParams = familyParams.extend({ version: z.string().regex(/^(latest|\d{1,6}\.\d{1,6}\.\d{1,6})$/) });

function refuseNulParam(error: z.ZodError): void {
  if (error.issues.some((i) => i.message === NUL_MESSAGE)) throw new AppError("invalid:slug", `The family in the address is not usable: ${NUL_MESSAGE}`);
}

export function parseFamilyParams(raw: unknown): { slug: string } {
  const parsed = familyParams.safeParse(raw);
  if (!parsed.success) {
    refuseNulParam(parsed.error);
    throw new AppError("not-found:family", "Unknown model family.");
  }
  return parsed.data;
}

export function parseReleaseParams(raw: unknown): { slug: string; version: string } {
  const parsed = releaseParams.safeParse(raw);
  if (!parsed.success) {
    refuseNulParam(parsed.error);
    throw new AppError("not-found:release", "Unknown release version (use MAJOR.MINOR.PATCH or latest).");
  }
  return parsed.data;
}

export async function loadFamily(slug: string) {
  const family = await getFamilyIdentity(db, slug);
  if (!family) throw new AppError("not-found:family", `Unknown model family "${slug}".`);
  return family;
}

export async function loadRelease(slug: string, version: string) {
  const family = await loadFamily(slug);
  const release = await getReleaseMeta(db, family.id, version);
  if (!release) throw new AppError("not-found:release", version === "latest" ? `Family "${slug}" has no current release.` : `Family "${slug}" has no release ${version}.`);
  return { family, release };
}

export async function loadDocument(releaseId: string): Promise<ModelDocument> {
  return parseModelDocument(await getReleaseDocument(db, releaseId));
}

type Release = Awaited<ReturnType<typeof loadRelease>>["release"];

export function releasePath(slug: string, version: string): string {
  return `/api/v1/families/${encodeURIComponent(slug)}/releases/${encodeURIComponent(version)}`;
}

export async function releaseDto(slug: string, r: Release) {
  const successor = r.successorId ? await getReleaseById(db, r.successorId) : null;
  const self = releasePath(slug, r.version);
  return {
    family: slug,
    version: r.version,
    sha256: r.sha256,
    physicsHash: r.physicsHash,
    releasedAt: r.createdAt.toISOString(),
    status: releaseStatus(r),
    changelog: r.changelog,
    deprecation: r.deprecatedAt ? { at: r.deprecatedAt.toISOString(), reason: r.deprecationReason, successor: successor?.version ?? null } : null,
    withdrawal: r.withdrawnAt ? { at: r.withdrawnAt.toISOString(), reason: r.withdrawalReason } : null,
    links: { self, document: `${self}/document`, hoppings: `${self}/hoppings`, bands: `${self}/bands` },
  };
}

/** Response headers every authenticated answer carries. */
export function apiHeaders(rate: RateDecision, extra: Record<string, string> = {}): Headers {
  return new Headers({ "Cache-Control": "private, no-cache", ...rateHeaders(rate), ...extra });
}
