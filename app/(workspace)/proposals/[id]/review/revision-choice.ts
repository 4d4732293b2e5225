import { parseDocument } from "@/board/revision-facts";
import type { ModelDocument } from "@/lib/tb/document";

/** "base" or "r<number>" from the URL, resolved to a document and a label for the diff. */
export interface DiffSide {
  value: string;
  label: string;
  doc: ModelDocument | null;
}

export function parseSide(raw: string | undefined, fallback: string): string {
  return raw && /^(base|r\d{1,6})$/.test(raw) ? raw : fallback;
}

export async function resolveSide(
  value: string,
  baseDoc: ModelDocument | null,
  baseVersion: string | null,
  load: (n: number) => Promise<{ document: unknown } | null>,
): Promise<DiffSide> {
  if (value === "base") return { value, label: baseVersion ? `release ${baseVersion}` : "no base release", doc: baseDoc };
  const row = await load(Number(value.slice(1)));
  const parsed = row ? parseDocument(row.document) : null;
  return { value, label: `revision ${value.slice(1)}`, doc: parsed && parsed.ok ? parsed.doc : null };
}
