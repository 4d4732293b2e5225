/** How to cite a release: family, version, checksum, date and the address it can be pulled from. */
export function releaseCitation(input: { familyTitle: string; familySlug: string; version: string; sha256: string; releasedAt: Date; url: string }): string {
  const date = input.releasedAt.toISOString().slice(0, 10);
  return `${input.familyTitle} (${input.familySlug}), tight-binding model release ${input.version}, Bandgate registry, released ${date}; sha256 ${input.sha256}. ${input.url}`;
}
