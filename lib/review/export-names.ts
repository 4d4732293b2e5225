/** File stem for a proposal's downloads: lower-case ASCII words joined by hyphens, e.g. "refit-ga-as-sp-sigma". */
export function proposalSlug(title: string): string {
  const slug = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return slug || "proposal";
}

export type BandExportKind = "svg" | "png" | "csv";

export function bandExportName(slug: string, kind: BandExportKind): string {
  return `${proposalSlug(slug)}-bands.${kind}`;
}
